import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ApproveButton, RunFitButton } from "@/components/fit/fit-buttons";
import { controlValues, parameterRows, type ParameterLimit } from "@/lib/fit-display";
import { fixed } from "@/lib/numbers";
import { ControlValuesTable, OutlierTable } from "@/components/fit/fit-tables";
import { ParameterTable } from "@/components/fit/parameter-table";
import { PoseCoverage } from "@/components/fit/pose-coverage";
import { ResidualChart } from "@/components/fit/residual-chart";
import { Card } from "@/components/ui/card";
import { SafetyNote } from "@/components/ui/safety-note";
import { HeadViewerLoader } from "@/components/viewer/head-viewer-loader";
import {
  getApprovedAnalysis,
  headConfigOf,
  listJobAnalyses,
  visitPlanOf,
  withPoses,
  type AnalysisListRow,
} from "@/db/queries/analyses";
import { listJobViews } from "@/db/queries/analysis-views";
import { reportViewChoices } from "@/db/queries/report-views";
import { listDatasets } from "@/db/queries/datasets";
import { parameterLimitsOfTemplate } from "@/db/queries/parameter-limits";
import { getJobDetail } from "@/db/queries/jobs";
import type { HeadErrors, HeadPose } from "@/geometry";
import { approvalNote, chooseShownFit, otherPhaseFit, thinPoses } from "@/lib/analysis/fit-view";
import { phaseText } from "@/lib/domain/datasets";
import type { JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";
import { fitApproverRefusal, headFitRefusal, viewSaveRefusal } from "@/lib/policy/analyses";
import { requirePageUser } from "@/lib/auth/session";
import { formatDateTimeUtc } from "@/lib/format";
import { BudgetSection } from "./budget-section";
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
          jobId={id}
          fitRow={shownWithPoses}
          otherRow={other}
          phaseOf={phaseOf}
          config={config}
          user={user}
          jobStatus={d.job.status}
          approved={approved}
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

type FitRow = Awaited<ReturnType<typeof withPoses<AnalysisListRow>>>;

function FitSection({
  jobId,
  fitRow,
  otherRow,
  phaseOf,
  config,
  user,
  jobStatus,
  approved,
  limits,
}: {
  jobId: string;
  limits: readonly ParameterLimit[];
  fitRow: FitRow;
  otherRow: AnalysisListRow | undefined;
  phaseOf: Map<string, "pre" | "post">;
  config: ReturnType<typeof headConfigOf>;
  user: Actor;
  jobStatus: JobStatus;
  approved: Awaited<ReturnType<typeof getApprovedAnalysis>>;
}) {
  const a = fitRow.analysis;
  const r = a.result;
  const fit = r.fit;
  const rows = parameterRows(fit, limits);
  const errors: HeadErrors = Object.fromEntries(
    fit.parameters.filter((p) => p.U !== null).map((p) => [p.key, p.value]),
  );
  const { step, indices: viewIdx } = thinPoses(r.poses.row.length);
  const poses: HeadPose[] = viewIdx.map((i) => ({
    primaryDeg: r.poses.primary_deg[i]!,
    secondaryDeg: r.poses.secondary_deg[i]!,
    toolMm: r.poses.tool_mm[i]!,
  }));
  const viewResiduals = viewIdx.map((i) => r.poses.residual_um[i]!);
  const isApproved = approved?.detail.analysis.id === a.id;
  const shownLabel = {
    analysisId: a.id,
    phaseText: phaseText(phaseOf.get(a.datasetId) ?? "pre"),
    dataset: fitRow.datasetFilename,
  };
  const overlay = otherRow
    ? {
        analysisId: otherRow.analysis.id,
        phaseText: phaseText(phaseOf.get(otherRow.analysis.datasetId) ?? "pre"),
        dataset: otherRow.datasetFilename,
        errors: Object.fromEntries(
          otherRow.analysis.result.fit.parameters.filter((p) => p.U !== null).map((p) => [p.key, p.value]),
        ) as HeadErrors,
      }
    : null;
  const refusal = approvalNote(user, { status: jobStatus }, approved?.detail.analysis.id);
  const mayApprove = fitApproverRefusal(user) === null;

  return (
    <>
      <section aria-labelledby="fit-title" data-analysis-id={a.id} className="space-y-4">
        <div className="flex flex-wrap items-baseline justify-between gap-3">
          <h2 id="fit-title" className="text-xl font-semibold">
            Head fit{" "}
            {isApproved ? (
              <span className="ml-2 rounded bg-pass-50 px-2 py-0.5 text-sm font-semibold text-pass-700">
                ✓ Approved
              </span>
            ) : null}
          </h2>
          <p className="text-sm text-graphite-600">
            {fitRow.datasetFilename} ({shownLabel.phaseText}) · run {formatDateTimeUtc(a.createdAt)}
            {fitRow.createdByName ? ` by ${fitRow.createdByName}` : ""} · computation {a.geometryVersion} ·
            input <span className="num">{a.inputSha256.slice(0, 12)}…</span>
          </p>
        </div>
        <div className="grid grid-cols-[minmax(0,1fr)] gap-6 xl:grid-cols-[minmax(0,1fr)_23rem]">
          <Card title="Pivot and squareness in 3D">
            <HeadViewerLoader
              config={config}
              errors={errors}
              poses={poses}
              residualsUm={viewResiduals}
              shown={shownLabel}
              overlay={overlay}
              maySave={viewSaveRefusal(user) === null}
            />
            {step > 1 ? (
              <p className="mt-2 text-xs text-graphite-600">
                Showing every {step}th pose: {poses.length} of {r.poses.row.length}.
              </p>
            ) : null}
          </Card>
          <Card title="Fit quality">
            <dl className="grid grid-cols-[1fr_auto] gap-x-4 gap-y-2 text-sm" data-testid="fit-quality">
              <dt className="text-graphite-600">Residual RMS</dt>
              <dd className="num text-right">{fit.rms_um.toFixed(2)} µm</dd>
              <dt className="text-graphite-600">Largest residual</dt>
              <dd className="num text-right">{fit.max_um.toFixed(2)} µm</dd>
              <dt className="text-graphite-600">Residual s per coordinate</dt>
              <dd className="num text-right">{r.s_um.toFixed(2)} µm</dd>
              <dt className="text-graphite-600">Poses</dt>
              <dd className="num text-right">{r.poses.row.length}</dd>
              <dt className="text-graphite-600">Degrees of freedom</dt>
              <dd className="num text-right">{r.degrees_of_freedom}</dd>
              <dt className="text-graphite-600">Iterations</dt>
              <dd className="num text-right">{fit.iterations}</dd>
              <dt className="text-graphite-600">Outliers (beyond 3 s)</dt>
              <dd className="num text-right">{fit.outlier_count ?? fit.outliers.length}</dd>
              <dt className="col-span-2 text-graphite-600">Sphere centre (x, y, z)</dt>
              <dd className="num col-span-2 text-right">
                {fit.sphere_centre_mm.map((v) => fixed(v, 4)).join(", ")} mm
              </dd>
            </dl>
            <p className="mt-4 text-xs text-graphite-600">
              Uncertainties are expanded, U = 2u (k = 2, about 95 %), from the residual scatter s²·(JᵀJ)⁻¹.
            </p>
          </Card>
        </div>

        <Card title="Parameters">
          <ParameterTable rows={rows} warnings={fit.warnings} />
        </Card>

        <Card title="Residuals per pose">
          <ResidualChart
            residuals={r.poses.residual_um}
            rows={r.poses.row}
            toolMm={r.poses.tool_mm}
            sUm={r.s_um}
          />
          {fit.outliers.length ? (
            <>
              <OutlierTable
                outliers={fit.outliers}
                total={fit.outlier_count ?? fit.outliers.length}
                poses={r.poses}
              />
              {(fit.outlier_count ?? 0) > fit.outliers.length ? (
                <p className="mt-2 text-sm text-graphite-600">
                  The worst {fit.outliers.length} of {fit.outlier_count} outliers are listed.
                </p>
              ) : null}
            </>
          ) : (
            <p className="mt-3 text-sm text-graphite-600">No outliers.</p>
          )}
        </Card>

        <Card title="Probed poses and the next visit">
          <PoseCoverage visit={visitPlanOf(a, config)} poses={poses} />
        </Card>
      </section>

      <Card title={isApproved ? "Approved parameters: values for the control" : "Approval"}>
        {isApproved ? (
          <div className="space-y-4">
            <p className="text-sm text-graphite-700">
              Approved {formatDateTimeUtc(approved!.approvedAt)}
              {approved!.approvedBy ? ` by ${approved!.approvedBy}` : ""}. Enter these in the control&apos;s
              kinematic (tool centre point) settings for this head:
            </p>
            <ControlValuesTable values={controlValues(fit, config)} />
            <div className="rounded-card border border-graphite-200 bg-graphite-50 p-4 text-sm text-graphite-800">
              <p className="font-semibold">Units and signs</p>
              <p>
                Lengths in millimetres, angles in degrees (arc seconds beside them). Each value is the head as
                measured minus the head as designed, in the machine frame (right-handed X, Y, Z; both axes at
                zero). A positive offset points the way named; a positive angle is a right-hand turn about the
                direction named. Parameters the data could not separate are left out and stay at 0. Controls
                differ in whether they take the value itself or its correction, and in their own axis names:
                check the control builder&apos;s documentation before entering anything.
              </p>
            </div>
            <SafetyNote title="Before entering values and moving the axes">
              <p>
                Entering kinematic values changes how the control moves the head. Enter them and move the axes
                only as the machine builder&apos;s manual describes: with the machine locked out while you
                work at the spindle, and at the reduced speed the manual gives for the first moves, keeping
                clear of the head&apos;s swing. Check the tool centre point on the reference sphere before
                cutting. Follow local rules and your company&apos;s procedures.
              </p>
            </SafetyNote>
          </div>
        ) : (
          <div className="space-y-3">
            <p className="text-sm text-graphite-700">
              Approving fixes this fit as the head&apos;s parameter set for the job and moves the job to
              approved; the values to enter in the control are then shown here.
            </p>
            {mayApprove ? (
              <ApproveButton
                jobId={jobId}
                analysisId={a.id}
                refusal={refusal}
                nonConforming={parameterRows(fit, limits)
                  .filter((p) => p.decision === "fail" || p.decision === "undecided")
                  .map((p) => ({
                    key: p.key,
                    label: `${p.iso} (${p.words})`,
                    decisionText: p.decisionText,
                    valueText: p.valueText,
                    toleranceText: p.toleranceText,
                  }))}
              />
            ) : (
              <p className="text-sm text-graphite-600">{refusal}</p>
            )}
          </div>
        )}
      </Card>
    </>
  );
}
