/**
 * Test-part CSV: `feature,characteristic,nominal,measured,lower_tol,upper_tol` (+ optional `unit`).
 * Tolerances are signed offsets from nominal in the row's unit (default mm). An empty `lower_tol`
 * makes the tolerance one-sided (upper limit only), as ISO 14253-1 treats flatness or squareness.
 */
import type { TestPartRow } from "../types";
import { fail, MAX_ISSUES, readTable, type CodedIssue, type CsvDecimal, type WithWarnings } from "./table";
import { TEST_PART_COLUMNS } from "./columns";

/** Units a test-part row may state (lower case as written; "µm" is read as "um"). */
export const TEST_PART_UNITS = ["mm", "in", "um", "deg", "arcsec", "um/m"] as const;
export type TestPartUnit = (typeof TEST_PART_UNITS)[number];

export interface TestPartCsvOptions {
  readonly decimal?: CsvDecimal;
}

/**
 * Read a test-part CSV into rows. Throws GeometryError on malformed input: besides the table rules,
 * an empty feature or characteristic, an unknown unit, or lower_tol above upper_tol.
 */
export function readTestPartCsv(text: string, options: TestPartCsvOptions = {}): WithWarnings<TestPartRow[]> {
  const t = readTable(text, TEST_PART_COLUMNS, { decimal: options.decimal });
  const feature = t.texts.get("feature")!;
  const characteristic = t.texts.get("characteristic")!;
  const unit = t.texts.get("unit");
  const nominal = t.numbers.get("nominal")!;
  const measured = t.numbers.get("measured")!;
  const lower = t.numbers.get("lower_tol")!;
  const upper = t.numbers.get("upper_tol")!;
  const name = (k: string) => t.headerNames.get(k) ?? k;
  const issues: CodedIssue[] = [];
  const rows: TestPartRow[] = [];
  for (let i = 0; i < t.rows && issues.length < MAX_ISSUES; i++) {
    const row = t.sourceRow[i]!;
    if (feature[i] === "")
      issues.push({ code: "bad_value", row, column: name("feature"), message: "empty; name the feature" });
    if (characteristic[i] === "")
      issues.push({
        code: "bad_value",
        row,
        column: name("characteristic"),
        message: "empty; name the characteristic",
      });
    let u = (unit?.[i] ?? "").toLowerCase();
    if (u === "µm" || u === "μm") u = "um";
    if (u === "") u = "mm";
    if (!(TEST_PART_UNITS as readonly string[]).includes(u)) {
      issues.push({
        code: "bad_value",
        row,
        column: name("unit"),
        message: `'${unit?.[i] ?? ""}' is not one of ${TEST_PART_UNITS.join(", ")}`,
      });
    }
    const lo = lower[i]!;
    const hi = upper[i]!;
    if (lo === lo && lo > hi) {
      issues.push({
        code: "bad_value",
        row,
        column: name("lower_tol"),
        message: `lower_tol ${lo} is above upper_tol ${hi}`,
      });
    }
    rows.push({
      feature: feature[i]!,
      characteristic: characteristic[i]!,
      nominal: nominal[i]!,
      measured: measured[i]!,
      lowerTol: lo === lo ? lo : null,
      upperTol: hi,
      unit: u,
      sourceRow: row,
    });
  }
  if (issues.length > 0) fail(issues);
  return Object.assign(rows, { warnings: t.warnings });
}
