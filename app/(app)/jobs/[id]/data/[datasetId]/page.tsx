import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { DeleteDatasetButton } from "@/components/datasets/delete-button";
import { EvaluationTable } from "@/components/datasets/evaluation-table";
import { DECISION_RULE_MEANINGS } from "@/lib/domain/decisions";
import { KIND_LABELS, PHASE_LABELS } from "@/components/datasets/kinds";
import { Table } from "@/components/ui/table";
import { Card, Facts } from "@/components/ui/card";
import { getTestPartEvaluation } from "@/db/queries/datasets";
import { getJobDetail } from "@/db/queries/jobs";
import { positioningTestOf } from "@/db/queries/positioning";
import { PositioningTestBlock } from "@/components/report/positioning-section";
import { positioningSection } from "@/lib/report/sections/positioning";
import { datasetDeleteRefusal } from "@/lib/policy/datasets";
import { requirePageUser } from "@/lib/auth/session";
import { formatDateTimeUtc } from "@/lib/format";
import { pageUuid } from "@/lib/domain/uuid";
import { HEAD_AXIS_ROLE_WORDS, type HeadAxisRole } from "@/lib/domain/positioning";

export const metadata: Metadata = { title: "Dataset" };

type Props = {
  params: Promise<{ id: string; datasetId: string }>;
  searchParams: Promise<{ page?: string }>;
};

/** Rows of the evaluation shown per page: a file of many thousand features stays a light page. */
const ROWS_PER_PAGE = 100;

const UNIT_WORDS: Record<string, string> = { mm: "mm", in: "inch", um: "µm" };

function unitsText(units: Record<string, unknown>): string {
  const parts: string[] = [];
  if (units.units) parts.push(`x, y, z in ${UNIT_WORDS[String(units.units)]}`);
  if (units.travel_units) parts.push(`travel in ${UNIT_WORDS[String(units.travel_units)]}`);
  if (units.reading_units) parts.push(`readings in ${UNIT_WORDS[String(units.reading_units)]}`);
  if (units.radius_mm !== undefined) parts.push(`sweep radius ${Number(units.radius_mm)} mm`);
  if (units.uncertainty_mm !== undefined) parts.push(`U = ${Number(units.uncertainty_mm)} mm (k = 2)`);
  if (units.axis) parts.push(`angles in degrees, ${HEAD_AXIS_ROLE_WORDS[units.axis as HeadAxisRole]}`);
  if (units.uncertainty_arcsec !== undefined) parts.push(`U = ${Number(units.uncertainty_arcsec)}″ (k = 2)`);
  return parts.join(" · ") || "as written in each row (mm unless the row says otherwise)";
}

function num(v: unknown, digits: number, unit: string): string {
  return typeof v === "number" && Number.isFinite(v) ? `${v.toFixed(digits)} ${unit}` : "—";
}

export default async function DatasetPage({ params, searchParams }: Props) {
  const { id: rawId, datasetId: rawDatasetId } = await params;
  const [id, datasetId] = [pageUuid(rawId), pageUuid(rawDatasetId)];
  const user = await requirePageUser(`/jobs/${id}/data/${datasetId}`);
  const found = await getTestPartEvaluation(user, datasetId);
  if (!found || found.detail.dataset.jobId !== id) notFound();
  const { detail, evaluation: whole } = found;
  const pages = Math.max(1, Math.ceil((whole?.rows.length ?? 0) / ROWS_PER_PAGE));
  const requested = Number((await searchParams)?.page ?? 1);
  const page = Number.isInteger(requested) ? Math.min(Math.max(requested, 1), pages) : 1;
  const evaluation = whole
    ? { ...whole, rows: whole.rows.slice((page - 1) * ROWS_PER_PAGE, page * ROWS_PER_PAGE) }
    : null;
  const ds = detail.dataset;
  const summary = (ds.summary ?? {}) as {
    tram?: Record<string, number> | null;
    sweep?: Record<string, number | null> | null;
    columns?: Record<string, { unit: string; min: number; max: number }>;
  };
  const mayDelete = ds.status === "stored" && datasetDeleteRefusal(user, detail.job) === null;
  const job = ds.kind === "rotary_positioning" ? await getJobDetail(user, id) : null;
  const positioning = job
    ? positioningSection(
        [
          await positioningTestOf(job, {
            id: ds.id,
            filename: ds.originalFilename,
            phase: ds.phase,
            uploadedAt: ds.uploadedAt,
            units: ds.units,
            summary: ds.summary,
          }),
        ],
        job.job.decisionRule,
      )[0]
    : undefined;

  return (
    <div className="space-y-6">
      <nav aria-label="Back" className="text-sm">
        <Link href={`/jobs/${id}/data`} className="text-graphite-600 hover:text-graphite-900 hover:underline">
          ← All data of this job
        </Link>
      </nav>
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <h2 className="text-xl font-semibold">
            {KIND_LABELS[ds.kind]} · {PHASE_LABELS[ds.phase]}
          </h2>
          <p className="text-sm text-graphite-600">
            {ds.status === "deleted"
              ? `Deleted ${formatDateTimeUtc(ds.deletedAt)} — kept for the record, no longer counted.`
              : "Stored and checked on the server."}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <a
            href={`/api/datasets/${ds.id}/file`}
            className="flex min-h-touch items-center rounded-lg border border-graphite-300 bg-white px-4 text-sm font-semibold hover:bg-graphite-100"
          >
            Download the original
          </a>
          {evaluation ? (
            <a
              href={`/api/datasets/${ds.id}/evaluation?format=csv`}
              className="flex min-h-touch items-center rounded-lg border border-graphite-300 bg-white px-4 text-sm font-semibold hover:bg-graphite-100"
            >
              Export results (CSV)
            </a>
          ) : null}
        </div>
      </div>

      {evaluation ? (
        <section aria-labelledby="evaluation-title" className="space-y-3">
          <h3 id="evaluation-title" className="text-base font-semibold">
            Feature evaluation
          </h3>
          <p
            className="rounded-card border-l-4 border-nominal-500 bg-nominal-100/60 p-3 text-sm text-graphite-900"
            data-testid="decision-rule"
          >
            <span className="font-semibold">
              Decision rule of this job —{" "}
              {detail.job.decisionRule === "guarded" ? "guarded acceptance" : "simple acceptance"}.
            </span>{" "}
            {DECISION_RULE_MEANINGS[detail.job.decisionRule]}
          </p>
          {evaluation.warnings.length > 0 ? (
            <p className="text-sm text-accent-800">{evaluation.warnings.join(" ")}</p>
          ) : null}
          <EvaluationTable result={evaluation} />
          {pages > 1 ? (
            <nav
              aria-label="Evaluation pages"
              className="flex items-center gap-3 text-sm"
              data-testid="row-pages"
            >
              {page > 1 ? (
                <Link href={`?page=${page - 1}`} className="text-accent-700 underline">
                  Previous {ROWS_PER_PAGE}
                </Link>
              ) : null}
              <span className="text-graphite-700">
                Rows {(page - 1) * ROWS_PER_PAGE + 1}–{Math.min(page * ROWS_PER_PAGE, whole!.rows.length)} of{" "}
                {whole!.rows.length} (page {page} of {pages})
              </span>
              {page < pages ? (
                <Link href={`?page=${page + 1}`} className="text-accent-700 underline">
                  Next {ROWS_PER_PAGE}
                </Link>
              ) : null}
            </nav>
          ) : null}
        </section>
      ) : null}

      {positioning ? (
        <section aria-labelledby="positioning-title" className="space-y-3">
          <h3 id="positioning-title" className="text-base font-semibold">
            Positioning of the {positioning.axis} (ISO 230-2)
          </h3>
          <PositioningTestBlock test={positioning} />
          <p className="text-sm text-graphite-700">
            Limits come from the job&apos;s procedure version; a quantity without a limit is recorded, not
            judged. Move the axis at reduced speed with the guards closed while the test runs, and follow the
            machine builder&apos;s manual for the test cycle.
          </p>
        </section>
      ) : null}

      <div className="grid gap-6 lg:grid-cols-2">
        <Card title="The file">
          <Facts
            items={[
              { label: "File name", value: ds.originalFilename },
              { label: "Size", value: `${(ds.sizeBytes / 1024).toFixed(1)} KiB`, mono: true },
              { label: "SHA-256", value: <span className="break-all">{ds.sha256}</span>, mono: true },
              { label: "Rows", value: ds.rows.toLocaleString("en-GB"), mono: true },
              { label: "Units", value: unitsText(ds.units as Record<string, unknown>) },
              {
                label: "Uploaded",
                value: `${formatDateTimeUtc(ds.uploadedAt)} by ${detail.uploaderName ?? "—"}`,
              },
            ]}
          />
        </Card>
        <Card title="What was read">
          {summary.tram ? (
            <Facts
              items={[
                {
                  label: "Slope",
                  value: `${num(summary.tram.slope_um_per_m, 1, "µm/m")} ± ${num(summary.tram.slope_u_um_per_m, 1, "µm/m")} (1 s)`,
                  mono: true,
                },
                { label: "Angle", value: num(summary.tram.angle_arcsec, 1, "″"), mono: true },
                { label: "Straightness", value: num(summary.tram.straightness_um, 1, "µm"), mono: true },
                { label: "TIR", value: num(summary.tram.tir_um, 1, "µm"), mono: true },
              ]}
            />
          ) : null}
          {summary.sweep ? (
            <Facts
              items={[
                {
                  label: "Tilt",
                  value: `${num(summary.sweep.tilt_um_per_m, 1, "µm/m")} (${num(summary.sweep.tilt_arcsec, 1, "″")})`,
                  mono: true,
                },
                { label: "High side at", value: num(summary.sweep.direction_deg, 1, "°"), mono: true },
                { label: "TIR", value: num(summary.sweep.tir_um, 1, "µm"), mono: true },
                {
                  label: "Flatness (least squares)",
                  value: num(summary.sweep.flatness_ls_um, 1, "µm"),
                  mono: true,
                },
              ]}
            />
          ) : null}
          {summary.columns && Object.keys(summary.columns).length > 0 ? (
            <Table
              caption="Range of each stored column"
              empty={null}
              bare
              className="mt-3"
              data={Object.entries(summary.columns).map(([name, c]) => ({ name, ...c }))}
              getRowId={(c) => c.name}
              columns={(column) => [
                column("Stored column", (c) => c.name, { className: "num" }),
                column("From", (c) => c.min.toFixed(4), { numeric: true }),
                column("To", (c) => c.max.toFixed(4), { numeric: true }),
                column("Unit", (c) => (c.unit === "um" ? "µm" : c.unit === "deg" ? "°" : c.unit)),
              ]}
            />
          ) : null}
          {ds.kind === "test_part" ? (
            <p className="text-sm text-graphite-700">{ds.rows} measured characteristics; judged above.</p>
          ) : null}
          {ds.warnings.length > 0 ? (
            <ul className="mt-3 list-disc space-y-1 pl-5 text-sm text-accent-800">
              {ds.warnings.slice(0, 20).map((w, i) => (
                <li key={i}>{w}</li>
              ))}
            </ul>
          ) : null}
        </Card>
      </div>
      {mayDelete ? <DeleteDatasetButton datasetId={ds.id} jobId={id} /> : null}
    </div>
  );
}
