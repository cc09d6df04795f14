/**
 * The uncertainty budget of a head fit as the analysis page and the report show it (JCGM 100,
 * geometry/budget.ts headFitBudget): per parameter, each component with its standard uncertainty,
 * sensitivity coefficient and contribution, the combined u_c and U (k = 2). The Type B inputs come
 * from registered instruments chosen by the engineer; this module resolves them into geometry's
 * inputs (register figures are in mm, the budget takes µm). Pure and unit-tested.
 */
import { headFitBudget, STEEL_EXPANSION_PER_K, type BudgetTypeB, type HeadFitJson } from "@/geometry";
import { PARAMETER_WORDS } from "@/lib/fit-display";
import { UNIT_SYMBOL } from "@/lib/units";

/** A registered instrument as the budget uses it: its standard uncertainty in mm (length instruments). */
export interface BudgetInstrument {
  id: string;
  label: string;
  standardUncertaintyMm: number;
}

export interface BudgetChoice {
  probe: BudgetInstrument | null;
  sphere: BudgetInstrument | null;
  presetter: BudgetInstrument | null;
  /** Half-range of the temperature during probing, K; null when not given. */
  deltaTK: number | null;
  /** Expansion coefficient, 1/K; null = steel (geometry's default). */
  alphaPerK: number | null;
  /** The length the temperature acts on: the pivot length, mm. */
  lengthMm: number;
}

/** geometry's Type B inputs from the chosen instruments and temperature band (mm → µm). */
export function resolveTypeB(c: BudgetChoice): BudgetTypeB & Record<string, number> {
  return {
    ...(c.probe ? { uProbeUm: c.probe.standardUncertaintyMm * 1000 } : {}),
    ...(c.sphere ? { uSphereUm: c.sphere.standardUncertaintyMm * 1000 } : {}),
    ...(c.presetter ? { uToolUm: c.presetter.standardUncertaintyMm * 1000 } : {}),
    ...(c.deltaTK !== null
      ? { deltaTK: c.deltaTK, alphaPerK: c.alphaPerK ?? STEEL_EXPANSION_PER_K, lengthMm: c.lengthMm }
      : {}),
  };
}

export interface BudgetTableRow {
  parameter: string;
  unit: "µm" | "″";
  components: Array<{ name: string; u: string; sensitivity: string; contribution: string }>;
  uc: string;
  U: string;
}

/**
 * The budget rows of a fit: `uPerUmNoise` is the pose plan's u per µm of probing noise per
 * parameter (the probe's sensitivity coefficient); `symbols` the ISO-style symbol per key.
 */
export function budgetTable(
  fit: HeadFitJson,
  uPerUmNoise: Readonly<Record<string, number | null | undefined>>,
  typeB: BudgetTypeB,
): { rows: BudgetTableRow[]; notes: string[] } {
  const b = headFitBudget(fit.parameters, uPerUmNoise, typeB);
  const iso = new Map(fit.parameters.map((p) => [p.key, p.iso]));
  return {
    rows: b.rows.map((r) => ({
      parameter: `${iso.get(r.key as never) ?? r.key} — ${PARAMETER_WORDS[r.key as keyof typeof PARAMETER_WORDS] ?? r.key}`,
      unit: UNIT_SYMBOL[r.unit],
      components: r.components.map((c) => ({
        name: c.name,
        u: c.u.toFixed(3),
        sensitivity: c.sensitivity.toPrecision(3),
        contribution: c.contribution.toFixed(3),
      })),
      uc: r.u_c.toFixed(3),
      U: r.U.toFixed(2),
    })),
    notes: [...b.notes],
  };
}
