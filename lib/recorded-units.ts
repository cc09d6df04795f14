/**
 * Units as recorded (ISO/IEC 17025:2017 §7.8.2.1: results with their units of measurement as the
 * work recorded them). A job whose length readings were entered in inch reports in inch with mm
 * beside; limits print in the job's unit; the decimals follow the instrument's resolution; an
 * undefined value prints "—" with the reason, never "0.000". Pure functions over canonical values
 * (mm for lengths, arc seconds for angles); conversions through lib/units (1 in = 25.4 mm exactly,
 * NIST SP 811).
 */
import {
  displayUnit,
  formatLimits,
  fromCanonical,
  roundForDisplay,
  UNIT_DECIMALS,
  type EntryUnit,
  type QuantityKind,
  type UnitSystem,
} from "@/lib/units";

/**
 * The unit system the job's length readings were entered in: inch when more of them were entered
 * in inch than in mm or µm (ties go to metric, the canonical unit); metric when none are lengths.
 */
export function recordedUnitSystem(enteredUnits: readonly string[]): UnitSystem {
  const inch = enteredUnits.filter((u) => u === "in").length;
  const metric = enteredUnits.filter((u) => u === "mm" || u === "um").length;
  return inch > metric ? "inch" : "metric";
}

/**
 * Decimals that show one step of the instrument's resolution in the display unit: 0.0001 in → 4,
 * 0.001 mm → 3, 0.0005 mm → 4, 0.01 mm → 2 (and 0.000394 in → 4 when that gauge is read in inch),
 * 0.1″ → 1. Without a resolution, the unit's usual
 * decimals (lib/units UNIT_DECIMALS). Clamped to 0…6.
 */
export function decimalsForResolution(
  resolutionCanonical: number | null | undefined,
  unit: EntryUnit,
): number {
  if (resolutionCanonical == null || !(resolutionCanonical > 0) || !Number.isFinite(resolutionCanonical))
    return UNIT_DECIMALS[unit];
  // The decimal place of the resolution's first significant digit: 0.01 mm = 0.000394 in → 4.
  const r = Number(fromCanonical(resolutionCanonical, unit).toPrecision(12));
  return Math.min(6, Math.max(0, -Math.floor(Math.log10(r) + 1e-9)));
}

/** mm decimals shown beside an inch value: one fewer than the inch decimals (0.0001 in ≈ 0.003 mm), at least 3. */
const mmBeside = (inchDecimals: number) => Math.max(3, inchDecimals - 1);

function withUnit(s: string, unit: EntryUnit): string {
  const t = s.replace(/^-/, "−");
  return unit === "arcsec" ? `${t}″` : `${t} ${unit === "um" ? "µm" : unit}`;
}

/** A canonical value at `decimals` in `unit`, optionally with an explicit sign. */
function at(value: number, unit: EntryUnit, decimals: number, signed: boolean): string {
  const shown = fromCanonical(value, unit);
  let s = roundForDisplay(shown, unit, decimals - UNIT_DECIMALS[unit]);
  if (signed && !s.startsWith("-") && Number(s) !== 0) s = `+${s}`;
  return withUnit(s, unit);
}

/**
 * A recorded value as the report prints it: "0.0003 in (0.008 mm)" for an inch job, "0.008 mm"
 * for a metric one, "10.3″" for an angle. `resolution` (canonical) sets the decimals.
 */
export function formatRecorded(
  canonical: number | null | undefined,
  kind: QuantityKind,
  system: UnitSystem,
  opts: { resolution?: number | null; signed?: boolean } = {},
): string {
  if (canonical == null || !Number.isFinite(canonical)) return "—";
  const unit = displayUnit(kind, system);
  const d = decimalsForResolution(opts.resolution, unit);
  const main = at(canonical, unit, d, opts.signed ?? false);
  return unit === "in" ? `${main} (${at(canonical, "mm", mmBeside(d), opts.signed ?? false)})` : main;
}

/**
 * A limit pair in the job's unit, exact as the procedure set it (no "± 0.01016 mm" for a
 * 0.0004 in limit): "± 0.0004 in (± 0.01016 mm)" for an inch job, "≤ 0.010 mm" for a metric one.
 */
export function formatRecordedLimits(
  lower: number | null,
  upper: number | null,
  kind: QuantityKind,
  system: UnitSystem,
): string {
  const main = formatLimits(lower, upper, kind, system);
  if (displayUnit(kind, system) !== "in" || (lower == null && upper == null)) return main;
  return `${main} (${formatLimits(lower, upper, kind, "metric")})`;
}

/**
 * An expanded uncertainty as printed: "± 0.0002 in (± 0.005 mm)", or "—" with the reason when it
 * is not defined (no instrument named, or no uncertainty stated): never "0.000".
 */
export function formatExpanded(
  U: number | null | undefined,
  kind: QuantityKind,
  system: UnitSystem,
  opts: { resolution?: number | null; reason?: string } = {},
): string {
  if (U == null || !Number.isFinite(U) || U <= 0)
    return `— (${opts.reason ?? "no uncertainty stated for the instrument"})`;
  const unit = displayUnit(kind, system);
  // One more decimal than the reading, so a U below one resolution step is not shown as zero.
  const d = Math.min(6, decimalsForResolution(opts.resolution, unit) + 1);
  const main = `± ${at(U, unit, d, false)}`;
  return unit === "in" ? `${main} (± ${at(U, "mm", mmBeside(d), false)})` : main;
}

/** An angle's expanded uncertainty in arc seconds (test part rows in degrees print their U in ″): "± 3.6″". */
export function formatAngleExpandedArcsec(U: number | null | undefined, unit: "deg" | "arcsec"): string {
  if (U == null || !Number.isFinite(U) || U <= 0) return "— (not stated)";
  const arcsec = unit === "deg" ? U * 3600 : U;
  return `± ${arcsec.toFixed(1)}″`;
}
