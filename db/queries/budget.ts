/**
 * The Type B inputs of a head fit's uncertainty budget: which registered instruments and which
 * temperature band the engineer chose for an analysis (stored with the figures they gave, so the
 * report can be recomputed), and the budget they make (lib/budget-display). Access: the analysis's
 * job rule (404), engineers record (403), nothing changes after issue (409). Audited.
 */
import "server-only";
import { and, desc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import {
  getAnalysis,
  getApprovedAnalysis,
  headConfigOf,
  visitPlanOf,
  type AnalysisRow,
} from "@/db/queries/analyses";
import { insertJobRecord } from "@/db/queries/audit";
import { lockJob } from "@/db/queries/locks";
import { analysisBudgetInputs, heads, instruments, jobs } from "@/db/schema";
import type { HeadConfig } from "@/geometry";
import { budgetTable, resolveTypeB, type BudgetInstrument } from "@/lib/budget-display";
import type { Actor } from "@/lib/domain/roles";
import { AppError, forbidden, invalid, notFound } from "@/lib/errors";
import { budgetInputsRefusal, budgetRecorderRefusal } from "@/lib/policy/control-values";
import type { ReportBudget } from "@/lib/report/sections/budget";

export interface BudgetInputsInput {
  analysisId: string;
  probeInstrumentId?: string | undefined;
  sphereInstrumentId?: string | undefined;
  presetterInstrumentId?: string | undefined;
  deltaTK?: number | undefined;
  /** Expansion coefficient in 10⁻⁶/K (as typed); absent = steel. */
  alphaPpmPerK?: number | undefined;
}

/** Length instruments in use, for the pickers (label: kind and serial). */
export async function listBudgetInstruments(): Promise<BudgetInstrument[]> {
  const rows = await db
    .select()
    .from(instruments)
    .where(and(eq(instruments.quantityKind, "length"), isNull(instruments.retiredAt)))
    .orderBy(instruments.kind, instruments.serial);
  return rows.map((r) => ({
    id: r.id,
    label: `${r.kind} ${r.serial} (u ${(r.standardUncertainty * 1000).toFixed(2)} µm)`,
    standardUncertaintyMm: r.standardUncertainty,
  }));
}

async function instrumentFor(field: string, id: string | undefined): Promise<BudgetInstrument | null> {
  if (!id) return null;
  const [r] = await db.select().from(instruments).where(eq(instruments.id, id));
  if (!r || r.quantityKind !== "length")
    throw invalid("Choose a length instrument from the register.", [
      { field, message: "not a length instrument in the register" },
    ]);
  return { id: r.id, label: `${r.kind} ${r.serial}`, standardUncertaintyMm: r.standardUncertainty };
}

/** The newest choice for an analysis, or null (no access check: callers checked the analysis). */
export async function latestBudgetInputs(analysisId: string) {
  const [row] = await db
    .select()
    .from(analysisBudgetInputs)
    .where(eq(analysisBudgetInputs.analysisId, analysisId))
    .orderBy(desc(analysisBudgetInputs.createdAt), desc(analysisBudgetInputs.id))
    .limit(1);
  return row ?? null;
}

export async function recordBudgetInputs(actor: Actor, input: BudgetInputsInput) {
  const a = await getAnalysis(actor, input.analysisId);
  if (!a) throw notFound("analysis");
  const who = budgetRecorderRefusal(actor);
  if (who) throw forbidden(who);
  const [probe, sphere, presetter] = await Promise.all([
    instrumentFor("probeInstrumentId", input.probeInstrumentId),
    instrumentFor("sphereInstrumentId", input.sphereInstrumentId),
    instrumentFor("presetterInstrumentId", input.presetterInstrumentId),
  ]);
  const [job] = await db
    .select({ status: jobs.status, headId: jobs.headId })
    .from(jobs)
    .where(eq(jobs.id, a.job.id));
  const [head] = await db
    .select({ pivot: heads.nominalPivotLengthMm })
    .from(heads)
    .where(eq(heads.id, job!.headId));
  const inputs = resolveTypeB({
    probe,
    sphere,
    presetter,
    deltaTK: input.deltaTK ?? null,
    alphaPerK: input.alphaPpmPerK !== undefined ? input.alphaPpmPerK * 1e-6 : null,
    lengthMm: head!.pivot,
  });
  return db.transaction(async (tx) => {
    const locked = await lockJob(tx, a.job.id);
    const refusal = budgetInputsRefusal(actor, { status: locked!.status });
    if (refusal) throw new AppError(409, "fixed", refusal);
    return insertJobRecord(
      tx,
      actor,
      analysisBudgetInputs,
      {
        jobId: a.job.id,
        analysisId: a.analysis.id,
        probeInstrumentId: probe?.id ?? null,
        sphereInstrumentId: sphere?.id ?? null,
        presetterInstrumentId: presetter?.id ?? null,
        inputs,
        createdById: actor.id,
      },
      {
        action: "analysis.budget_inputs_recorded",
        entityType: "analysis_budget_inputs",
        newValues: () => ({
          analysisId: a.analysis.id,
          instruments: { probe: probe?.label, sphere: sphere?.label, presetter: presetter?.label },
          inputs,
        }),
      },
    );
  });
}

/** The budget of a stored fit with its latest inputs (Type A only without them), for page and report. */
export async function analysisBudget(analysis: Pick<AnalysisRow, "id" | "result">, config: HeadConfig) {
  const chosen = await latestBudgetInputs(analysis.id);
  const plan = visitPlanOf(analysis, config).plan;
  const uPerUmNoise = Object.fromEntries((plan?.parameters ?? []).map((p) => [p.key, p.u_per_um_noise]));
  const table = budgetTable(analysis.result.fit, uPerUmNoise, chosen?.inputs ?? {});
  return { ...table, chosen };
}
export type AnalysisBudget = Awaited<ReturnType<typeof analysisBudget>>;

/** The approved fit's budget as the report prints it; null without an approved fit. */
export async function reportBudget(
  actor: Actor,
  d: { job: { id: string }; head: Parameters<typeof headConfigOf>[0] },
): Promise<ReportBudget | null> {
  const approved = await getApprovedAnalysis(actor, d.job.id);
  if (!approved) return null;
  const b = await analysisBudget(approved.detail.analysis, headConfigOf(d.head));
  const i = b.chosen?.inputs ?? {};
  const um = (v: number | undefined) => (v === undefined ? "not given" : `${v.toFixed(2)} µm`);
  return {
    inputs: b.chosen
      ? `Type B inputs: probe ${um(i.uProbeUm)}, reference sphere ${um(i.uSphereUm)}, tool-length presetter ${um(i.uToolUm)}, temperature ${i.deltaTK !== undefined ? `±${i.deltaTK} K with α ${((i.alphaPerK ?? 0) * 1e6).toFixed(1)}·10⁻⁶/K over ${i.lengthMm} mm` : "not given"} (standard uncertainties as registered when chosen).`
      : "No Type B inputs were chosen: the budget holds the fit's Type A only.",
    rows: b.rows,
    notes: b.notes,
  };
}
