/** Unit options of the CSV readers, checked at run time because the app passes user choices. */
import { GeometryError } from "../errors";
import { MM_PER_INCH, UM_PER_MM } from "../units";
import { fail, MAX_ISSUES, type CodedIssue } from "./table";

export type CoordinateUnits = "mm" | "in";
export type ReadingUnits = "um" | "mm" | "in";

/** Factor from a coordinate unit to mm: 1 in = 25.4 mm exactly (NIST SP 811). */
export function coordinateFactorToMm(units: unknown, option: string): number {
  if (units === "mm") return 1;
  if (units === "in") return MM_PER_INCH;
  throw new GeometryError("bad_option", `${option} must be "mm" or "in", not '${String(units)}'`);
}

/**
 * Factor from an indicator reading unit to µm: 1 mm = 1000 µm; 1 in = 25 400 µm exactly
 * (NIST SP 811; 25.4 × 1000 is exact in binary64 here, checked in tests/unit/geometry/units.test.ts).
 */
export function readingFactorToUm(units: unknown, option: string): number {
  if (units === "um" || units === "µm") return 1;
  if (units === "mm") return UM_PER_MM;
  if (units === "in") return MM_PER_INCH * UM_PER_MM;
  throw new GeometryError("bad_option", `${option} must be "um", "mm" or "in", not '${String(units)}'`);
}

/**
 * Multiply every element in place (skipping the work for a factor of exactly 1). A value that
 * overflows to ±Infinity in the conversion is an error naming its row and column.
 */
export function scaleInPlace(
  a: Float64Array,
  factor: number,
  sourceRow: Int32Array,
  column: string,
): Float64Array {
  if (factor === 1) return a;
  const issues: CodedIssue[] = [];
  for (let i = 0; i < a.length; i++) {
    const v = a[i]! * factor;
    if (!Number.isFinite(v) && issues.length < MAX_ISSUES) {
      issues.push({
        code: "bad_number",
        row: sourceRow[i],
        column,
        message: `'${a[i]}' is out of range after unit conversion`,
      });
    }
    a[i] = v;
  }
  if (issues.length > 0) fail(issues);
  return a;
}
