/**
 * Indicator sweep CSV: `angle_deg,reading`. Reading in µm, mm or in as the caller chose (converted
 * to µm); the sweep radius is entered separately.
 */
import type { SweepData } from "../types";
import { readTable, type ColumnSpec, type CsvDecimal, type WithWarnings } from "./table";
import { readingFactorToUm, scaleInPlace, type ReadingUnits } from "./units";

const COLUMNS: readonly ColumnSpec[] = [
  { name: "angle_deg", kind: "number", required: true },
  { name: "reading", kind: "number", required: true },
];

export interface SweepCsvOptions {
  readonly readingUnits: ReadingUnits;
  readonly decimal?: CsvDecimal;
}

/** Read an indicator-sweep CSV (angle degrees, reading µm). Throws GeometryError on malformed input. */
export function readSweepCsv(text: string, options: SweepCsvOptions): WithWarnings<SweepData> {
  const readingFactor = readingFactorToUm(options?.readingUnits, "readingUnits");
  const t = readTable(text, COLUMNS, { decimal: options?.decimal });
  return {
    rows: t.rows,
    angleDeg: t.numbers.get("angle_deg")!,
    readingUm: scaleInPlace(
      t.numbers.get("reading")!,
      readingFactor,
      t.sourceRow,
      t.headerNames.get("reading")!,
    ),
    sourceRow: t.sourceRow,
    warnings: t.warnings,
  };
}
