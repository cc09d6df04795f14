import { BudgetInputsForm } from "@/components/control/budget-form";
import { BudgetTable } from "@/components/fit/budget-table";
import { Card } from "@/components/ui/card";
import { analysisBudget, listBudgetInstruments } from "@/db/queries/budget";
import type { AnalysisRow } from "@/db/queries/analyses";
import type { HeadConfig } from "@/geometry";
import type { JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";
import { formatDateTimeUtc } from "@/lib/format";
import { budgetInputsRefusal } from "@/lib/policy/control-values";

/** The shown fit's uncertainty budget, and for the engineer the choice of its Type B inputs. */
export async function BudgetSection({
  jobId,
  analysis,
  config,
  user,
  jobStatus,
}: {
  jobId: string;
  analysis: Pick<AnalysisRow, "id" | "result">;
  config: HeadConfig;
  user: Actor;
  jobStatus: JobStatus;
}) {
  const budget = await analysisBudget(analysis, config);
  const mayChoose = budgetInputsRefusal(user, { status: jobStatus }) === null;
  const instruments = mayChoose ? await listBudgetInstruments() : [];
  const c = budget.chosen;
  const inputs = c?.inputs ?? {};
  return (
    <Card title="Uncertainty budget (JCGM 100)">
      <div className="space-y-4 text-sm">
        <p className="text-graphite-700">
          Each parameter&apos;s standard uncertainty combines the fit&apos;s own (Type A) with the inputs
          below (Type B) as the root sum of squares of their contributions; U = 2·u_c (k = 2, about 95 %).
          {c
            ? ` Inputs chosen ${formatDateTimeUtc(c.createdAt)}: probe ${inputs.uProbeUm?.toFixed(2) ?? "—"} µm, sphere ${inputs.uSphereUm?.toFixed(2) ?? "—"} µm, presetter ${inputs.uToolUm?.toFixed(2) ?? "—"} µm, ΔT ${inputs.deltaTK ?? "—"} K.`
            : ""}
        </p>
        <BudgetTable rows={budget.rows} />
        {budget.notes.map((n) => (
          <p key={n} className="text-graphite-600">
            Note: {n}.
          </p>
        ))}
        {mayChoose ? (
          <BudgetInputsForm
            jobId={jobId}
            analysisId={analysis.id}
            instruments={instruments}
            current={{
              probe: c?.probeInstrumentId ?? "",
              sphere: c?.sphereInstrumentId ?? "",
              presetter: c?.presetterInstrumentId ?? "",
              deltaTK: inputs.deltaTK !== undefined ? String(inputs.deltaTK) : "",
              alphaPpmPerK: inputs.alphaPerK !== undefined ? String(inputs.alphaPerK * 1e6) : "",
            }}
          />
        ) : null}
      </div>
    </Card>
  );
}
