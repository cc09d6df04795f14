/**
 * Display units for checklist values. Values are stored canonically (mm for length, arcsec for
 * angle) and shown in the user's unit system: inch to tenths (0.0001 in), metric to 0.001 mm,
 * angles in arc seconds to 0.1″ with µm/m beside them. Conversions use geometry's exact factors
 * (1 in = 25.4 mm exactly, NIST SP 811), so there is one definition in the product.
 */
import { fromMm, MM_PER_INCH, RAD_PER_ARCSEC, toMm } from "@/geometry/units";

import type { QuantityKind, UnitSystem } from "@/lib/domain/units";

export type { QuantityKind, UnitSystem };
export type EntryUnit = "mm" | "in" | "um" | "arcsec";

export const CANONICAL_UNIT: Record<QuantityKind, "mm" | "arcsec"> = { length: "mm", angle: "arcsec" };

/** The unit a person of this unit system enters and reads for a quantity kind. */
export function displayUnit(kind: QuantityKind, system: UnitSystem): EntryUnit {
  if (kind === "angle") return "arcsec";
  return system === "inch" ? "in" : "mm";
}

/** Decimals shown for a unit: tenths of a thou for inch, a micrometre for mm, 0.1″ for angles. */
export const UNIT_DECIMALS: Record<EntryUnit, number> = { in: 4, mm: 3, um: 1, arcsec: 1 };
export const UNIT_SYMBOL = { in: "in", mm: "mm", um: "µm", arcsec: "″" } as const satisfies Record<
  EntryUnit,
  string
>;

/** Entered value → canonical value (mm or arcsec). */
export function toCanonical(value: number, unit: EntryUnit): number {
  if (unit === "arcsec") return value;
  return toMm(value, unit);
}

/** Canonical value (mm or arcsec) → the given display unit. */
export function fromCanonical(value: number, unit: EntryUnit): number {
  if (unit === "arcsec") return value;
  return fromMm(value, unit);
}

export function unitKind(unit: EntryUnit): QuantityKind {
  return unit === "arcsec" ? "angle" : "length";
}

/**
 * Rounds half away from zero at the unit's decimals, on the decimal string (not binary floats),
 * so 0.00005 in shows as 0.0001 and −0.00005 as −0.0001, and −0 never appears.
 */
export function roundForDisplay(value: number, unit: EntryUnit, extraDecimals = 0): string {
  if (!Number.isFinite(value)) return "—";
  const d = UNIT_DECIMALS[unit] + extraDecimals;
  const sign = value < 0 ? -1 : 1;
  // toPrecision(15) removes binary noise (25.4 × 0.0001 / 25.4 = 9.9999…e-5) before rounding.
  const abs = Number(Math.abs(value).toPrecision(15));
  const scaled = Math.round(Number(`${abs}e${d}`));
  const out = Number(`${scaled}e-${d}`).toFixed(d);
  return sign < 0 && scaled !== 0 ? `-${out}` : out;
}

/** Canonical value formatted in the display unit with its symbol, e.g. "0.0005 in", "12.700 mm", "10.3″". */
export function formatValue(
  canonical: number | null | undefined,
  kind: QuantityKind,
  system: UnitSystem,
  opts: { signed?: boolean; exact?: boolean } = {},
): string {
  if (canonical == null || !Number.isFinite(canonical)) return "—";
  const unit = displayUnit(kind, system);
  const shown = fromCanonical(canonical, unit);
  // A limit is shown exactly (up to two more decimals) so 12.7 µm reads 0.0127 mm, not 0.013 mm.
  let extra = 0;
  while (
    opts.exact &&
    extra < 2 &&
    Math.abs(Number(roundForDisplay(shown, unit, extra)) - shown) > 1e-12 * Math.max(1, Math.abs(shown))
  )
    extra++;
  let s = roundForDisplay(shown, unit, extra);
  if (opts.signed && !s.startsWith("-") && Number(s) !== 0) s = `+${s}`;
  s = s.replace(/^-/, "−");
  return unit === "arcsec" ? `${s}″` : `${s} ${UNIT_SYMBOL[unit]}`;
}

/** An angle in arc seconds as the slope people think in, µm/m (1″ = 4.8481 µm/m). */
export function arcsecToUmPerM(arcsec: number): number {
  return Math.tan(arcsec * RAD_PER_ARCSEC) * 1e6;
}

/** A limit pair as text in the display unit: "≤ 0.0005 in", "0.0625 to 0.1250 in", "± 5.0″". */
export function formatLimits(
  lower: number | null,
  upper: number | null,
  kind: QuantityKind,
  system: UnitSystem,
): string {
  const f = (v: number) => formatValue(v, kind, system, { exact: true });
  const bare = (v: number) => f(v).replace(/ ?(in|mm|″)$/, "");
  if (lower != null && upper != null)
    return lower === -upper ? `± ${f(upper)}` : `${bare(lower)} to ${f(upper)}`;
  if (upper != null) return `≤ ${f(upper)}`;
  if (lower != null) return `≥ ${f(lower)}`;
  return "no limit";
}

export { MM_PER_INCH };
