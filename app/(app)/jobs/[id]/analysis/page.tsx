import type { Metadata } from "next";
import Link from "next/link";
import { RunFitButton } from "@/components/fit/fit-buttons";
import { notFound } from "next/navigation";
import { Card } from "@/components/ui/card";
import { getApprovedAnalysis, headConfigOf, listJobAnalyses, withPoses } from "@/db/queries/analyses";
import { listJobViews } from "@/db/queries/analysis-views";
import { reportViewChoices } from "@/db/queries/report-views";
import { listDatasets } from "@/db/queries/datasets";
import { parameterLimitsOfTemplate } from "@/db/queries/parameter-limits";
import { getJobDetail } from "@/db/queries/jobs";
import { chooseShownFit, otherPhaseFit } from "@/lib/analysis/fit-view";
import { phaseText } from "@/lib/domain/datasets";
import { headFitRefusal, viewSaveRefusal } from "@/lib/policy/analyses";
import { requirePageUser } from "@/lib/auth/session";
import { formatDateTimeUtc } from "@/lib/format";
import { BudgetSection } from "./budget-section";
import { FitSection } from "./fit-section";
import { SavedViews } from "./saved-views";

export const metadata: Metadata = { title: "Analysis" };
type Props = { params: Promise<{ id: string }>; searchParams: Promise<{ analysis?: string }> };

export default async function AnalysisPage({ params, searchParams }: Props) {
  const { id } = await params;
  const { analysis: wanted } = await searchParams;
  const user = await requirePageUser(`/jobs/${id}/analysis`);
  const d = await getJobDetail(user, id);
  if (!d) notFound();
  const [all, fits, approved, limits, views] = await Promise.all([
    listDatasets(user, id),
    listJobAnalyses(user, id),
    getApprovedAnalysis(user, id),
    parameterLimitsOfTemplate(d.job.templateId),
    listJobViews(user, id),
  ]);
  const probes = (all ?? []).filter((x) => x.kind === "sphere_probe" && x.status === "stored");
  const list = fits ?? [];
  const shown = chooseShownFit(list, wanted, approved?.detail.analysis.id);
  const runRefusal = headFitRefusal(user, d.job);
  const mayRun = runRefusal === null;
  const config = headConfigOf(d.head);
  // The pre/post overlay: the latest fit of a dataset of the other phase than the one shown.
  const phaseOf = new Map((all ?? []).map((x) => [x.id, x.phase]));
  const other = otherPhaseFit(list, shown, phaseOf);
  // Only the fit shown needs its per-pose arrays (the 3D view, the residual chart, the coverage).
  const shownWithPoses = shown ? await withPoses(shown) : undefined;

  return (
    <div className="space-y-6">
      <Card title="Sphere-probe datasets">
        {probes.length === 0 ? (
          <p className="text-sm text-graphite-600">
            No sphere-probe data on this job yet. Probe data is uploaded on the job&apos;s data page (CSV:
            primary_deg, secondary_deg, x, y, z, optional tool_mm).
          </p>
        ) : (
          <ul className="divide-y divide-graphite-100">
            {probes.map((p) => {
              const fitted = list.filter((f) => f.analysis.datasetId === p.id);
              return (
                <li key={p.id} className="flex flex-wrap items-center justify-between gap-4 py-3">
                  <div>
                    <p className="font-medium text-graphite-900">{p.originalFilename}</p>
                    <p className="text-sm text-graphite-600">
                      <span className="num">{p.rows}</span> poses · {phaseText(p.phase)} · uploaded{" "}
                      {formatDateTimeUtc(p.uploadedAt)}
                      {p.uploaderName ? ` by ${p.uploaderName}` : ""} · SHA-256{" "}
                      <span className="num">{p.sha256.slice(0, 12)}…</span>
                    </p>
                    <p className="text-sm text-graphite-600">
                      {fitted.length
                        ? `${fitted.length} stored fit${fitted.length > 1 ? "s" : ""}, latest ${formatDateTimeUtc(fitted[0]!.analysis.createdAt)}`
                        : "Not fitted yet"}
                      {fitted.length && shown && fitted[0]!.analysis.id !== shown.analysis.id ? (
                        <>
                          {" · "}
                          <Link
                            href={`/jobs/${id}/analysis?analysis=${fitted[0]!.analysis.id}`}
                            className="font-medium text-accent-700 underline-offset-2 hover:underline"
                          >
                            Show this fit
                          </Link>
                        </>
                      ) : fitted.length && shown ? (
                        <span className="font-medium text-graphite-800"> · shown below</span>
                      ) : null}
                    </p>
                  </div>
                  {mayRun ? (
                    <RunFitButton
                      jobId={id}
                      datasetId={p.id}
                      label={fitted.length ? "Run fit again" : "Run fit"}
                    />
                  ) : null}
                </li>
              );
            })}
          </ul>
        )}
        {!mayRun ? <p className="mt-3 text-sm text-graphite-600">{runRefusal}</p> : null}
      </Card>

      {shownWithPoses ? (
        <FitSection
          job={d.job}
          fits={{ shown: shownWithPoses, other, phaseOf, approved }}
          config={config}
          user={user}
          limits={limits}
        />
      ) : null}

      {shownWithPoses ? (
        <BudgetSection
          jobId={id}
          analysis={shownWithPoses.analysis}
          config={config}
          user={user}
          jobStatus={d.job.status}
        />
      ) : null}

      {shown || views.length ? (
        <SavedViews
          jobId={id}
          views={views}
          approvedAnalysisId={approved?.detail.analysis.id ?? null}
          choices={Object.fromEntries(await reportViewChoices(id))}
          mayChoose={viewSaveRefusal(user) === null}
        />
      ) : null}
    </div>
  );
}
