/**
 * Indicator sweep: an indicator on the spindle swept around a circle of radius r over a face (the
 * table, an adapter collar). Readings at angles θ reveal the face's tilt to the spindle axis.
 */
import { Matrix, solve } from "ml-matrix";
import { assertFiniteFields, GeometryError } from "./errors";
import { pickFields } from "./json";
import { ColumnQr } from "./qr";
import type { NumberColumns, SweepData } from "./types";
import { RAD_PER_ARCSEC, RAD_PER_DEG } from "./units";

export type SweepInput = NumberColumns<SweepData, "angleDeg" | "readingUm">;

export interface SweepResult {
  readonly n: number;
  /** Tilt of the swept face to the sweep plane, √(b² + c²)/r, µm per metre. */
  readonly tilt_um_per_m: number;
  /** atan(√(b² + c²)/r), arc seconds. */
  readonly tilt_arcsec: number;
  /** Angle of the high side: the θ where the fitted reading is largest, atan2(c, b), 0–360°. */
  readonly direction_deg: number;
  /** max − min of the readings, µm. */
  readonly tir_um: number;
  /** Peak-to-valley of the residuals after the least-squares tilt is removed, µm (null: < 4 angles). */
  readonly flatness_ls_um: number | null;
  /** Minimum-zone flatness: smallest peak-to-valley over all tilts, µm (null where not determinable). */
  readonly flatness_mz_um: number | null;
  /** Fitted a (µm), b, c (µm at radius r). */
  readonly a_um: number;
  readonly b_um: number;
  readonly c_um: number;
  readonly residuals_um: Float64Array;
  /** Why a figure is missing or weak (e.g. fewer than 4 distinct angles, a sweep over < 180°). */
  readonly notes: readonly string[];
}

/** Number of distinct angles (radians in [0, 2π), 1e-9 apart; 0 and 2π the same) and the angles in order. */
function distinctAngles(thetaRad: Float64Array): { count: number; sorted: Float64Array } {
  // A numeric sort of a copy (no index array, no comparator): the angles are finite and never −0.
  const sorted = thetaRad.slice().sort();
  let count = 0;
  let prev = NaN;
  for (const t of sorted) {
    if (!(Math.abs(t - prev) < 1e-9)) count++;
    prev = t;
  }
  if (count > 1 && Math.abs(sorted[0]! + 2 * Math.PI - sorted[sorted.length - 1]!) < 1e-9) count--;
  return { count, sorted };
}

/**
 * The row at position k of the rows ordered by angle, ties in row order (the order a stable sort
 * of the row indices by angle gives).
 */
function rowAtSortedPosition(thetaRad: Float64Array, sorted: Float64Array, k: number): number {
  const v = sorted[k]!;
  let first = k;
  while (first > 0 && sorted[first - 1] === v) first--;
  let skip = k - first;
  for (let i = 0; i < thetaRad.length; i++) if (thetaRad[i] === v && skip-- === 0) return i;
  throw new Error("angle not found");
}

/** Largest angular gap between consecutive swept angles (radians), to flag a partial sweep. */
function largestGap(sorted: Float64Array): number {
  let gap = 0;
  for (let k = 1; k < sorted.length; k++) gap = Math.max(gap, sorted[k]! - sorted[k - 1]!);
  return Math.max(gap, sorted[0]! + 2 * Math.PI - sorted[sorted.length - 1]!);
}

/**
 * Minimum-zone (Chebyshev) fit of y ≈ a + b·cosθ + c·sinθ: minimise max |y − p(θ)|; the zone width
 * is twice the minimax error. {1, cos, sin} is a Haar system on the circle, so the optimum is
 * characterised by 4 reference points with alternating errors ±h and found by the exchange
 * (Stiefel / discrete Remez) algorithm (e.g. Cheney, Introduction to Approximation Theory, ch. 2 — reference from memory; the tests
 * check optimality against a brute-force grid instead).
 * Returns the best width found (never above the least-squares width passed in).
 */
function minimumZone(
  theta: Float64Array,
  cosT: Float64Array,
  sinT: Float64Array,
  y: Float64Array,
  sorted: Float64Array,
  lsWidth: number,
): number {
  const n = theta.length;
  const m = sorted.length;
  let ref = [0, Math.floor(m / 4), Math.floor(m / 2), Math.floor((3 * m) / 4)].map((k) =>
    rowAtSortedPosition(theta, sorted, k),
  );
  let best = lsWidth;
  let yScale = 0;
  for (let i = 0; i < n; i++) yScale = Math.max(yScale, Math.abs(y[i]!));
  const tol = 1e-12 * Math.max(yScale, 1e-300);
  const seen = new Set<string>();
  for (let iter = 0; iter < 500; iter++) {
    ref.sort((p, q) => theta[p]! - theta[q]!);
    const key = ref.join(",");
    if (seen.has(key)) break;
    seen.add(key);
    const M = new Matrix(4, 4);
    const rhs = new Matrix(4, 1);
    for (let k = 0; k < 4; k++) {
      const i = ref[k]!;
      M.set(k, 0, 1);
      M.set(k, 1, Math.cos(theta[i]!));
      M.set(k, 2, Math.sin(theta[i]!));
      M.set(k, 3, k % 2 === 0 ? 1 : -1);
      rhs.set(k, 0, y[i]!);
    }
    let s: Matrix;
    try {
      s = solve(M, rhs);
    } catch {
      break;
    }
    const a = s.get(0, 0);
    const b = s.get(1, 0);
    const c = s.get(2, 0);
    const h = s.get(3, 0);
    if (![a, b, c, h].every(Number.isFinite)) break;
    let emax = -Infinity;
    let emin = Infinity;
    let worst = -1;
    let worstAbs = -1;
    for (let i = 0; i < n; i++) {
      const e = y[i]! - (a + b * cosT[i]! + c * sinT[i]!);
      if (e > emax) emax = e;
      if (e < emin) emin = e;
      if (Math.abs(e) > worstAbs) {
        worstAbs = Math.abs(e);
        worst = i;
      }
    }
    best = Math.min(best, emax - emin);
    if (worstAbs <= Math.abs(h) + tol) break;
    // Exchange: put the worst point between its circular neighbours in the reference and drop
    // the neighbour whose error has the same sign, keeping the alternation.
    const ew = y[worst]! - (a + b * Math.cos(theta[worst]!) + c * Math.sin(theta[worst]!));
    const tw = theta[worst]!;
    let pos = 0;
    while (pos < 4 && theta[ref[pos]!]! <= tw) pos++;
    const prevK = (pos + 3) % 4;
    const nextK = pos % 4;
    const signOf = (k: number) => (k % 2 === 0 ? 1 : -1) * Math.sign(h);
    const replaceK = signOf(prevK) === Math.sign(ew) ? prevK : nextK;
    ref = ref.slice();
    ref[replaceK] = worst;
  }
  return best;
}

/**
 * Fit reading(θ) = a + b·cosθ + c·sinθ by least squares (θ in degrees at this edge, reading µm,
 * sweep radius r in mm). The face's tilt is √(b² + c²)/r (µm/mm → ×1000 µm/m; arcsec via atan),
 * its direction atan2(c, b). The trade's check "tilt = TIR / sweep diameter" is the same figure for
 * a flat face (TIR = 2√(b² + c²)). Flatness: least-squares (p-v of the residuals) and minimum zone
 * (minimax over a, b, c). Needs readings at ≥ 3 distinct angles; flatness needs ≥ 4.
 */
export function fitSweep(input: SweepInput, radiusMm: number): SweepResult {
  const n = input.angleDeg.length;
  if (input.readingUm.length !== n)
    throw new GeometryError("bad_option", "angle and reading must have the same length");
  if (!Number.isFinite(radiusMm) || radiusMm <= 0)
    throw new GeometryError("bad_option", "the sweep radius must be a positive number of mm");
  const theta = new Float64Array(n);
  const y = new Float64Array(n);
  let ymin = Infinity;
  let ymax = -Infinity;
  for (let i = 0; i < n; i++) {
    const d = input.angleDeg[i]!;
    const r = input.readingUm[i]!;
    if (!Number.isFinite(d) || !Number.isFinite(r))
      throw new GeometryError("bad_number", `reading ${i + 1} is not finite`);
    const t = (((d % 360) + 360) % 360) * RAD_PER_DEG;
    theta[i] = t;
    y[i] = r;
    if (r < ymin) ymin = r;
    if (r > ymax) ymax = r;
  }
  const { count, sorted } = distinctAngles(theta);
  if (count < 3)
    throw new GeometryError(
      "too_few_rows",
      `a sweep needs readings at 3 or more distinct angles (got ${count})`,
    );

  // Least squares by Householder QR of the n×3 design matrix (./qr.ts: the arithmetic of
  // ml-matrix's QR solve on three columns instead of n row arrays), not normal equations, so a
  // partial sweep is not made worse by squaring its condition number.
  const ones = new Float64Array(n).fill(1);
  const cosT = new Float64Array(n);
  const sinT = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    cosT[i] = Math.cos(theta[i]!);
    sinT[i] = Math.sin(theta[i]!);
  }
  // Readings scaled by a power of two near their largest magnitude (exact), so QR never squares a
  // huge number; the coefficients are scaled back.
  let yAbs = 0;
  for (let i = 0; i < n; i++) yAbs = Math.max(yAbs, Math.abs(y[i]!));
  const Ly = yAbs > 0 ? 2 ** Math.min(1023, Math.ceil(Math.log2(yAbs))) : 1;
  const yScaled = y.map((v) => v / Ly);
  const s = new ColumnQr([ones, cosT.slice(), sinT.slice()], n).solve(yScaled);
  const a = s[0]! * Ly;
  const b = s[1]! * Ly;
  const c = s[2]! * Ly;
  const residuals = new Float64Array(n);
  let rmin = Infinity;
  let rmax = -Infinity;
  for (let i = 0; i < n; i++) {
    const e = y[i]! - (a + b * cosT[i]! + c * sinT[i]!);
    residuals[i] = e;
    if (e < rmin) rmin = e;
    if (e > rmax) rmax = e;
  }
  const notes: string[] = [];
  const amp = Math.hypot(b, c);
  if (!Number.isFinite(rmax - rmin) || !Number.isFinite(ymax - ymin))
    throw new GeometryError("bad_number", "the readings span more than the number range; check the units");
  const gap = largestGap(sorted);
  if (gap > Math.PI) {
    notes.push(
      `the sweep leaves a gap of ${(gap / RAD_PER_DEG).toFixed(0)}°; tilt is weakly determined — sweep the full circle`,
    );
  }
  let flatnessLs: number | null = rmax - rmin;
  let flatnessMz: number | null = null;
  if (count < 4) {
    flatnessLs = null;
    notes.push("3 angles always fit a plane exactly: flatness needs readings at 4 or more distinct angles");
  } else {
    flatnessMz = minimumZone(theta, cosT, sinT, yScaled, sorted, (rmax - rmin) / Ly) * Ly;
  }
  let dir = Math.atan2(c, b) / RAD_PER_DEG;
  if (dir < 0) dir += 360;
  if (amp === 0) dir = 0;
  const result: SweepResult = {
    n,
    tilt_um_per_m: (amp / radiusMm) * 1000,
    tilt_arcsec: Math.atan(amp / (radiusMm * 1000)) / RAD_PER_ARCSEC,
    direction_deg: dir,
    tir_um: ymax - ymin,
    flatness_ls_um: flatnessLs,
    flatness_mz_um: flatnessMz,
    a_um: a,
    b_um: b,
    c_um: c,
    residuals_um: residuals,
    notes,
  };
  assertFiniteFields(result, "the sweep");
  return result;
}

/** The CLI's JSON shape and the stored dataset summary (see geometry/README.md), in this order. */
export function sweepToJson(r: SweepResult) {
  return pickFields(r, [
    "tilt_um_per_m",
    "tilt_arcsec",
    "direction_deg",
    "tir_um",
    "flatness_ls_um",
    "flatness_mz_um",
  ]);
}
