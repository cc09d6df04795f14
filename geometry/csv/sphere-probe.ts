/**
 * Sphere-probe CSV: `primary_deg,secondary_deg,x,y,z` (+ optional `point,repeat,temp_c,tool_mm`).
 * One row per probed pose: the commanded primary and secondary angles (degrees) and the measured
 * sphere centre in machine coordinates, in the unit the caller chose (mm or in; converted to mm).
 * `tool_mm` is in mm whatever the coordinate unit (its name carries the unit).
 */
import type { SphereProbeData } from "../types";
import { SPHERE_PROBE_COLUMNS } from "./columns";
import { fail, MAX_ISSUES, readTable, type CodedIssue, type CsvDecimal, type WithWarnings } from "./table";
import { coordinateFactorToMm, scaleInPlace, type CoordinateUnits } from "./units";

/** Tool lengths a row may state, mm (a tool outside this range is a typing or unit error). */
export const TOOL_MM_MIN = 0;
export const TOOL_MM_MAX = 2000;

export interface SphereProbeCsvOptions {
  /** Unit of the x, y, z columns. */
  readonly units: CoordinateUnits;
  /** Decimal separator; "comma" only with a semicolon delimiter. Default "point". */
  readonly decimal?: CsvDecimal;
}

/**
 * Read a sphere-probe CSV into mm / degree columns. Throws GeometryError (issues name row and
 * column) on any malformed input; unknown columns come back as warnings on the result.
 */
export function readSphereProbeCsv(
  text: string,
  options: SphereProbeCsvOptions,
): WithWarnings<SphereProbeData> {
  const factor = coordinateFactorToMm(options?.units, "units");
  const t = readTable(text, SPHERE_PROBE_COLUMNS, { decimal: options?.decimal });
  const num = (k: string) => t.numbers.get(k);
  const tool = num("tool_mm");
  if (tool) {
    const issues: CodedIssue[] = [];
    for (let i = 0; i < tool.length && issues.length < MAX_ISSUES; i++)
      if (!(tool[i]! >= TOOL_MM_MIN && tool[i]! <= TOOL_MM_MAX))
        issues.push({
          code: "bad_value",
          row: t.sourceRow[i],
          column: t.headerNames.get("tool_mm"),
          message: `tool length ${tool[i]} mm is outside ${TOOL_MM_MIN} … ${TOOL_MM_MAX} mm`,
        });
    if (issues.length > 0) fail(issues);
  }
  return {
    rows: t.rows,
    primaryDeg: num("primary_deg")!,
    secondaryDeg: num("secondary_deg")!,
    xMm: scaleInPlace(num("x")!, factor, t.sourceRow, t.headerNames.get("x")!),
    yMm: scaleInPlace(num("y")!, factor, t.sourceRow, t.headerNames.get("y")!),
    zMm: scaleInPlace(num("z")!, factor, t.sourceRow, t.headerNames.get("z")!),
    ...(num("tool_mm") ? { toolMm: num("tool_mm") } : {}),
    ...(num("point") ? { point: num("point") } : {}),
    ...(num("repeat") ? { repeat: num("repeat") } : {}),
    ...(num("temp_c") ? { tempC: num("temp_c") } : {}),
    sourceRow: t.sourceRow,
    warnings: t.warnings,
  };
}
