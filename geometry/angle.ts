/** Angles from indicator readings over a known distance, and the sine-bar relation. */
import { GeometryError } from "./errors";
import { RAD_PER_ARCSEC, RAD_PER_DEG } from "./units";

export interface ReadingAngle {
  readonly angle_arcsec: number;
  readonly angle_deg: number;
  /** reading / distance, µm per metre. */
  readonly slope_um_per_m: number;
}

/**
 * Angle from one reading change over a known distance (indicating across a block, a bar travelled
 * in Z): θ = atan(reading / distance), reading in µm and distance in mm (right-triangle relation;
 * the reading and the distance are the two legs).
 */
export function angleFromReading(readingUm: number, distanceMm: number): ReadingAngle {
  if (!Number.isFinite(readingUm))
    throw new GeometryError("bad_number", "the reading must be a finite number");
  if (!Number.isFinite(distanceMm) || distanceMm <= 0)
    throw new GeometryError("bad_option", "the distance must be a positive number of mm");
  const readingMm = readingUm / 1000;
  const rad = Math.atan2(readingMm, distanceMm);
  return {
    angle_arcsec: rad / RAD_PER_ARCSEC,
    angle_deg: rad / RAD_PER_DEG,
    slope_um_per_m: (readingMm / distanceMm) * 1e6,
  };
}

/**
 * Gauge-block stack under a sine bar: h = L·sin θ (L = distance between the rolls, mm; θ degrees;
 * h mm). The same relation as the handbook tables of sine-bar constants.
 */
export function sineBarHeightMm(lengthMm: number, angleDeg: number): number {
  if (!Number.isFinite(lengthMm) || lengthMm <= 0)
    throw new GeometryError("bad_option", "the bar length must be positive");
  return lengthMm * Math.sin(angleDeg * RAD_PER_DEG);
}

/** Inverse of sineBarHeightMm: θ = asin(h / L), in degrees. */
export function sineBarAngleDeg(lengthMm: number, heightMm: number): number {
  if (!Number.isFinite(lengthMm) || lengthMm <= 0)
    throw new GeometryError("bad_option", "the bar length must be positive");
  if (!(Math.abs(heightMm) <= lengthMm))
    throw new GeometryError("bad_option", "the stack height cannot exceed the bar length");
  return Math.asin(heightMm / lengthMm) / RAD_PER_DEG;
}
