import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { BackLink } from "@/components/ui/breadcrumb";
import { BuilderCaution } from "@/components/procedures/builder-caution";
import { ProcedureBuilder } from "@/components/procedures/procedure-builder";
import { RetireProcedureButton } from "@/components/procedures/retire-button";
import { Card } from "@/components/ui/card";
import { Table } from "@/components/ui/table";
import { headAxesByModel, jobsUsingVersion, listProcedures } from "@/db/queries/procedures";
import { getTemplate } from "@/db/queries/templates";
import { requirePageUser } from "@/lib/auth/session";
import { JOB_KIND_LABELS } from "@/lib/domain/jobs";
import { HEAD_AXIS_ROLE_WORDS } from "@/lib/domain/positioning";
import { MULTI_POINT_RESULT_LABELS, STEP_KIND_LABELS } from "@/lib/domain/procedures";
import { pageUuid } from "@/lib/domain/uuid";
import { formatDateTimeUtc } from "@/lib/format";
import { procedureEditRefusal, procedureRetireRefusal } from "@/lib/policy/procedures";
import { registerReadRefusal } from "@/lib/policy/registers";
import { LIMIT_SOURCE_LABELS } from "@/lib/domain/procedures";
import { stepInputFromRow, type StepRow } from "@/lib/validations/procedures";
import { UNIT_SYMBOL, type EntryUnit } from "@/lib/units";
import { saveProcedureVersionAction, setProcedureRetiredAction } from "../actions";
import { builderValuesFrom } from "../builder-values";

export const metadata: Metadata = { title: "Procedure" };

/** Limits as the procedure writes them, in the step's own unit: "≤ 0.0005 in", "−25 to 25″". */
function limitsText(lower: number | null | undefined, upper: number | null | undefined, unit: string | null) {
  if (lower == null && upper == null) return "—";
  const sym = unit ? UNIT_SYMBOL[unit as EntryUnit] : "";
  const u = (v: number) => `${String(v).replace(/^-/, "−")}${sym === "″" ? "″" : ` ${sym}`}`;
  if (lower != null && upper != null)
    return lower === -upper ? `± ${u(upper)}` : `${u(lower)} to ${u(upper)}`;
  return upper != null ? `≤ ${u(upper)}` : `≥ ${u(lower!)}`;
}

export default async function ProcedurePage({ params }: { params: Promise<{ id: string }> }) {
  const id = pageUuid((await params).id);
  const user = await requirePageUser(`/registers/procedures/${id}`);
  if (registerReadRefusal(user, "procedures")) notFound();
  const t = await getTemplate(user, id);
  if (!t) notFound();
  const [versions, inUse] = await Promise.all([
    listProcedures(user).then((all) => all.filter((v) => v.name === t.name)),
    jobsUsingVersion(t.id),
  ]);
  const mayEdit = procedureEditRefusal(user, t) === null && t.isCurrent;
  const mayRetire = procedureRetireRefusal(user) === null;
  const steps = t.steps.map((s) => ({ ...s, shown: stepInputFromRow(s as StepRow) }));
  return (
    <div className="space-y-6">
      <div>
        <BackLink href="/registers/procedures">Procedures</BackLink>
        <h1 className="text-2xl font-semibold">
          {t.name} <span className="text-graphite-500">· version {t.version}</span>
        </h1>
        <p className="text-sm text-graphite-600">
          {t.retiredAt ? <strong className="text-fail-700">Retired. </strong> : null}
          {t.isCurrent ? "Current version. " : "An earlier version, kept for the jobs that follow it. "}
          For{" "}
          {t.jobKinds?.length
            ? t.jobKinds
                .map((k) => JOB_KIND_LABELS[k])
                .join(", ")
                .toLowerCase()
            : "every kind of job"}
          , {t.headModel ? `head model ${t.headModel}` : "every head model"}. {inUse}{" "}
          {inUse === 1 ? "job follows" : "jobs follow"} this version. Created {formatDateTimeUtc(t.createdAt)}
          .
        </p>
        {t.description ? <p className="mt-1 text-sm">{t.description}</p> : null}
        {mayRetire ? (
          <div className="mt-3">
            <RetireProcedureButton
              id={t.id}
              retired={Boolean(t.retiredAt)}
              action={setProcedureRetiredAction}
            />
          </div>
        ) : null}
      </div>

      <Card title={`Steps of version ${t.version}`}>
        <Table
          caption={`Steps of ${t.name}, version ${t.version}`}
          empty="This version has no steps."
          bare
          data={steps}
          columns={(column) => [
            column("Step", (s) => (
              <>
                <span className="num text-graphite-500">{s.position}</span> {s.title}
                {s.photoRequired ? (
                  <span className="ml-2 rounded bg-graphite-100 px-1.5 text-xs">photo</span>
                ) : null}
                {s.safetyNote ? (
                  <span
                    className="ml-2 rounded bg-accent-50 px-1.5 text-xs text-accent-800 ring-1 ring-accent-300"
                    title={s.safetyNote}
                  >
                    caution
                  </span>
                ) : null}
              </>
            )),
            column("Kind", (s) =>
              s.derivation === "multi_point"
                ? `${MULTI_POINT_RESULT_LABELS[s.pointResult ?? "tir"]} at ${(s.points ?? []).join(" · ")}`
                : s.derivation === "record"
                  ? `${STEP_KIND_LABELS.record} (${s.recordUnit ?? ""})`
                  : STEP_KIND_LABELS[s.derivation],
            ),
            column("Limits", (s) => limitsText(s.shown.lower, s.shown.upper, s.shown.unit), {
              numeric: true,
            }),
            column("Source", (s) =>
              s.derivation === "record" || s.derivation === "note" ? "—" : LIMIT_SOURCE_LABELS[s.limitSource],
            ),
          ]}
        />
      </Card>

      <Card title="Judging the head as a whole">
        <p className="text-sm">
          {t.tcpCheckRequired
            ? "A tool-centre-point check after compensation is required before the report is issued."
            : "No tool-centre-point check is required; one that is uploaded is still judged."}{" "}
          {t.tcpRangeLimitUm != null || t.tcpDeviationLimitUm != null ? (
            <>
              Limits: range of the centre{" "}
              {t.tcpRangeLimitUm != null ? `≤ ${t.tcpRangeLimitUm} µm in X, Y and Z each` : "recorded"};
              distance from the mean centre{" "}
              {t.tcpDeviationLimitUm != null ? `≤ ${t.tcpDeviationLimitUm} µm` : "recorded"} (
              {t.tcpLimitSource ? LIMIT_SOURCE_LABELS[t.tcpLimitSource] : "source not recorded"}
              {t.tcpLimitSourceNote ? `: ${t.tcpLimitSourceNote}` : ""}).
            </>
          ) : (
            "Its figures are recorded, not judged."
          )}
        </p>
        <p className="mt-1 text-sm text-graphite-600">
          {t.parameterLimits.length} fitted head{" "}
          {t.parameterLimits.length === 1 ? "parameter has a limit" : "parameters have limits"}
          {t.parameterLimits.length ? "" : "; a head fit on a job with this version is recorded, not judged"}.
        </p>
        <p className="mt-1 text-sm text-graphite-600">
          {t.positioningLimits.length
            ? `Positioning of the rotary axes (ISO 230-2), asked for before issue: ${t.positioningLimits
                .map(
                  (l) =>
                    `${HEAD_AXIS_ROLE_WORDS[l.axis]} ${l.quantity} ≤ ${l.upperLimitArcsec}″ (${LIMIT_SOURCE_LABELS[l.limitSource]}${l.limitSourceNote ? `: ${l.limitSourceNote}` : ""})`,
                )
                .join("; ")}.`
            : "No positioning limits for the rotary axes; a positioning test that is uploaded is recorded, not judged."}
        </p>
      </Card>

      {versions.length > 1 ? (
        <Card title="Versions">
          <ul className="space-y-1 text-sm">
            {versions.map((v) => (
              <li key={v.id}>
                <Link
                  href={`/registers/procedures/${v.id}`}
                  className="underline"
                  aria-current={v.id === t.id}
                >
                  Version {v.version}
                </Link>
                {v.isCurrent ? " (current)" : ""} · {v.jobsUsing} {v.jobsUsing === 1 ? "job" : "jobs"}
              </li>
            ))}
          </ul>
        </Card>
      ) : null}

      {mayEdit ? (
        <section aria-labelledby="edit-steps" className="space-y-4">
          <h2 id="edit-steps" className="text-xl font-semibold">
            Edit the steps
          </h2>
          <p className="text-sm text-graphite-600">
            {inUse > 0
              ? `Jobs follow version ${t.version}, so saving publishes version ${versions.reduce((m, v) => Math.max(m, v.version), 0) + 1}; those jobs keep theirs.`
              : `No job follows version ${t.version} yet, so saving changes it in place.`}
          </p>
          <BuilderCaution />
          <ProcedureBuilder
            mode="version"
            procedureId={t.id}
            initial={builderValuesFrom(t)}
            submitLabel={
              inUse > 0
                ? `Publish version ${versions.reduce((m, v) => Math.max(m, v.version), 0) + 1}`
                : `Save version ${t.version}`
            }
            action={saveProcedureVersionAction}
            headAxes={await headAxesByModel()}
          />
        </section>
      ) : null}
    </div>
  );
}
