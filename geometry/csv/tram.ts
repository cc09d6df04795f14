/**
 * Indicator tram CSV: `travel,reading` (+ optional `note`). Travel in mm or in, reading in µm, mm
 * or in, as the caller chose; converted to travel mm and reading µm.
 */
import type { TramData } from "../types";
import { TRAM_COLUMNS } from "./columns";
import { fail, MAX_ISSUES, readTable, type CodedIssue, type CsvDecimal, type WithWarnings } from "./table";
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
  const planeText = t.texts.get("plane");
  const barDeg = t.numbers.get("bar_deg");
  const issues: CodedIssue[] = [];
  const plane = planeText?.map((p, i) => {
    const up = p.toUpperCase();
    if (up !== "XZ" && up !== "YZ" && issues.length < MAX_ISSUES)
      issues.push({
        code: "bad_value",
        row: t.sourceRow[i],
        column: t.headerNames.get("plane"),
        message: `'${p}' is not XZ or YZ`,
      });
    return up as "XZ" | "YZ";
  });
  barDeg?.forEach((b, i) => {
    if (b !== 0 && b !== 180 && issues.length < MAX_ISSUES)
      issues.push({
        code: "bad_value",
        row: t.sourceRow[i],
        column: t.headerNames.get("bar_deg"),
        message: `${b} is not 0 or 180`,
      });
  });
  if (barDeg && !plane)
    issues.push({
      code: "missing_column",
      row: 1,
      column: "plane",
      message: "bar_deg needs a plane column (XZ or YZ)",
    });
  if (issues.length > 0) fail(issues);
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
    ...(plane ? { plane } : {}),
    ...(barDeg ? { barDeg } : {}),
    sourceRow: t.sourceRow,
    warnings: t.warnings,
  };
}
