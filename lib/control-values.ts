/**
 * The control loop as plain data: the control's kinematic values as found, the correction from the
 * approved head fit, the values to enter (as found + correction), the values left in the control,
 * and a flag wherever what was left differs from what was computed. Pure, so every sum and sign is
 * unit-tested (tests/unit/control-values.test.ts); pages, the API and the report show these rows.
 *
 * Sign convention: a fitted parameter is the head as measured minus the head as the control held it
 * while the sphere was probed (geometry/README.md, "The head model"). A control that held the as-found
 * values is corrected by adding it: value to enter = as found + correction. Lengths are in the
 * machine frame with both axes at zero; angles are right-hand turns about the direction named.
 */
import { fromMm, MM_PER_INCH, toMm, type HeadFitJson } from "@/geometry";
import {
  CONTROL_VALUE_DEFS,
  CONTROL_VALUE_KEYS,
  type ControlValueDef,
  type ControlValueKey,
  type ControlValueSet,
} from "@/lib/domain/control-values";
import { fixed, signed } from "@/lib/numbers";

export type ControlUnitSystem = "metric" | "inch";

/** Decimals a control value is shown and entered with: 0.1 µm in mm, 0.01 thou in inch, 0.00001° (0.036″). */
export const CONTROL_DECIMALS = { mm: 4, in: 5, deg: 5 } as const;

/**
 * A value left in the control counts as the computed one when it is within half the last shown
 * digit of it, in the control's units (typing the shown value is never flagged).
 */
export function flagTolerance(kind: "length" | "angle", system: ControlUnitSystem): number {
  if (kind === "angle") return 0.5 * 10 ** -CONTROL_DECIMALS.deg;
  return system === "inch"
    ? 0.5 * 10 ** -CONTROL_DECIMALS.in * MM_PER_INCH
    : 0.5 * 10 ** -CONTROL_DECIMALS.mm;
}

export const SIGN_CONVENTION =
  "Correction = the head as measured minus the head as the control held it while the sphere was probed. " +
  "Value to enter = as found + correction. Lengths are in the machine frame with both axes at zero and " +
  "positive along the direction named; angles are in degrees, positive as a right-hand turn about the " +
  "direction named. Controls differ in their own names for these values and in whether they take the " +
  "value itself or only its change: map each row to the control's setting with the control builder's manual.";

export const CONTROL_CAUTION =
  "Kinematic values are entered in the control by qualified people, exactly as the control builder's " +
  "manual describes, with the machine in the state the manual requires. New values change how the " +
  "axes move: make the first moves at reduced speed, keep clear of the head's swing, and check the tool " +
  "centre point on the reference sphere before cutting. Follow the machine builder's manual, local " +
  "codes and your company's procedures.";

/** Canonical (mm or degrees) from what a person typed in the control's units. */
export function toControlCanonical(
  value: number,
  kind: "length" | "angle",
  system: ControlUnitSystem,
): number {
  return kind === "angle" ? value : toMm(value, system === "inch" ? "in" : "mm");
}

/** Canonical (mm or degrees) to the number shown and typed in the control's units. */
export function fromControlCanonical(
  value: number,
  kind: "length" | "angle",
  system: ControlUnitSystem,
): number {
  return kind === "angle" ? value : fromMm(value, system === "inch" ? "in" : "mm");
}

/** "123.4567 mm"; "4.86221 in (123.4999 mm)"; "+0.00123° (+4.4″)". `sign` adds a + to positive values. */
export function controlValueText(
  value: number,
  kind: "length" | "angle",
  system: ControlUnitSystem,
  sign = false,
): string {
  const f = sign ? signed : fixed;
  if (kind === "angle") return `${f(value, CONTROL_DECIMALS.deg)}° (${f(value * 3600, 1)}″)`;
  if (system === "inch")
    return `${f(fromMm(value, "in"), CONTROL_DECIMALS.in)} in (${f(value, CONTROL_DECIMALS.mm)} mm)`;
  return `${f(value, CONTROL_DECIMALS.mm)} mm`;
}

/** Why a row is flagged: what was left is not what was computed, or a value is missing for the comparison. */
export type ControlFlag = "differs" | "not_left" | "not_computed";

export const CONTROL_FLAG_WORDS: Record<ControlFlag, string> = {
  differs: "Differs from the value to enter",
  not_left: "No as-left value recorded",
  not_computed: "Left without a computed value",
};

export interface ControlRow {
  key: ControlValueKey;
  label: string;
  kind: "length" | "angle";
  /** ISO 230-1 style symbol of the fitted parameter that corrects this value, when fitted. */
  iso: string | null;
  asFound: number | null;
  /** From the approved fit, canonical; 0 for a parameter the data could not separate (held). */
  correction: number | null;
  held: boolean;
  toEnter: number | null;
  asLeft: number | null;
  /** As left − to enter, canonical. */
  difference: number | null;
  flag: ControlFlag | null;
  asFoundText: string;
  correctionText: string;
  toEnterText: string;
  asLeftText: string;
  differenceText: string;
  flagText: string;
}

/** The correction a fitted parameter makes to a control value, canonical (µm → mm, ″ → degrees). */
export function correctionOf(
  def: ControlValueDef,
  fit: HeadFitJson,
): { value: number; held: boolean; iso: string } | null {
  const p = fit.parameters.find((x) => x.key === def.parameter);
  if (!p) return null;
  // A parameter held at zero was not measured: the control's value stays as it was.
  if (p.U === null) return { value: 0, held: true, iso: p.iso };
  const value = def.kind === "length" ? p.value / 1000 : p.value / 3600;
  return { value, held: false, iso: p.iso };
}

export interface ControlLoopInput {
  asFound: ControlValueSet | null;
  asLeft: ControlValueSet | null;
  /** The approved fit; null before approval (no values to enter yet). */
  approvedFit: HeadFitJson | null;
  unitSystem: ControlUnitSystem;
}

export interface ControlLoop {
  rows: ControlRow[];
  /** Rows with a flag; empty when everything left matches the values to enter. */
  flagged: ControlRow[];
  hasValuesToEnter: boolean;
  unitSystem: ControlUnitSystem;
}

const dash = "—";

/** Every control value with as found, correction, value to enter, as left and the difference, in the control's units. */
export function controlLoop(input: ControlLoopInput): ControlLoop {
  const { asFound, asLeft, approvedFit, unitSystem } = input;
  const rows = CONTROL_VALUE_DEFS.map((def): ControlRow => {
    const found = asFound?.[def.key] ?? null;
    const corr = approvedFit ? correctionOf(def, approvedFit) : null;
    const toEnter = found !== null && corr !== null ? found + corr.value : null;
    const left = asLeft?.[def.key] ?? null;
    const difference = left !== null && toEnter !== null ? left - toEnter : null;
    let flag: ControlFlag | null = null;
    if (asLeft !== null) {
      if (toEnter !== null && left === null) flag = "not_left";
      else if (toEnter === null && left !== null && found !== null) flag = "not_computed";
      else if (difference !== null && Math.abs(difference) > flagTolerance(def.kind, unitSystem))
        flag = "differs";
    }
    const text = (v: number | null, sign = false) =>
      v === null ? dash : controlValueText(v, def.kind, unitSystem, sign);
    return {
      key: def.key,
      label: def.label,
      kind: def.kind,
      iso: corr?.iso ?? null,
      asFound: found,
      correction: corr?.value ?? null,
      held: corr?.held ?? false,
      toEnter,
      asLeft: left,
      difference,
      flag,
      asFoundText: text(found),
      correctionText: corr === null ? dash : corr.held ? "held (no change)" : text(corr.value, true),
      toEnterText: text(toEnter),
      asLeftText: text(left),
      differenceText: text(difference, true),
      flagText: flag ? CONTROL_FLAG_WORDS[flag] : "",
    };
  });
  return {
    rows,
    flagged: rows.filter((r) => r.flag !== null),
    hasValuesToEnter: rows.some((r) => r.toEnter !== null),
    unitSystem,
  };
}

/** Keys in a JSON object that are not control values (refused, never silently dropped). */
export function unknownControlKeys(values: Record<string, unknown>): string[] {
  return Object.keys(values).filter((k) => !(CONTROL_VALUE_KEYS as readonly string[]).includes(k));
}
