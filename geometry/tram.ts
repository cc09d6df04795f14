/**
 * Indicator tram: readings taken along a travel (an indicator on the spindle while one machine
 * axis moves, or the head's face indicated along a straight edge).
 */
import { GeometryError } from "./errors";
import { RAD_PER_ARCSEC } from "./units";

export interface TramInput {
  readonly travelMm: ArrayLike<number>;
  readonly readingUm: ArrayLike<number>;
}

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
  let sx = 0;
  let sy = 0;
  let ymin = Infinity;
  let ymax = -Infinity;
  for (let i = 0; i < n; i++) {
    const yi = y[i]!;
    if (!Number.isFinite(x[i]!) || !Number.isFinite(yi))
      throw new GeometryError("bad_number", `row ${i + 1} is not finite`);
    sx += x[i]!;
    sy += yi;
    if (yi < ymin) ymin = yi;
    if (yi > ymax) ymax = yi;
  }
  const mx = sx / n;
  const my = sy / n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i]! - mx;
    sxx += dx * dx;
    sxy += dx * (y[i]! - my);
  }
  if (!(sxx > 0))
    throw new GeometryError("degenerate", "all readings are at the same travel; the slope is undefined");
  const b = sxy / sxx;
  const a = my - b * mx;
  const residuals = new Float64Array(n);
  let sse = 0;
  let rmin = Infinity;
  let rmax = -Infinity;
  for (let i = 0; i < n; i++) {
    const e = y[i]! - (a + b * x[i]!);
    residuals[i] = e;
    sse += e * e;
    if (e < rmin) rmin = e;
    if (e > rmax) rmax = e;
  }
  const s = Math.sqrt(sse / (n - 2));
  return {
    n,
    slope_um_per_m: b * 1000,
    slope_u_um_per_m: (s / Math.sqrt(sxx)) * 1000,
    angle_arcsec: Math.atan(b / 1000) / RAD_PER_ARCSEC,
    intercept_um: a,
    intercept_u_um: s * Math.sqrt(1 / n + (mx * mx) / sxx),
    residual_sd_um: s,
    straightness_um: rmax - rmin,
    tir_um: ymax - ymin,
    residuals_um: residuals,
  };
}
