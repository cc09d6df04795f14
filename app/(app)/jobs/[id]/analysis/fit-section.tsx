import { OutlierTable } from "@/components/fit/fit-tables";
import { ParameterTable } from "@/components/fit/parameter-table";
import { PoseCoverage } from "@/components/fit/pose-coverage";
import { ResidualChart } from "@/components/fit/residual-chart";
import { Card } from "@/components/ui/card";
import { HeadViewerLoader } from "@/components/viewer/head-viewer-loader";
import {
  visitPlanOf,
  type AnalysisListRow,
  type getApprovedAnalysis,
  type headConfigOf,
  type withPoses,
} from "@/db/queries/analyses";
import { headViewInput } from "@/lib/analysis/fit-view";
import type { Phase } from "@/lib/domain/datasets";
import type { JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";
import { parameterRows, type ParameterLimit } from "@/lib/fit-display";
import { formatDateTimeUtc } from "@/lib/format";
import { fixed } from "@/lib/numbers";
import { viewSaveRefusal } from "@/lib/policy/analyses";
import { ApprovalCard } from "./approval-card";

/** The job's fits as the page chose them: the one shown, the other phase's, and the approved one. */
export interface ShownFits {
  shown: Awaited<ReturnType<typeof withPoses<AnalysisListRow>>>;
  other: AnalysisListRow | undefined;
  phaseOf: Map<string, Phase>;
  approved: Awaited<ReturnType<typeof getApprovedAnalysis>>;
}

/** What the fit section and its approval card are drawn from. */
export interface FitSectionProps {
  job: { id: string; status: JobStatus };
  fits: ShownFits;
  config: ReturnType<typeof headConfigOf>;
  user: Actor;
  limits: readonly ParameterLimit[];
}

/** The shown fit: the 3D view, its quality, parameters, residuals and pose coverage, then approval. */
export function FitSection(props: FitSectionProps) {
  const { fits, config, user, limits } = props;
  const { shown: fitRow, other, phaseOf, approved } = fits;
  const a = fitRow.analysis;
  const r = a.result;
  const fit = r.fit;
  const view = headViewInput(fitRow, other, phaseOf);
  const isApproved = approved?.detail.analysis.id === a.id;

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
            {fitRow.datasetFilename} ({view.viewer.shown.phaseText}) · run {formatDateTimeUtc(a.createdAt)}
            {fitRow.createdByName ? ` by ${fitRow.createdByName}` : ""} · computation {a.geometryVersion} ·
            input <span className="num">{a.inputSha256.slice(0, 12)}…</span>
          </p>
        </div>
        <div className="grid grid-cols-[minmax(0,1fr)] gap-6 xl:grid-cols-[minmax(0,1fr)_23rem]">
          <Card title="Pivot and squareness in 3D">
            <HeadViewerLoader config={config} {...view.viewer} maySave={viewSaveRefusal(user) === null} />
            {view.step > 1 ? (
              <p className="mt-2 text-xs text-graphite-600">
                Showing every {view.step}th pose: {view.viewer.poses.length} of {view.total}.
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
          <ParameterTable rows={parameterRows(fit, limits)} warnings={fit.warnings} />
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
          <PoseCoverage visit={visitPlanOf(a, config)} poses={view.viewer.poses} />
        </Card>
      </section>

      <ApprovalCard {...props} />
    </>
  );
}
