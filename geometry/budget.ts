/**
 * Uncertainty budget per JCGM 100:2008 (GUM): each fitted parameter's combined standard
 * uncertainty u_c = √Σ (c_k·u_k)² over uncorrelated components (GUM eq. 10), expanded U = k·u_c with
 * k = 2 (about 95 %). Components:
 * - the fit's Type A standard uncertainty (from s²·(JᵀJ)⁻¹), sensitivity 1;
 * - the probe's standard uncertainty per point (µm), propagated with the same sensitivity as
 *   probing noise: the pose plan's u per µm of noise (parameter unit per µm). Enter the probe's
 *   calibration uncertainty here, not the scatter the fit already sees in its residuals (that is
 *   Type A and would be counted twice);
 * - the reference sphere's calibration: a centre-based fit is insensitive to the sphere's diameter
 *   (every pose sees the same radius), so its sensitivity is 0 unless the radius is fitted;
 * - the tool-length presetter (µm): adds directly to the pivot length (sensitivity 1 for
 *   pivot_length_error_um, 0 otherwise);
 * - temperature: a rectangular distribution of half-width a = ΔT·α·L (α of steel 11.5e-6 /K unless
 *   given, Swyt, J. Res. NIST 99(1), 1994; L the pivot length), u = a/√3 (GUM 4.3.7), on the pivot
 *   length (sensitivity 1), 0 otherwise.
 */
import { GeometryError } from "./errors";

export const STEEL_EXPANSION_PER_K = 11.5e-6;
export const COVERAGE_FACTOR = 2;

export interface BudgetTypeB {
  /** Probe standard uncertainty per point, µm. */
  readonly uProbeUm?: number;
  /** Reference sphere diameter calibration standard uncertainty, µm. */
  readonly uSphereUm?: number;
  /** Whether the sphere radius is a fitted quantity (then the sphere's calibration enters the radius). */
  readonly radiusFitted?: boolean;
  /** Tool-length presetter standard uncertainty, µm. */
  readonly uToolUm?: number;
  /** Temperature half-range ΔT, K (the temperature is within ±ΔT of the value assumed). */
  readonly deltaTK?: number;
  /** Expansion coefficient, 1/K (default steel 11.5e-6). */
  readonly alphaPerK?: number;
  /** Length subject to expansion (the pivot length), mm. Needed with deltaTK. */
  readonly lengthMm?: number;
}

export interface BudgetParameterInput {
  readonly key: string;
  readonly unit: "um" | "arcsec";
  /** Type A standard uncertainty from the fit's covariance, in the parameter's unit. */
  readonly uTypeA: number;
  /** Sensitivity to probing noise: u of the parameter per 1 µm of noise (the plan's figure), unit per µm. */
  readonly uPerUmNoise?: number;
}

export interface BudgetComponent {
  readonly name: string;
  /** Standard uncertainty of the input, in its own unit (µm, or the parameter's unit for Type A). */
  readonly u: number;
  /** Sensitivity coefficient c: parameter unit per input unit. */
  readonly sensitivity: number;
  /** |c|·u, in the parameter's unit. */
  readonly contribution: number;
}

export interface BudgetRow {
  readonly key: string;
  readonly unit: "um" | "arcsec";
  readonly components: readonly BudgetComponent[];
  readonly u_c: number;
  /** Expanded uncertainty, k = 2. */
  readonly U: number;
  readonly k: 2;
}

export interface Budget {
  readonly rows: readonly BudgetRow[];
  /** True when no Type B input was given: the budget then holds the fit's Type A only. */
  readonly typeAOnly: boolean;
  readonly notes: readonly string[];
}

const PIVOT = "pivot_length_error_um";

function check(name: string, v: number | undefined): number | undefined {
  if (v === undefined) return undefined;
  if (!Number.isFinite(v) || v < 0) throw new GeometryError("bad_option", `${name} must be a number ≥ 0`);
  return v;
}

/** Build the budget (see the file header). Inputs in µm, K, mm; every figure out in the parameter's unit. */
export function uncertaintyBudget(params: readonly BudgetParameterInput[], typeB: BudgetTypeB = {}): Budget {
  const uProbe = check("the probe uncertainty", typeB.uProbeUm);
  const uSphere = check("the sphere calibration uncertainty", typeB.uSphereUm);
  const uTool = check("the tool-length presetter uncertainty", typeB.uToolUm);
  const dT = check("the temperature range", typeB.deltaTK);
  const alpha = check("the expansion coefficient", typeB.alphaPerK) ?? STEEL_EXPANSION_PER_K;
  const L = check("the length", typeB.lengthMm);
  if (dT !== undefined && L === undefined)
    throw new GeometryError(
      "bad_option",
      "a temperature range needs the length it acts on (the pivot length, mm)",
    );
  const notes: string[] = [];
  const typeAOnly = uProbe === undefined && uSphere === undefined && uTool === undefined && dT === undefined;
  if (typeAOnly) notes.push("no Type B inputs given: the budget holds the fit's Type A only");
  if (uSphere !== undefined && !typeB.radiusFitted)
    notes.push("a centre-based fit is insensitive to the reference sphere's diameter: its contribution is 0");
  // Half-width ΔT·α·L in µm (L mm × 1000), rectangular: u = a/√3.
  const uTemp = dT !== undefined ? (dT * alpha * L! * 1000) / Math.sqrt(3) : undefined;
  const rows = params.map((p): BudgetRow => {
    if (!Number.isFinite(p.uTypeA) || p.uTypeA < 0)
      throw new GeometryError("bad_option", `${p.key}: the Type A uncertainty must be a number ≥ 0`);
    const comps: BudgetComponent[] = [
      { name: "fit (Type A)", u: p.uTypeA, sensitivity: 1, contribution: p.uTypeA },
    ];
    if (uProbe !== undefined) {
      const c = p.uPerUmNoise ?? 0;
      comps.push({ name: "probe", u: uProbe, sensitivity: c, contribution: Math.abs(c) * uProbe });
    }
    if (uSphere !== undefined) {
      const c = typeB.radiusFitted && p.key === "sphere_radius_um" ? 1 : 0;
      comps.push({
        name: "reference sphere calibration",
        u: uSphere,
        sensitivity: c,
        contribution: c * uSphere,
      });
    }
    if (uTool !== undefined && p.key === PIVOT)
      comps.push({ name: "tool-length presetter", u: uTool, sensitivity: 1, contribution: uTool });
    if (uTemp !== undefined && p.key === PIVOT)
      comps.push({
        name: "temperature (ΔT·α·L, rectangular)",
        u: uTemp,
        sensitivity: 1,
        contribution: uTemp,
      });
    const uc = Math.sqrt(comps.reduce((s, c) => s + c.contribution ** 2, 0));
    if (!Number.isFinite(uc))
      throw new GeometryError("bad_number", `${p.key}: the combined uncertainty is beyond the number range`);
    return { key: p.key, unit: p.unit, components: comps, u_c: uc, U: COVERAGE_FACTOR * uc, k: 2 };
  });
  return { rows, typeAOnly, notes };
}

/** The CLI's JSON shape: `[{ key, components: [{ name, u, sensitivity, contribution }], u_c, U }]`. */
export function budgetToJson(b: Budget) {
  return b.rows.map((r) => ({
    key: r.key,
    components: r.components.map((c) => ({
      name: c.name,
      u: c.u,
      sensitivity: c.sensitivity,
      contribution: c.contribution,
    })),
    u_c: r.u_c,
    U: r.U,
  }));
}

/**
 * The budget of a head fit: its parameters (pinned ones, u null, left out) with the pose plan's
 * sensitivity to probing noise per parameter key (`uPerUmNoise`, parameter unit per µm).
 */
export function headFitBudget(
  parameters: readonly { readonly key: string; readonly unit: "um" | "arcsec"; readonly u: number | null }[],
  uPerUmNoise: Readonly<Record<string, number | null | undefined>>,
  typeB: BudgetTypeB,
): Budget {
  const inputs: BudgetParameterInput[] = [];
  for (const p of parameters) {
    if (p.u === null) continue;
    const c = uPerUmNoise[p.key];
    inputs.push({ key: p.key, unit: p.unit, uTypeA: p.u, ...(c != null ? { uPerUmNoise: c } : {}) });
  }
  return uncertaintyBudget(inputs, typeB);
}
