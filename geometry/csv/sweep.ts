/**
 * Indicator sweep CSV: `angle_deg,reading`. Reading in µm, mm or in as the caller chose (converted
 * to µm); the sweep radius is entered separately.
 */
import type { SweepData } from "../types";
import { SWEEP_COLUMNS } from "./columns";
import { readTable, type CsvDecimal, type WithWarnings } from "./table";
import { readingFactorToUm, scaleInPlace, type ReadingUnits } from "./units";

export interface SweepCsvOptions {
  readonly readingUnits: ReadingUnits;
  readonly decimal?: CsvDecimal;
}

/** Read an indicator-sweep CSV (angle degrees, reading µm). Throws GeometryError on malformed input. */
export function readSweepCsv(text: string, options: SweepCsvOptions): WithWarnings<SweepData> {
  const readingFactor = readingFactorToUm(options?.readingUnits, "readingUnits");
  const t = readTable(text, SWEEP_COLUMNS, { decimal: options?.decimal });
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
