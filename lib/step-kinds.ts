/**
 * What each kind of checklist step takes on the tablet and what is stored for it, as pure
 * functions shared by the entry form (live checks) and the server (422 naming the point or field).
 *
 * Stored form per kind (readings.value is NOT NULL):
 * - direct / angle_over_distance: the canonical value (mm or arcsec), as before;
 * - multi_point: the value derived from the points by geometry/multi-point (canonical unit); the
 *   points as entered in inputs `{ points: { "12": v, … }, unit, result, highPoint, lowPoint }`;
 * - check: value 1 for yes and 0 for no, the word in text_value; judged pass for yes, fail for no
 *   (a check is written so that yes is the expected answer);
 * - record: the value as entered in the step's own unit (not converted), where it applies (shim
 *   positions) in text_value; never judged;
 * - note: value 0, the text in text_value; never judged.
 */
import { multiPointValue } from "@/geometry/multi-point";
import { GeometryError } from "@/geometry/errors";
import { deriveReading, type StepRule } from "@/lib/checklist";
import type { MultiPointResult, StepKind } from "@/lib/domain/procedures";
import { formatValue, fromCanonical, toCanonical, type EntryUnit, type UnitSystem } from "@/lib/units";

export interface KindStep extends StepRule {
  readonly points: readonly string[] | null;
  readonly pointResult: MultiPointResult | null;
  readonly recordUnit: string | null;
}

export interface KindEntry {
  /** direct, angle_over_distance and record: the value as entered. */
  readonly value?: number | string | null;
  /** The entry unit of a reading (mm, in, µm, arcsec); record steps use the step's own unit. */
  readonly unit: EntryUnit;
  readonly travelMm?: number | null;
  /** check: the answer. */
  readonly answer?: string | null;
  /** multi_point: the reading at each point, keyed by the point's name. */
  readonly points?: Readonly<Record<string, number | string | null | undefined>> | null;
  /** note: the note; record: where the value applies (shim positions). */
  readonly text?: string | null;
}

export interface FieldProblem {
  readonly field: string;
  readonly message: string;
}

export interface StoredEntry {
  readonly value: number;
  readonly enteredValue: number;
  readonly enteredUnit: string;
  readonly inputs: Record<string, unknown> | null;
  readonly textValue: string | null;
  /** What the instrument itself read, in its canonical unit (for the range check). */
  readonly instrumentReadings: readonly number[];
}

export type EntryOutcome =
  | { readonly ok: true; readonly stored: StoredEntry }
  | { readonly ok: false; readonly problems: readonly FieldProblem[] };

/** Kinds read with an instrument from the register (the others are answers, records and notes). */
export const INSTRUMENT_KINDS: readonly StepKind[] = ["direct", "angle_over_distance", "multi_point"];
export const needsInstrument = (kind: StepKind) => INSTRUMENT_KINDS.includes(kind);
/** Kinds whose value is not a length or an angle (no change, no chart, no unit conversion). */
export const TEXT_KINDS: readonly StepKind[] = ["check", "record", "note"];

export const MULTI_POINT_SHORT: Record<MultiPointResult, string> = {
  tir: "TIR",
  mean: "mean",
  flatness: "flatness",
};

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)$/;

/** A typed or sent number: accepts a decimal comma; null when empty; NaN when not a number. */
export function parseNumber(v: number | string | null | undefined): number | null {
  if (v == null) return null;
  if (typeof v === "number") return Number.isFinite(v) ? v : NaN;
  const t = v.trim().replace(",", ".");
  if (t === "") return null;
  return NUMBER.test(t) ? Number(t) : NaN;
}

const fail = (field: string, message: string): EntryOutcome => ({
  ok: false,
  problems: [{ field, message }],
});
const MAX_TEXT = 2000;

/** Checks an entry against its step's kind and turns it into what is stored, or the problems. */
export function stepEntry(step: KindStep, entry: KindEntry): EntryOutcome {
  switch (step.derivation) {
    case "check": {
      const a = (entry.answer ?? "").trim().toLowerCase();
      if (a !== "yes" && a !== "no") return fail("answer", "Answer yes or no.");
      return {
        ok: true,
        stored: {
          value: a === "yes" ? 1 : 0,
          enteredValue: a === "yes" ? 1 : 0,
          enteredUnit: "yes/no",
          inputs: null,
          textValue: a,
          instrumentReadings: [],
        },
      };
    }
    case "note": {
      const t = (entry.text ?? "").trim();
      if (!t) return fail("text", "Write the note.");
      if (t.length > MAX_TEXT) return fail("text", `At most ${MAX_TEXT} characters.`);
      return {
        ok: true,
        stored: {
          value: 0,
          enteredValue: 0,
          enteredUnit: "text",
          inputs: null,
          textValue: t,
          instrumentReadings: [],
        },
      };
    }
    case "record": {
      const v = parseNumber(entry.value);
      if (v === null)
        return fail("value", `Enter the value${step.recordUnit ? ` in ${step.recordUnit}` : ""}.`);
      if (Number.isNaN(v))
        return fail("value", "Not a number: use digits, a minus sign and one decimal point.");
      const t = (entry.text ?? "").trim();
      if (t.length > MAX_TEXT) return fail("text", `At most ${MAX_TEXT} characters.`);
      return {
        ok: true,
        stored: {
          value: v,
          enteredValue: v,
          enteredUnit: step.recordUnit ?? "",
          inputs: null,
          textValue: t || null,
          instrumentReadings: [],
        },
      };
    }
    case "multi_point": {
      const names = step.points ?? [];
      if (names.length === 0) return fail("points", "This step has no points set in its procedure.");
      if (entry.unit === "arcsec")
        return fail("unit", "Enter the readings at the points as lengths (mm, µm or in).");
      if (step.quantityKind !== "length")
        return fail("points", "A multi-point step derives a length; its procedure says otherwise.");
      const given = entry.points ?? {};
      const problems: FieldProblem[] = [];
      const values: number[] = [];
      for (const p of names) {
        const v = parseNumber(given[p]);
        if (v === null) problems.push({ field: `points.${p}`, message: `Enter the reading at ${p}.` });
        else if (Number.isNaN(v))
          problems.push({ field: `points.${p}`, message: `The reading at ${p} is not a number.` });
        values.push(v ?? NaN);
      }
      const extra = Object.keys(given).filter((k) => !names.includes(k));
      if (extra.length)
        problems.push({ field: `points.${extra[0]}`, message: `${extra[0]} is not a point of this step.` });
      if (problems.length) return { ok: false, problems };
      const kind = step.pointResult ?? "tir";
      let r;
      try {
        r = multiPointValue(kind, names, values);
      } catch (err) {
        if (err instanceof GeometryError) return fail("points", err.message);
        throw err;
      }
      return {
        ok: true,
        stored: {
          value: toCanonical(r.value, entry.unit),
          enteredValue: r.value,
          enteredUnit: entry.unit,
          inputs: {
            points: Object.fromEntries(names.map((p, i) => [p, values[i]!])),
            unit: entry.unit,
            result: kind,
            highPoint: r.highPoint,
            lowPoint: r.lowPoint,
          },
          textValue: null,
          instrumentReadings: values.map((v) => toCanonical(v, entry.unit)),
        },
      };
    }
    default: {
      const v = parseNumber(entry.value);
      if (v === null) return fail("value", "Enter the value read.");
      if (Number.isNaN(v))
        return fail("value", "Not a number: use digits, a minus sign and one decimal point.");
      try {
        const d = deriveReading(step, { value: v, unit: entry.unit, travelMm: entry.travelMm ?? null });
        const read = step.derivation === "angle_over_distance" ? toCanonical(v, entry.unit) : d.value;
        return {
          ok: true,
          stored: {
            value: d.value,
            enteredValue: v,
            enteredUnit: entry.unit,
            inputs: d.inputs,
            textValue: null,
            instrumentReadings: [read],
          },
        };
      } catch (err) {
        return fail("value", err instanceof Error ? err.message : "The value cannot be used.");
      }
    }
  }
}

/**
 * "Outside the instrument's range": each canonical reading against the instrument's range (in its
 * canonical unit, mm or arcsec); null bounds are open. Names the point when the readings have names.
 */
export function rangeProblem(
  instrument: { serial: string; rangeMin: number | null; rangeMax: number | null },
  readings: readonly number[],
  pointNames?: readonly string[] | null,
): { message: string; point: string | null } | null {
  const { rangeMin: lo, rangeMax: hi } = instrument;
  for (let i = 0; i < readings.length; i++) {
    const v = readings[i]!;
    if ((lo != null && v < lo) || (hi != null && v > hi)) {
      const point = pointNames?.[i] ?? null;
      return {
        point,
        message: `The reading${point ? ` at ${point}` : ""} is outside the instrument's range: ${instrument.serial} reads from ${lo ?? "−∞"} to ${hi ?? "+∞"}.`,
      };
    }
  }
  return null;
}

export interface ShownReading {
  readonly value: number;
  readonly enteredValue: number;
  readonly enteredUnit: string;
  readonly inputs: unknown;
  readonly textValue: string | null;
}

/** A reading as the checklist, the submit summary and the tables show it, per kind (never "1.000 mm" for a yes). */
export function shownValue(step: KindStep, r: ShownReading, system: UnitSystem): string {
  switch (step.derivation) {
    case "check":
      return r.value === 1 ? "Yes" : "No";
    case "note":
      return r.textValue ?? "";
    case "record":
      return `${r.enteredValue} ${r.enteredUnit}`.trim();
    case "multi_point":
      return `${formatValue(r.value, step.quantityKind, system)} ${MULTI_POINT_SHORT[step.pointResult ?? "tir"]}`;
    default:
      return formatValue(r.value, step.quantityKind, system);
  }
}

/**
 * The points of a multi-point reading as "12: 0.002 · 3: −0.001 …" in the entered unit, in the
 * step's order (an object's keys, and jsonb's, do not keep the order they were written in).
 */
export function shownPoints(r: ShownReading, order: readonly string[] | null): string | null {
  const inp = r.inputs as { points?: Record<string, number>; unit?: string } | null;
  if (!inp?.points) return null;
  const pts = inp.points;
  const names = [
    ...(order ?? []).filter((p) => p in pts),
    ...Object.keys(pts).filter((p) => !order?.includes(p)),
  ];
  return names
    .map((p) => `${p}: ${String(pts[p]).replace(/^-/, "−")}`)
    .join(" · ")
    .concat(inp.unit ? ` ${inp.unit === "um" ? "µm" : inp.unit}` : "");
}

/** A canonical instrument range shown in the unit the tablet enters, for the form's hint. */
export function shownRange(lo: number | null, hi: number | null, unit: EntryUnit): string | null {
  if (lo == null && hi == null) return null;
  const f = (v: number | null) => (v == null ? "…" : String(Number(fromCanonical(v, unit).toPrecision(6))));
  return `${f(lo)} to ${f(hi)}`;
}
