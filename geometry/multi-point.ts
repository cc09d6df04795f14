/**
 * Multi-point readings: one indicator read at several named points (clock positions round a
 * collar or a face, or N equal points), reduced to the one value a step judges. The readings may
 * be in any length unit; the value comes back in the same unit (every result is linear in them).
 */
import { GeometryError } from "./errors";

export type MultiPointKind = "tir" | "mean" | "flatness";

export interface MultiPointValue {
  readonly result: MultiPointKind;
  /** The derived value, in the unit the readings were given in. */
  readonly value: number;
  readonly n: number;
  /** The point with the largest reading and the one with the smallest (first of equals). */
  readonly highPoint: string;
  readonly lowPoint: string;
}

const MIN_POINTS: Record<MultiPointKind, number> = { tir: 2, mean: 1, flatness: 4 };

/** Angle of a clock position ("12", "3", "1:30") in degrees clockwise from 12, else null. */
function clockAngleDeg(name: string): number | null {
  const m = /^(1[0-2]|[1-9])(?::([0-5][0-9]))?$/.exec(name.trim());
  if (!m) return null;
  return (Number(m[1]) % 12) * 30 + (m[2] === undefined ? 0 : Number(m[2])) * 0.5;
}

/**
 * Peak-to-valley of the readings about the least-squares plane through points on a circle,
 * reading(θ) = a + b·cosθ + c·sinθ, solved by the 3×3 normal equations.
 */
function flatnessAboutPlane(points: readonly string[], values: readonly number[]): number {
  const clock = points.map(clockAngleDeg);
  const deg = clock.every((a) => a !== null)
    ? (clock as number[])
    : points.map((_, i) => (360 * i) / points.length);
  const rows = deg.map((d) => [1, Math.cos((d * Math.PI) / 180), Math.sin((d * Math.PI) / 180)]);
  const A = [0, 1, 2].map((i) => [0, 1, 2].map((j) => rows.reduce((s, r) => s + r[i]! * r[j]!, 0)));
  const b = [0, 1, 2].map((i) => rows.reduce((s, r, k) => s + r[i]! * values[k]!, 0));
  // Gaussian elimination with partial pivoting.
  for (let c = 0; c < 3; c++) {
    let p = c;
    for (let r = c + 1; r < 3; r++) if (Math.abs(A[r]![c]!) > Math.abs(A[p]![c]!)) p = r;
    if (Math.abs(A[p]![c]!) < 1e-12)
      throw new GeometryError("degenerate", "flatness needs readings at 4 or more different positions");
    [A[c], A[p]] = [A[p]!, A[c]!];
    [b[c], b[p]] = [b[p]!, b[c]!];
    for (let r = c + 1; r < 3; r++) {
      const f = A[r]![c]! / A[c]![c]!;
      for (let k = c; k < 3; k++) A[r]![k]! -= f * A[c]![k]!;
      b[r]! -= f * b[c]!;
    }
  }
  const x = [0, 0, 0];
  for (let r = 2; r >= 0; r--)
    x[r] = (b[r]! - [0, 1, 2].slice(r + 1).reduce((s, k) => s + A[r]![k]! * x[k]!, 0)) / A[r]![r]!;
  const res = rows.map((r, k) => values[k]! - (x[0]! * r[0]! + x[1]! * r[1]! + x[2]! * r[2]!));
  return Math.max(...res) - Math.min(...res);
}

/**
 * Reduce readings at named points to the step's value: tir = largest − smallest (run-out as the
 * full indicator movement, ASME B89.3.4, ISO 230-1), mean, or flatness about the best-fit plane.
 * Throws GeometryError naming the point for a missing or non-finite reading.
 */
export function multiPointValue(
  kind: MultiPointKind,
  points: readonly string[],
  values: readonly number[],
): MultiPointValue {
  if (points.length !== values.length)
    throw new GeometryError("bad_option", `${points.length} points but ${values.length} readings`);
  const bad = points.findIndex((_, i) => typeof values[i] !== "number" || !Number.isFinite(values[i]));
  if (bad >= 0)
    throw new GeometryError("bad_number", `the reading at point ${points[bad]} is missing or not a number`, [
      { column: points[bad], message: `the reading at point ${points[bad]} is missing or not a number` },
    ]);
  if (points.length < MIN_POINTS[kind])
    throw new GeometryError("too_few_rows", `${kind} needs ${MIN_POINTS[kind]} or more points`);
  let hi = 0;
  let lo = 0;
  for (let i = 1; i < values.length; i++) {
    if (values[i]! > values[hi]!) hi = i;
    if (values[i]! < values[lo]!) lo = i;
  }
  const value =
    kind === "tir"
      ? values[hi]! - values[lo]!
      : kind === "mean"
        ? values.reduce((s, v) => s + v, 0) / values.length
        : flatnessAboutPlane(points, values);
  return { result: kind, value, n: values.length, highPoint: points[hi]!, lowPoint: points[lo]! };
}
