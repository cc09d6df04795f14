/**
 * Multi-point readings: one indicator read at several named points (clock positions round a
 * collar or a face, or N equal points round a circle), reduced to the one value a step judges.
 * The readings may be in any unit (µm, mm, inch); the value comes back in the same unit, since
 * every result here is linear in the readings.
 */
import { GeometryError } from "./errors";
import { fitSweep } from "./sweep";

/**
 * What is derived from the points (the same words as the procedure's step settings):
 * - tir: total indicator reading, largest minus smallest reading (the definition of run-out as
 *   the full indicator movement, ASME B89.3.4 and ISO 230-1);
 * - mean: the arithmetic mean of the readings;
 * - flatness: peak-to-valley of the readings about the least-squares plane through them. The
 *   points lie on a circle, so the plane is reading(θ) = a + b·cosθ + c·sinθ; it needs four or
 *   more distinct positions (three always fit a plane exactly).
 */
export type MultiPointKind = "tir" | "mean" | "flatness";

export interface MultiPointValue {
  readonly result: MultiPointKind;
  /** The derived value, in the unit the readings were given in. */
  readonly value: number;
  readonly n: number;
  /** The point with the largest reading and the one with the smallest (first of equals). */
  readonly highPoint: string;
  readonly lowPoint: string;
  /** Angle of each point round the circle, degrees clockwise from 12 o'clock. */
  readonly angles_deg: readonly number[];
  /** flatness only: each reading minus the fitted plane, in the readings' unit; else null. */
  readonly residuals: readonly number[] | null;
  readonly notes: readonly string[];
}

const CLOCK = /^(1[0-2]|[1-9])(?::([0-5][0-9]))?$/;

/**
 * The angle of a clock position ("12", "3", "1:30", "10:30") in degrees clockwise from 12
 * o'clock: 30° per hour, 0.5° per minute. Null for a name that is not a clock position.
 */
export function clockAngleDeg(name: string): number | null {
  const m = CLOCK.exec(name.trim());
  if (!m) return null;
  const hours = Number(m[1]) % 12;
  const minutes = m[2] === undefined ? 0 : Number(m[2]);
  return hours * 30 + minutes * 0.5;
}

/**
 * Where the points sit round the circle: clock angles when every name is a clock position,
 * otherwise N equal steps in the order given (the first point at 0°). Equal points are therefore
 * named so they cannot be read as clock positions: "P1" … "PN".
 */
export function multiPointAngles(points: readonly string[]): number[] {
  const clock = points.map(clockAngleDeg);
  if (clock.every((a): a is number => a !== null)) return clock;
  return points.map((_, i) => (360 * i) / points.length);
}

const MIN_POINTS: Record<MultiPointKind, number> = { tir: 2, mean: 1, flatness: 4 };

/**
 * Reduce readings at named points to the step's value. `points` and `values` pair up by index.
 * Throws GeometryError naming the point for a missing or non-finite reading, a repeated point
 * name, or too few points for the result asked for.
 */
export function multiPointValue(
  kind: MultiPointKind,
  points: readonly string[],
  values: readonly number[],
): MultiPointValue {
  if (kind !== "tir" && kind !== "mean" && kind !== "flatness")
    throw new GeometryError("bad_option", `unknown multi-point result "${String(kind)}"`);
  if (points.length !== values.length)
    throw new GeometryError(
      "bad_option",
      `${points.length} points but ${values.length} readings: give one reading per point`,
    );
  const seen = new Set<string>();
  for (const p of points) {
    const key = p.trim();
    if (key === "") throw new GeometryError("bad_option", "a point has no name");
    if (seen.has(key))
      throw new GeometryError("bad_option", `point "${key}" is named twice`, [
        { column: key, message: `point "${key}" is named twice` },
      ]);
    seen.add(key);
  }
  const bad = points
    .map((p, i) => ({ p, v: values[i] }))
    .filter(({ v }) => typeof v !== "number" || !Number.isFinite(v))
    .map(({ p }) => ({ column: p, message: `the reading at point ${p} is missing or not a number` }));
  if (bad.length > 0) throw new GeometryError("bad_number", bad[0]!.message, bad);
  const need = MIN_POINTS[kind];
  if (points.length < need)
    throw new GeometryError(
      "too_few_rows",
      `${kind === "flatness" ? "flatness" : kind === "tir" ? "a TIR" : "a mean"} needs ${need} or more points (got ${points.length})`,
    );

  const n = values.length;
  let hi = 0;
  let lo = 0;
  let sum = 0;
  for (let i = 0; i < n; i++) {
    if (values[i]! > values[hi]!) hi = i;
    if (values[i]! < values[lo]!) lo = i;
    sum += values[i]!;
  }
  const angles = multiPointAngles(points);
  const notes: string[] = [];
  let value: number;
  let residuals: number[] | null = null;
  if (kind === "tir") value = values[hi]! - values[lo]!;
  else if (kind === "mean") value = sum / n;
  else {
    // The least-squares plane through points on a circle is the sweep's a + b·cosθ + c·sinθ
    // (the radius only scales the tilt, not the residuals, so 1 mm serves).
    const fit = fitSweep({ angleDeg: angles, readingUm: values.slice() }, 1);
    if (fit.flatness_ls_um === null)
      throw new GeometryError(
        "too_few_rows",
        "flatness needs readings at 4 or more different positions round the circle",
      );
    value = fit.flatness_ls_um;
    residuals = Array.from(fit.residuals_um);
    notes.push(...fit.notes);
  }
  if (!Number.isFinite(value))
    throw new GeometryError("bad_number", "the readings span more than the number range; check the units");
  return {
    result: kind,
    value,
    n,
    highPoint: points[hi]!.trim(),
    lowPoint: points[lo]!.trim(),
    angles_deg: angles,
    residuals,
    notes,
  };
}
