/**
 * The pure rules of a checklist reading, shared by the tablet form (live pass/fail) and the
 * server (what is stored and judged). Derived values come from geometry/ — the component never
 * computes an angle itself — and the decision is geometry's ISO 14253-1 rule.
 */
import { angleFromReading } from "@/geometry/angle";
import { decide } from "@/geometry/decision";
import type { Decision, DecisionRule } from "@/lib/domain/decisions";
import { RAD_PER_ARCSEC } from "@/geometry/units";
import { toCanonical, type EntryUnit, type QuantityKind } from "@/lib/units";

export type StepDecision = Decision | "no_limit" | "not_measured";

export interface StepRule {
  readonly quantityKind: QuantityKind;
  readonly derivation: "direct" | "angle_over_distance" | "sweep_flatness" | "check";
  readonly distanceMm: number | null;
  readonly lowerLimit: number | null;
  readonly upperLimit: number | null;
  readonly decisionRule: DecisionRule;
}

export interface ReadingEntry {
  /** The value as entered: the quantity itself, or for angle_over_distance the indicator reading (a length). */
  readonly value: number;
  readonly unit: EntryUnit;
  /** angle_over_distance: the travel the reading was taken over, in mm (defaults to the step's distance). */
  readonly travelMm?: number | null;
}

export interface DerivedReading {
  /** Canonical value: mm for length, arcsec for angle. */
  readonly value: number;
  readonly inputs: Record<string, number | string> | null;
}

/** What the entry means in the step's canonical unit; throws a RangeError with the reason when it cannot. */
export function deriveReading(step: StepRule, entry: ReadingEntry): DerivedReading {
  if (!Number.isFinite(entry.value)) throw new RangeError("The value must be a number.");
  if (step.derivation === "angle_over_distance") {
    if (entry.unit === "arcsec")
      throw new RangeError(
        "Enter the indicator reading as a length (in or mm); the angle is computed from it.",
      );
    const travelMm = entry.travelMm ?? step.distanceMm;
    if (travelMm == null || !(travelMm > 0))
      throw new RangeError("The travel the reading was taken over must be a positive length.");
    const readingMm = toCanonical(entry.value, entry.unit);
    const a = angleFromReading(readingMm * 1000, travelMm);
    return {
      value: a.angle_arcsec,
      inputs: { reading_mm: readingMm, travel_mm: travelMm, slope_um_per_m: a.slope_um_per_m },
    };
  }
  const kindOfUnit: QuantityKind = entry.unit === "arcsec" ? "angle" : "length";
  if (kindOfUnit !== step.quantityKind)
    throw new RangeError(
      `This step measures ${step.quantityKind === "angle" ? "an angle (arcsec)" : "a length (in or mm)"}, not ${entry.unit}.`,
    );
  return { value: toCanonical(entry.value, entry.unit), inputs: null };
}

/**
 * Expanded uncertainty U (k = 2, JCGM 100) of a reading in the step's canonical unit, from the
 * instrument's standard uncertainty (its own canonical unit, mm for an indicator). For an angle
 * over a travel L, u_θ = u_reading / L (small angle) in rad, converted to arcsec.
 */
export function expandedUncertainty(step: StepRule, instrumentStdU: number | null | undefined): number {
  if (!instrumentStdU || !(instrumentStdU > 0)) return 0;
  if (step.derivation === "angle_over_distance" && step.distanceMm)
    return (2 * instrumentStdU) / step.distanceMm / RAD_PER_ARCSEC;
  return 2 * instrumentStdU;
}

/**
 * Judges a canonical value against the step's limits with geometry's decide(). A lower-only
 * limit is judged by mirroring (x ≥ L ⇔ −x ≤ −L), since decide() needs an upper limit.
 */
export function judge(step: StepRule, value: number | null | undefined, U = 0): StepDecision {
  if (value == null || !Number.isFinite(value)) return "not_measured";
  const { lowerLimit: lo, upperLimit: hi, decisionRule: rule } = step;
  if (lo == null && hi == null) return "no_limit";
  if (hi != null) return decide({ measured: value, lower: lo, upper: hi, U, rule }).decision;
  return decide({ measured: -value, lower: null, upper: -(lo as number), U, rule }).decision;
}

export const DECISION_LABELS: Record<StepDecision, string> = {
  pass: "Pass",
  fail: "Fail",
  undecided: "Undecided",
  no_limit: "Recorded",
  not_measured: "Not measured",
};

/** Is the instrument's calibration still valid on the day of the reading? Dates as YYYY-MM-DD. */
export function calibrationRefusal(
  instrument: { serial: string; calibrationDueOn: string; retired: boolean },
  takenAt: Date,
): string | null {
  if (instrument.retired) return `Instrument ${instrument.serial} is retired and cannot be used.`;
  const day = takenAt.toISOString().slice(0, 10);
  if (instrument.calibrationDueOn < day)
    return `Instrument ${instrument.serial} was due for calibration on ${instrument.calibrationDueOn}; recalibrate it or choose another instrument.`;
  return null;
}
