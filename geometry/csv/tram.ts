/**
 * Indicator tram CSV: `travel,reading` (+ optional `note`). Travel in mm or in, reading in µm, mm
 * or in, as the caller chose; converted to travel mm and reading µm.
 */
import type { TramData } from "../types";
import { TRAM_COLUMNS } from "./columns";
import { readTable, type CsvDecimal, type WithWarnings } from "./table";
import {
  coordinateFactorToMm,
  readingFactorToUm,
  scaleInPlace,
  type CoordinateUnits,
  type ReadingUnits,
} from "./units";

export interface TramCsvOptions {
  readonly travelUnits: CoordinateUnits;
  readonly readingUnits: ReadingUnits;
  readonly decimal?: CsvDecimal;
}

/** Read an indicator-tram CSV (travel mm, reading µm). Throws GeometryError on malformed input. */
export function readTramCsv(text: string, options: TramCsvOptions): WithWarnings<TramData> {
  const travelFactor = coordinateFactorToMm(options?.travelUnits, "travelUnits");
  const readingFactor = readingFactorToUm(options?.readingUnits, "readingUnits");
  const t = readTable(text, TRAM_COLUMNS, { decimal: options?.decimal });
  const note = t.texts.get("note");
  return {
    rows: t.rows,
    travelMm: scaleInPlace(t.numbers.get("travel")!, travelFactor, t.sourceRow, t.headerNames.get("travel")!),
    readingUm: scaleInPlace(
      t.numbers.get("reading")!,
      readingFactor,
      t.sourceRow,
      t.headerNames.get("reading")!,
    ),
    ...(note ? { note: note.map((s) => (s === "" ? undefined : s)) } : {}),
    sourceRow: t.sourceRow,
    warnings: t.warnings,
  };
}
