/**
 * Decision rules for tolerance checks, per ISO 14253-1 (conformity or non-conformity with
 * specifications). Every check returns pass, fail or undecided together with the measured value,
 * the limits, the expanded uncertainty U and the rule applied (ISO/IEC 17025 §7.8.6 requires the
 * rule to be stated). All values in one unit, the caller's (named in `unit` when given).
 */
import { GeometryError } from "./errors";

/**
 * simple: uncertainty shown, not subtracted — pass inside [LSL, USL], fail outside.
 * guarded (ISO 14253-1): pass only inside [LSL + U, USL − U]; fail only outside [LSL − U, USL + U];
 * undecided between.
 */
export type DecisionRule = "simple" | "guarded";
export type Decision = "pass" | "fail" | "undecided";

export interface ToleranceCheck {
  readonly measured: number;
  /** Lower specification limit; null for a one-sided tolerance (upper limit only). */
  readonly lower: number | null;
  readonly upper: number;
  /**
   * Expanded uncertainty (k = 2), ≥ 0, same unit as the limits; null when no uncertainty is known.
   * The guarded rule cannot decide without it: the result is "undecided" with reason "U missing"
   * (never a silent simple decision). The simple rule does not need U.
   */
  readonly U: number | null;
  readonly rule: DecisionRule;
  readonly unit?: string;
}

/** Why a decision is undecided for a reason other than the guard band. */
export type DecisionReason = "U missing";

/** The check as it was asked, with its decision. */
export interface DecisionResult extends ToleranceCheck {
  readonly decision: Decision;
  /** Present when the decision could not be made by the rule: guarded without U. */
  readonly reason?: DecisionReason;
}

/**
 * Apply the decision rule (see DecisionRule). Limits inclusive: a value on a limit conforms. "On"
 * allows a few ulps, so that a value written on a limit in decimal (9.985 against 9.98 + 0.005)
 * is on it despite binary rounding: |Δ| ≤ 8·ε·max(|measured|, |limits|, U).
 */
export function decide(check: ToleranceCheck): DecisionResult {
  const { measured, lower, upper, U, rule } = check;
  if (rule !== "simple" && rule !== "guarded")
    throw new GeometryError("bad_option", `rule must be "simple" or "guarded", not '${String(rule)}'`);
  if (!Number.isFinite(measured)) throw new GeometryError("bad_number", "the measured value must be finite");
  if (!Number.isFinite(upper) || (lower !== null && !Number.isFinite(lower)))
    throw new GeometryError("bad_number", "tolerance limits must be finite");
  if (lower !== null && lower > upper)
    throw new GeometryError("bad_option", "the lower limit is above the upper limit");
  if (U !== null && (!Number.isFinite(U) || U < 0))
    throw new GeometryError("bad_option", "the expanded uncertainty U must be ≥ 0");
  const base = { measured, lower, upper, U, rule, ...(check.unit !== undefined ? { unit: check.unit } : {}) };
  if (U === null && rule === "guarded") return { decision: "undecided", ...base, reason: "U missing" };
  const u = U ?? 0;
  const eps = 8 * Number.EPSILON * Math.max(Math.abs(measured), Math.abs(upper), Math.abs(lower ?? 0), u);
  const le = (x: number, y: number) => x <= y + eps;
  let decision: Decision;
  if (rule === "simple") {
    decision = le(measured, upper) && (lower === null || le(lower, measured)) ? "pass" : "fail";
  } else if (!le(measured, upper + u) || (lower !== null && !le(lower - u, measured))) {
    decision = "fail";
  } else if (le(measured, upper - u) && (lower === null || le(lower + u, measured))) {
    decision = "pass";
  } else {
    decision = "undecided";
  }
  return { decision, ...base };
}

/** "undecided — U missing" for a guarded decision without U; otherwise the decision itself. */
export function decisionText(d: Pick<DecisionResult, "decision" | "reason">): string {
  return d.reason ? `${d.decision} — ${d.reason}` : d.decision;
}
