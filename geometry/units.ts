/**
 * Units at the module's edges. Internally geometry/ works in mm and radians.
 * Conversions go through mathjs's unit system so that the definitions are a library's, not ours:
 * 1 in = 25.4 mm exactly (International Yard and Pound Agreement 1959; NIST SP 811 B.8),
 * 1″ = π/648000 rad (definition of the arc second).
 */
import { unit } from "mathjs";

export type LengthUnit = "mm" | "in" | "um";
export type AngleUnit = "deg" | "rad" | "arcsec";

const lengthFactorToMm: Record<LengthUnit, number> = {
  mm: 1,
  in: unit(1, "inch").toNumber("mm"),
  um: unit(1, "um").toNumber("mm"),
};
const angleFactorToRad: Record<AngleUnit, number> = {
  rad: 1,
  deg: unit(1, "deg").toNumber("rad"),
  arcsec: unit(1, "arcsec").toNumber("rad"),
};

/** Exact factors as numbers, for the tight loops that cannot call mathjs per element. */
export const MM_PER_INCH = lengthFactorToMm.in;
export const UM_PER_MM = 1000;
export const RAD_PER_DEG = angleFactorToRad.deg;
export const RAD_PER_ARCSEC = angleFactorToRad.arcsec;

export function toMm(value: number, from: LengthUnit): number {
  return from === "mm" ? value : value * lengthFactorToMm[from];
}
export function fromMm(valueMm: number, to: LengthUnit): number {
  return to === "mm" ? valueMm : valueMm / lengthFactorToMm[to];
}
export function toRad(value: number, from: AngleUnit): number {
  return from === "rad" ? value : value * angleFactorToRad[from];
}
export function fromRad(valueRad: number, to: AngleUnit): number {
  return to === "rad" ? valueRad : valueRad / angleFactorToRad[to];
}
/** A slope (dimensionless, e.g. µm per mm ÷ 1000) expressed in µm/m. */
export function slopeToUmPerM(slope: number): number {
  return slope * 1e6;
}
