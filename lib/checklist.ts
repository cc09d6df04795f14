/**
 * The pure rules of a checklist reading, shared by the tablet form (live pass/fail) and the
 * server (what is stored and judged). Derived values come from geometry/ — the component never
 * computes an angle itself — and the decision is geometry's ISO 14253-1 rule.
 */
import { angleFromReading } from "@/geometry/angle";
import { decide } from "@/geometry/decision";
import type { Decision, DecisionRule } from "@/lib/domain/decisions";
import type { StepKind } from "@/lib/domain/procedures";
import { RAD_PER_ARCSEC } from "@/geometry/units";
import { toCanonical, type EntryUnit, type QuantityKind } from "@/lib/units";

export type StepDecision = Decision | "no_limit" | "not_measured";

export interface StepRule {
  readonly quantityKind: QuantityKind;
  readonly derivation: StepKind;
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
 * A U of 0 or none means no uncertainty is known (expandedUncertainty gives 0 without an
 * instrument's uncertainty): the guarded rule then gives "undecided" (U missing), never a silent
 * simple decision.
 */
export function judge(step: StepRule, value: number | null | undefined, U: number | null = 0): StepDecision {
  if (value == null || !Number.isFinite(value)) return "not_measured";
  // A check is written so that yes (stored 1) is the expected answer; records and notes are not judged.
  if (step.derivation === "check") return value === 1 ? "pass" : "fail";
  if (step.derivation === "record" || step.derivation === "note") return "no_limit";
  const { lowerLimit: lo, upperLimit: hi, decisionRule: rule } = step;
  if (lo == null && hi == null) return "no_limit";
  const u = U != null && U > 0 ? U : null;
  if (hi != null) return decide({ measured: value, lower: lo, upper: hi, U: u, rule }).decision;
  return decide({ measured: -value, lower: null, upper: -(lo as number), U: u, rule }).decision;
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

/** Decimals an instrument resolves in a unit: 0.0001 in → 4; 0.001 mm shown in inch (0.0000394 in) → 5. */
export function resolutionDecimals(resolutionInUnit: number): number {
  if (!(resolutionInUnit > 0)) return Infinity;
  return Math.max(0, Math.ceil(-Math.log10(resolutionInUnit) - 1e-9));
}

/**
 * What is wrong with a value as it is being typed, or null: not a number, or more decimals than
 * the instrument can read (a misplaced digit, most often). `decimals` comes from
 * resolutionDecimals(); an empty field is not an error yet.
 */
export function entryProblem(text: string, decimals: number, serial?: string): string | null {
  const t = text.trim().replace(",", ".");
  if (t === "") return null;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)$/.test(t))
    return "Not a number: use digits, a minus sign and one decimal point.";
  const typed = t.includes(".") ? t.split(".")[1]!.length : 0;
  if (typed > decimals)
    return `More decimals than ${serial ?? "the instrument"} can read (at most ${decimals}); check the value.`;
  return null;
}

/**
 * A short title for a step's caution, from what the note is about, and whether it is shown in full
 * every time (a suspended load or a running spindle) or compact (lock-out, jogging at low feed).
 */
export function cautionOf(note: string): { title: string; severe: boolean } {
  const n = note.toLowerCase();
  if (n.includes("lift")) return { title: "Lifting the head and pinch points", severe: true };
  if (n.includes("spindle rotates")) return { title: "Cutting with the spindle running", severe: true };
  if (n.includes("lock out")) return { title: "Lock out before working on the spindle", severe: false };
  if (n.includes("axes move")) return { title: "Axes move while you indicate", severe: false };
  return { title: "Caution", severe: true };
}
