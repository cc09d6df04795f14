/**
 * Point list CSV `x,y,z` for the per-axis circle fit (other columns are warned about and ignored,
 * so a sphere-probe file can be read as points too). Coordinates in mm or in, converted to mm.
 */
import { readTable, type ColumnSpec, type CsvDecimal, type WithWarnings } from "./table";
import { coordinateFactorToMm, scaleInPlace, type CoordinateUnits } from "./units";

const COLUMNS: readonly ColumnSpec[] = [
  { name: "x", kind: "number", required: true },
  { name: "y", kind: "number", required: true },
  { name: "z", kind: "number", required: true },
];

export interface PointsData {
  readonly rows: number;
  readonly xMm: Float64Array;
  readonly yMm: Float64Array;
  readonly zMm: Float64Array;
  readonly sourceRow: Int32Array;
}

/** Read x, y, z columns (mm). Throws GeometryError on malformed input. */
export function readPointsCsv(
  text: string,
  options: { units: CoordinateUnits; decimal?: CsvDecimal },
): WithWarnings<PointsData> {
  const factor = coordinateFactorToMm(options?.units, "units");
  const t = readTable(text, COLUMNS, { decimal: options?.decimal });
  const col = (k: string) => scaleInPlace(t.numbers.get(k)!, factor, t.sourceRow, t.headerNames.get(k)!);
  return {
    rows: t.rows,
    xMm: col("x"),
    yMm: col("y"),
    zMm: col("z"),
    sourceRow: t.sourceRow,
    warnings: t.warnings,
  };
}
