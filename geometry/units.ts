/**
 * Units at the module's edges. Internally geometry/ works in mm and radians.
 * The factors are the definitions themselves, written once here:
 * 1 in = 25.4 mm exactly (International Yard and Pound Agreement 1959; NIST SP 811 B.8),
 * 1° = π/180 rad and 1″ = π/648000 rad (definitions of the degree and the arc second).
 * tests/unit/geometry/units.test.ts checks each against mathjs's unit system, an independent
 * library, so no table of ours goes unchecked; importing mathjs here instead would put all of it
 * into every page and the CLI's start-up for four numbers.
 */

export type LengthUnit = "mm" | "in" | "um";
export type AngleUnit = "deg" | "rad" | "arcsec";

const lengthFactorToMm: Record<LengthUnit, number> = {
  mm: 1,
  in: 25.4,
  um: 1e-3,
};
const angleFactorToRad: Record<AngleUnit, number> = {
  rad: 1,
  deg: Math.PI / 180,
  arcsec: Math.PI / 648000,
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
