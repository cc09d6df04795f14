/**
 * Rotary positioning CSV (ISO 230-2): `target_deg,run,direction,measured_deg` (+ optional `axis`).
 * `direction` is `pos` or `neg` (case-insensitive); angles in degrees; one axis per file.
 */
import type { RotaryPositioningData } from "../types";
import { ROTARY_POSITIONING_COLUMNS } from "./columns";
import { fail, MAX_ISSUES, readTable, type CodedIssue, type CsvDecimal, type WithWarnings } from "./table";

const COLUMNS = ROTARY_POSITIONING_COLUMNS;

/** Read a rotary-positioning CSV. Throws GeometryError naming row and column on malformed input. */
export function readRotaryPositioningCsv(
  text: string,
  options: { decimal?: CsvDecimal } = {},
): WithWarnings<RotaryPositioningData> {
  const t = readTable(text, COLUMNS, { decimal: options.decimal });
  const dirText = t.texts.get("direction")!;
  const axisText = t.texts.get("axis");
  const name = (k: string) => t.headerNames.get(k) ?? k;
  const issues: CodedIssue[] = [];
  const direction: ("pos" | "neg")[] = [];
  const axes = new Set<string>();
  for (let i = 0; i < t.rows; i++) {
    const d = dirText[i]!.toLowerCase();
    if (d === "pos" || d === "neg") direction.push(d);
    else {
      direction.push("pos");
      if (issues.length < MAX_ISSUES)
        issues.push({
          code: "bad_value",
          row: t.sourceRow[i],
          column: name("direction"),
          message: `'${dirText[i]}' is not pos or neg`,
        });
    }
    const run = t.numbers.get("run")![i]!;
    if (!Number.isInteger(run) && issues.length < MAX_ISSUES)
      issues.push({
        code: "bad_value",
        row: t.sourceRow[i],
        column: name("run"),
        message: `run ${run} is not a whole number`,
      });
    if (axisText && axisText[i] !== "") axes.add(axisText[i]!.toUpperCase());
  }
  if (axes.size > 1)
    issues.push({
      code: "bad_value",
      column: name("axis"),
      message: `one axis per file; this file has ${[...axes].sort().join(", ")}`,
    });
  if (issues.length > 0) fail(issues);
  return {
    rows: t.rows,
    targetDeg: t.numbers.get("target_deg")!,
    run: t.numbers.get("run")!,
    direction,
    measuredDeg: t.numbers.get("measured_deg")!,
    ...(axes.size === 1 ? { axis: [...axes][0]! } : {}),
    sourceRow: t.sourceRow,
    warnings: t.warnings,
  };
}
