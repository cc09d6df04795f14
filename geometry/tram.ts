/**
 * Indicator tram: readings taken along a travel (an indicator on the spindle while one machine
 * axis moves, or the head's face indicated along a straight edge).
 */
import { assertFiniteFields, GeometryError } from "./errors";
import { pickFields } from "./json";
import type { NumberColumns, TramData } from "./types";
import { RAD_PER_ARCSEC } from "./units";

export type TramInput = NumberColumns<TramData, "travelMm" | "readingUm">;

export interface TramResult {
  readonly n: number;
  /** Slope of reading vs travel, µm per metre of travel (= µm/mm × 1000). */
  readonly slope_um_per_m: number;
  /** Standard uncertainty of the slope from the residual scatter, µm/m. */
  readonly slope_u_um_per_m: number;
  /** atan(slope), arc seconds. */
  readonly angle_arcsec: number;
  /** Reading of the fitted line at travel 0, µm, and its standard uncertainty. */
  readonly intercept_um: number;
  readonly intercept_u_um: number;
  /** Residual standard deviation s = √(Σe²/(n−2)), µm. */
  readonly residual_sd_um: number;
  /** Peak-to-valley of the residuals about the fitted line, µm. */
  readonly straightness_um: number;
  /** Total indicator reading: max − min of the readings, µm. */
  readonly tir_um: number;
  readonly residuals_um: Float64Array;
}

/**
 * Least-squares line reading = a + b·travel (travel mm, reading µm), by centred sums
 * (two passes, for accuracy on data like NIST StRD "Norris"):
 *   b = Sxy/Sxx, a = ȳ − b·x̄, s² = Σe²/(n−2), u(b) = s/√Sxx, u(a) = s·√(1/n + x̄²/Sxx)
 * (ordinary least squares, e.g. NIST/SEMATECH e-Handbook §4.1.4.1). The slope b is in µm/mm, so
 * b × 1000 is µm/m and the angle is atan(b / 1000) rad. Needs ≥ 3 rows and two distinct travels.
 */
export function fitTram(input: TramInput): TramResult {
  const x = input.travelMm;
  const y = input.readingUm;
  const n = x.length;
  if (y.length !== n) throw new GeometryError("bad_option", "travel and reading must have the same length");
  if (n < 3) throw new GeometryError("too_few_rows", `a tram needs at least 3 readings (got ${n})`);
  // Work on x/Lx and y/Ly with Lx, Ly powers of two near the largest magnitudes: exact scaling (the
  // figures are bit-identical to unscaled sums in the normal range) and no overflow for any finite input.
  let xmax = 0;
  let ymaxAbs = 0;
  let ymin = Infinity;
  let ymax = -Infinity;
  for (let i = 0; i < n; i++) {
    const yi = y[i]!;
    if (!Number.isFinite(x[i]!) || !Number.isFinite(yi))
      throw new GeometryError("bad_number", `row ${i + 1} is not finite`);
    xmax = Math.max(xmax, Math.abs(x[i]!));
    ymaxAbs = Math.max(ymaxAbs, Math.abs(yi));
    if (yi < ymin) ymin = yi;
    if (yi > ymax) ymax = yi;
  }
  const Lx = pow2Scale(xmax);
  const Ly = pow2Scale(ymaxAbs);
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    sx += x[i]! / Lx;
    sy += y[i]! / Ly;
  }
  const mx = sx / n;
  const my = sy / n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i]! / Lx - mx;
    sxx += dx * dx;
    sxy += dx * (y[i]! / Ly - my);
  }
  if (!(sxx > 0))
    throw new GeometryError(
      "degenerate",
      "all readings are at the same travel; the slope is undefined — read along the travel",
    );
  const b = sxy / sxx; // in (Ly/Lx) units
  const a = my - b * mx; // in Ly units
  const residuals = new Float64Array(n);
  let sse = 0;
  let rmin = Infinity;
  let rmax = -Infinity;
  for (let i = 0; i < n; i++) {
    const e = y[i]! / Ly - (a + b * (x[i]! / Lx));
    residuals[i] = e * Ly;
    sse += e * e;
    if (e < rmin) rmin = e;
    if (e > rmax) rmax = e;
  }
  const s = Math.sqrt(sse / (n - 2));
  const slope = (b * Ly) / Lx; // µm/mm
  const result: TramResult = {
    n,
    slope_um_per_m: slope * 1000,
    slope_u_um_per_m: ((s / Math.sqrt(sxx)) * Ly * 1000) / Lx,
    angle_arcsec: Math.atan2(b * Ly, 1000 * Lx) / RAD_PER_ARCSEC,
    intercept_um: a * Ly,
    intercept_u_um: s * Math.sqrt(1 / n + (mx * mx) / sxx) * Ly,
    residual_sd_um: s * Ly,
    straightness_um: (rmax - rmin) * Ly,
    tir_um: ymax - ymin,
    residuals_um: residuals,
  };
  assertFiniteFields(result, "the tram");
  return result;
}

/** The CLI's JSON shape and the stored dataset summary (see geometry/README.md), in this order. */
export function tramToJson(r: TramResult) {
  return pickFields(r, ["slope_um_per_m", "slope_u_um_per_m", "angle_arcsec", "straightness_um", "tir_um"]);
}

/** The power of two nearest above m (1 for 0), so that dividing by it is exact. */
function pow2Scale(m: number): number {
  if (!(m > 0)) return 1;
  return 2 ** Math.min(1023, Math.ceil(Math.log2(m)));
}

export type TramPlane = "XZ" | "YZ";

export interface TramPlaneInput extends TramInput {
  /** Plane of each row (XZ or YZ). */
  readonly plane: readonly TramPlane[];
  /** Bar position of each row, 0 or 180 degrees; absent = one position (0). */
  readonly barDeg?: ArrayLike<number>;
}

export interface TramPlaneResult {
  readonly plane: TramPlane;
  /** Spindle tram in this plane: mean of the two bar positions' slopes (the bar's run-out cancels), µm/m. */
  readonly slope_um_per_m: number;
  /** Expanded uncertainty (k = 2) of that slope, from the fits' residual scatter, µm/m. */
  readonly slope_U_um_per_m: number;
  readonly angle_arcsec: number;
  /** Half the difference of the two positions' slopes: the bar's own run-out and bend, µm/m. Absent without both positions. */
  readonly bar_um_per_m?: number;
  /** Fits per bar position (0, then 180 when present). */
  readonly positions: readonly { readonly bar_deg: number; readonly fit: TramResult }[];
}

/**
 * Tram in two planes with the bar reversed: per plane, a line fit (fitTram) per bar position; the
 * spindle's tram is the mean of the 0° and 180° slopes (turning the bar by 180° flips the sign of
 * its own run-out and bend, not of the spindle's tilt), half their difference is the bar's part.
 * U = 2·u with u = ½·√(u₀² + u₁₈₀²) (independent fits; JCGM 100, sum of two inputs with c = ½).
 * With one bar position in a plane its slope stands alone, with a warning. Errors name the row.
 */
export function fitTramPlanes(input: TramPlaneInput): { planes: TramPlaneResult[]; warnings: string[] } {
  const n = input.travelMm.length;
  if (input.plane.length !== n || input.readingUm.length !== n || (input.barDeg && input.barDeg.length !== n))
    throw new GeometryError("bad_option", "travel, reading, plane and bar_deg must have the same length");
  const groups = new Map<string, { x: number[]; y: number[] }>();
  for (let i = 0; i < n; i++) {
    const plane = input.plane[i];
    const bar = input.barDeg ? input.barDeg[i]! : 0;
    if (plane !== "XZ" && plane !== "YZ")
      throw new GeometryError("bad_value", `row ${i + 1}: plane must be XZ or YZ`, [
        { row: i + 1, column: "plane", message: `'${String(plane)}' is not XZ or YZ` },
      ]);
    if (bar !== 0 && bar !== 180)
      throw new GeometryError("bad_value", `row ${i + 1}: bar_deg must be 0 or 180`, [
        { row: i + 1, column: "bar_deg", message: `'${bar}' is not 0 or 180` },
      ]);
    const key = `${plane}:${bar}`;
    let g = groups.get(key);
    if (!g) groups.set(key, (g = { x: [], y: [] }));
    g.x.push(input.travelMm[i]!);
    g.y.push(input.readingUm[i]!);
  }
  const warnings: string[] = [];
  const planes: TramPlaneResult[] = [];
  for (const plane of ["XZ", "YZ"] as const) {
    const positions: { bar_deg: number; fit: TramResult }[] = [];
    for (const bar of [0, 180]) {
      const g = groups.get(`${plane}:${bar}`);
      if (!g) continue;
      try {
        positions.push({ bar_deg: bar, fit: fitTram({ travelMm: g.x, readingUm: g.y }) });
      } catch (e) {
        if (e instanceof GeometryError)
          throw new GeometryError(e.code, `plane ${plane}, bar at ${bar}°: ${e.message}`);
        throw e;
      }
    }
    if (positions.length === 0) continue;
    const slopes = positions.map((p) => p.fit.slope_um_per_m);
    const us = positions.map((p) => p.fit.slope_u_um_per_m);
    let slope: number;
    let u: number;
    let bar: number | undefined;
    if (positions.length === 2) {
      slope = slopes[0]! / 2 + slopes[1]! / 2;
      bar = slopes[0]! / 2 - slopes[1]! / 2;
      u = 0.5 * Math.hypot(us[0]!, us[1]!);
    } else {
      slope = slopes[0]!;
      u = us[0]!;
      warnings.push(
        `plane ${plane}: the bar was read at ${positions[0]!.bar_deg}° only; its own run-out is not cancelled — read it at 0° and 180°`,
      );
    }
    const r: TramPlaneResult = {
      plane,
      slope_um_per_m: slope,
      slope_U_um_per_m: 2 * u,
      angle_arcsec: Math.atan(slope / 1e6) / RAD_PER_ARCSEC,
      ...(bar !== undefined ? { bar_um_per_m: bar } : {}),
      positions,
    };
    for (const v of [r.slope_um_per_m, r.slope_U_um_per_m, r.angle_arcsec, bar ?? 0])
      if (!Number.isFinite(v))
        throw new GeometryError(
          "bad_number",
          `plane ${plane}: the slope is beyond the number range; check the units`,
        );
    planes.push(r);
  }
  return { planes, warnings };
}
