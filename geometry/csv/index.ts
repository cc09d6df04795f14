/**
 * CSV readers for the product's four formats (geometry/README.md, "CSV formats"). Each takes the
 * file's text and returns its data shape with `warnings` attached (`WithWarnings<T>`), or throws a
 * GeometryError whose issues name the file row (header = row 1) and the column.
 */
export { readSphereProbeCsv, TOOL_MM_MAX, TOOL_MM_MIN, type SphereProbeCsvOptions } from "./sphere-probe";
export { readTramCsv, type TramCsvOptions } from "./tram";
export { readSweepCsv, type SweepCsvOptions } from "./sweep";
export { readTestPartCsv, TEST_PART_UNITS, type TestPartUnit, type TestPartCsvOptions } from "./test-part";
export { formatIssue, MAX_ISSUES, type CsvDecimal, type CsvWarning, type WithWarnings } from "./table";
export { readRotaryPositioningCsv } from "./rotary-positioning";
export { readPointsCsv, type PointsData } from "./points";
export { CSV_COLUMNS, type ColumnSpec } from "./columns";
export type { CoordinateUnits, ReadingUnits } from "./units";
