/**
 * The CSV table reader behind the four readers of geometry/csv: one pass over the text's character
 * codes, RFC 4180 quoting, header matched by name, numbers parsed straight into Float64Arrays.
 *
 * Why our own parser and not papaparse: measured on this 2-core machine, on the same 10^6-row,
 * 50 MB sphere-probe file (tests/bench/csv.ts), papaparse takes 1.0–1.8 s just to tokenise a string
 * already in memory (`Papa.parse(text)`, dynamicTyping off — 0.47 s only when it streams from a file
 * stream, which geometry/ cannot use: it takes a string and must not import node:fs), before a
 * single number is converted or checked. Its per-field strings and row arrays cost the time and
 * the memory. This reader tokenises, validates and converts in one pass with no per-field string
 * on the common path, and meets the ≤ 1.2 s target with room to spare (see the bench for figures).
 *
 * File rows are counted the way a spreadsheet shows them: the header is row 1, every record
 * (including a blank line) is one row; a quoted field with a line break stays in its row.
 */
import { GeometryError, type GeometryErrorCode, type GeometryIssue } from "../errors";
import { describeBadNumber, parseDecimal } from "./number";

/** Decimal separator of number fields. "comma" is allowed only in a semicolon-separated file. */
export type CsvDecimal = "point" | "comma";

/** A non-fatal finding (unknown column, skipped blank row). Same shape as an error issue. */
export type CsvWarning = GeometryIssue;

/**
 * Every reader returns its data shape with the warnings attached as a `warnings` property, so the
 * result is still exactly the documented data type (e.g. `SphereProbeData`) for callers that ignore
 * warnings, and one shape serves all four readers.
 */
export type WithWarnings<T> = T & { readonly warnings: readonly CsvWarning[] };

export interface ColumnSpec {
  /** Header name, lower case (matching is case-insensitive and trimmed). */
  readonly name: string;
  readonly kind: "number" | "text";
  readonly required: boolean;
  /** Number columns only: an empty field is allowed and read as NaN (the reader must handle it). */
  readonly allowEmpty?: boolean;
}

export interface TableResult {
  readonly rows: number;
  /** Number columns present in the file, by spec name. */
  readonly numbers: ReadonlyMap<string, Float64Array>;
  /** Text columns present in the file, by spec name (values trimmed). */
  readonly texts: ReadonlyMap<string, string[]>;
  /** Header names as the user wrote them (trimmed), by spec name. */
  readonly headerNames: ReadonlyMap<string, string>;
  readonly sourceRow: Int32Array;
  readonly delimiter: "," | ";";
  readonly warnings: CsvWarning[];
}

export const MAX_ISSUES = 50;

export interface CodedIssue extends GeometryIssue {
  readonly code: GeometryErrorCode;
}

/** "row 5, column x: message" — how an issue reads on its own. */
export function formatIssue(issue: GeometryIssue): string {
  const where = [
    issue.row !== undefined ? `row ${issue.row}` : undefined,
    issue.column !== undefined ? `column ${issue.column}` : undefined,
  ]
    .filter((s) => s !== undefined)
    .join(", ");
  return where ? `${where}: ${issue.message}` : issue.message;
}

/** Throw one GeometryError carrying all the issues (code of the first; message lists up to five). */
export function fail(issues: readonly CodedIssue[], truncated = false): never {
  const first = issues[0]!;
  const shown = issues.slice(0, 5).map(formatIssue).join("; ");
  const more =
    issues.length > 5 ? ` (and ${issues.length - 5} more${truncated ? ", reading stopped" : ""})` : "";
  const message = issues.length === 1 ? shown : `${issues.length} problems in the CSV file: ${shown}${more}`;
  throw new GeometryError(
    first.code,
    message,
    issues.map(({ row, column, message: m }) => ({ row, column, message: m })),
  );
}

const Q = 34; // "
const LF = 10;
const CR = 13;
const SPACE = 32;
const TAB = 9;

/** Field boundaries of one record, reused across rows. flag: 0 plain, 1 quoted, 2 quoted with "" escapes. */
class FieldBuffer {
  starts = new Int32Array(64);
  ends = new Int32Array(64);
  flags = new Uint8Array(64);
  count = 0;
  push(start: number, end: number, flag: number): void {
    if (this.count === this.starts.length) {
      const n = this.count * 2;
      const s = new Int32Array(n);
      s.set(this.starts);
      const e = new Int32Array(n);
      e.set(this.ends);
      const f = new Uint8Array(n);
      f.set(this.flags);
      this.starts = s;
      this.ends = e;
      this.flags = f;
    }
    this.starts[this.count] = start;
    this.ends[this.count] = end;
    this.flags[this.count] = flag;
    this.count++;
  }
}

interface RecordOutcome {
  /** Position after the record's line break (or text length). */
  next: number;
  /** Index of the field whose quote never closed, or -1. */
  unclosedField: number;
  /** Index of a field with text after its closing quote, or -1. */
  strayAfterQuote: number;
}

/**
 * Read one record starting at `pos` into `buf`. Quoted fields follow RFC 4180 (a quote inside is
 * written twice; delimiters and line breaks inside are data). A quote inside an unquoted field is
 * taken literally (e.g. `1/2"`), as spreadsheets do. Spaces before an opening quote are allowed.
 */
function readRecord(text: string, pos: number, delim: number, buf: FieldBuffer, out: RecordOutcome): void {
  const len = text.length;
  buf.count = 0;
  out.unclosedField = -1;
  out.strayAfterQuote = -1;
  for (;;) {
    const fieldStart = pos;
    let p = pos;
    let c = p < len ? text.charCodeAt(p) : -1;
    while (c === SPACE || c === TAB) {
      p++;
      c = p < len ? text.charCodeAt(p) : -1;
    }
    if (c === Q) {
      const contentStart = p + 1;
      let flag = 1;
      let q = contentStart;
      let closed = -1;
      for (;;) {
        const idx = text.indexOf('"', q);
        if (idx === -1) break;
        if (idx + 1 < len && text.charCodeAt(idx + 1) === Q) {
          flag = 2;
          q = idx + 2;
          continue;
        }
        closed = idx;
        break;
      }
      if (closed === -1) {
        buf.push(contentStart, len, flag);
        out.unclosedField = buf.count - 1;
        out.next = len;
        return;
      }
      buf.push(contentStart, closed, flag);
      p = closed + 1;
      c = p < len ? text.charCodeAt(p) : -1;
      while (c === SPACE || c === TAB) {
        p++;
        c = p < len ? text.charCodeAt(p) : -1;
      }
      if (c !== delim && c !== LF && c !== CR && c !== -1) {
        if (out.strayAfterQuote === -1) out.strayAfterQuote = buf.count - 1;
        while (c !== delim && c !== LF && c !== CR && c !== -1) {
          p++;
          c = p < len ? text.charCodeAt(p) : -1;
        }
      }
    } else {
      p = fieldStart;
      c = p < len ? text.charCodeAt(p) : -1;
      while (c !== delim && c !== LF && c !== CR && c !== -1) {
        p++;
        c = p < len ? text.charCodeAt(p) : -1;
      }
      buf.push(fieldStart, p, 0);
    }
    if (c === delim) {
      pos = p + 1;
      continue;
    }
    if (c === CR) {
      p++;
      if (p < len && text.charCodeAt(p) === LF) p++;
    } else if (c === LF) {
      p++;
    }
    out.next = p;
    return;
  }
}

/** The text of field i as written: quotes removed, doubled quotes undone (not trimmed). */
function fieldText(text: string, buf: FieldBuffer, i: number): string {
  const raw = text.slice(buf.starts[i]!, buf.ends[i]!);
  return buf.flags[i] === 2 ? raw.replaceAll('""', '"') : raw;
}

/** A record that is one unquoted field of only spaces or tabs: an empty line. */
function isBlankRecord(text: string, buf: FieldBuffer): boolean {
  if (buf.count !== 1 || buf.flags[0] !== 0) return false;
  for (let p = buf.starts[0]!; p < buf.ends[0]!; p++) {
    const c = text.charCodeAt(p);
    if (c !== SPACE && c !== TAB) return false;
  }
  return true;
}

/** Delimiter from the header line: the one of "," and ";" that appears more often outside quotes. */
function detectDelimiter(text: string, start: number): "," | ";" {
  let commas = 0;
  let semicolons = 0;
  let inQuote = false;
  for (let p = start; p < text.length; p++) {
    const c = text.charCodeAt(p);
    if (c === Q) inQuote = !inQuote;
    else if (!inQuote) {
      if (c === LF || c === CR) break;
      if (c === 44) commas++;
      else if (c === 59) semicolons++;
    }
  }
  return semicolons > commas ? ";" : ",";
}

/**
 * Upper bound on the number of records, to size the column arrays once: every record but the last
 * ends in LF, CR LF or a lone CR, so (LF count) + (lone CR count) + 1 bounds it for any mix.
 */
function estimateRecords(text: string): number {
  let n = 1;
  let p = text.indexOf("\n");
  while (p !== -1) {
    n++;
    p = text.indexOf("\n", p + 1);
  }
  p = text.indexOf("\r");
  while (p !== -1) {
    if (text.charCodeAt(p + 1) !== LF) n++;
    p = text.indexOf("\r", p + 1);
  }
  return n;
}

/**
 * Read a CSV table with a header row into typed columns.
 * Throws GeometryError (with up to MAX_ISSUES issues, each naming its row and/or column) for: an
 * empty file, a header only, missing or duplicated columns, a bad number, a ragged row, an unclosed
 * quote, text after a closing quote. Unknown columns and interior blank rows are warnings.
 */
export function readTable(
  input: string,
  columns: readonly ColumnSpec[],
  options: { decimal?: CsvDecimal },
): TableResult {
  const decimal = options.decimal ?? "point";
  if (decimal !== "point" && decimal !== "comma") {
    throw new GeometryError("bad_option", `decimal must be "point" or "comma", not '${String(decimal)}'`);
  }
  if (typeof input !== "string") throw new GeometryError("bad_option", "the CSV text must be a string");
  const start = input.charCodeAt(0) === 0xfeff ? 1 : 0;
  const text = input;
  const len = text.length;
  let firstNonBlank = start;
  for (; firstNonBlank < len; firstNonBlank++) {
    const c = text.charCodeAt(firstNonBlank);
    if (c !== SPACE && c !== TAB && c !== LF && c !== CR) break;
  }
  if (firstNonBlank === len) {
    fail([{ code: "empty", row: 1, message: "the file is empty; a header row is required" }]);
  }
  if (firstNonBlank !== start) {
    fail([
      { code: "header", row: 1, message: "the header row is blank; the first row must name the columns" },
    ]);
  }

  const delimiter = detectDelimiter(text, start);
  const delim = delimiter.charCodeAt(0);
  const decimalComma = decimal === "comma";
  if (decimalComma && delimiter !== ";") {
    fail([
      {
        code: "bad_option",
        row: 1,
        message:
          "the decimal-comma option needs a semicolon-separated file; this header is separated by commas",
      },
    ]);
  }

  const warnings: CsvWarning[] = [];
  const buf = new FieldBuffer();
  const rec: RecordOutcome = { next: 0, unclosedField: -1, strayAfterQuote: -1 };

  // Header.
  readRecord(text, start, delim, buf, rec);
  const headerCount = buf.count;
  const headerNames: string[] = [];
  for (let i = 0; i < headerCount; i++) headerNames.push(fieldText(text, buf, i).trim());
  if (rec.unclosedField !== -1) {
    fail([{ code: "quote", row: 1, message: "the header has a quote that is never closed" }]);
  }
  /** A quoting fault in field `field` of `row`, named by the field's header column. */
  const quoteIssue = (row: number, field: number, message: string): CodedIssue => ({
    code: "quote",
    row,
    column: headerNames[field],
    message,
  });
  const issues: CodedIssue[] = [];
  if (rec.strayAfterQuote !== -1) {
    issues.push(quoteIssue(1, rec.strayAfterQuote, "text after the closing quote of a header name"));
  }
  const specByName = new Map(columns.map((c) => [c.name, c]));
  const fieldOfSpec = new Map<string, number>();
  const seenUnknown = new Set<string>();
  for (let i = 0; i < headerCount; i++) {
    const shown = headerNames[i]!;
    const key = shown.toLowerCase();
    if (key === "") {
      warnings.push({ row: 1, message: `column ${i + 1} has no name; it is ignored` });
      continue;
    }
    if (specByName.has(key)) {
      if (fieldOfSpec.has(key)) {
        issues.push({
          code: "duplicate_column",
          row: 1,
          column: shown,
          message: `the column '${key}' appears more than once in the header`,
        });
      } else {
        fieldOfSpec.set(key, i);
      }
    } else if (!seenUnknown.has(key)) {
      seenUnknown.add(key);
      warnings.push({ row: 1, column: shown, message: `unknown column '${shown}' is ignored` });
    }
  }
  for (const spec of columns) {
    if (spec.required && !fieldOfSpec.has(spec.name)) {
      issues.push({
        code: "missing_column",
        row: 1,
        column: spec.name,
        message: `the required column '${spec.name}' is missing (expected: ${columns
          .filter((c) => c.required)
          .map((c) => c.name)
          .join(", ")})`,
      });
    }
  }
  if (issues.length > 0) fail(issues);

  // Column plan: for each header field, what to do with it.
  const capacity = estimateRecords(text);
  const numberCols: { field: number; name: string; shown: string; out: Float64Array; allowEmpty: boolean }[] =
    [];
  const textCols: { field: number; out: string[] }[] = [];
  const numbers = new Map<string, Float64Array>();
  const texts = new Map<string, string[]>();
  const shownNames = new Map<string, string>();
  for (const spec of columns) {
    const field = fieldOfSpec.get(spec.name);
    if (field === undefined) continue;
    shownNames.set(spec.name, headerNames[field]!);
    if (spec.kind === "number") {
      const out = new Float64Array(capacity);
      numbers.set(spec.name, out);
      numberCols.push({
        field,
        name: spec.name,
        shown: headerNames[field]!,
        out,
        allowEmpty: spec.allowEmpty === true,
      });
    } else {
      const out: string[] = [];
      texts.set(spec.name, out);
      textCols.push({ field, out });
    }
  }
  const sourceRow = new Int32Array(capacity);

  // Data rows.
  let pos = rec.next;
  let row = 1;
  let n = 0;
  let pendingBlank: number[] = [];
  let truncated = false;
  while (pos < len) {
    row++;
    readRecord(text, pos, delim, buf, rec);
    pos = rec.next;
    if (isBlankRecord(text, buf)) {
      pendingBlank.push(row);
      continue;
    }
    if (pendingBlank.length > 0) {
      for (const r of pendingBlank) warnings.push({ row: r, message: "blank row is ignored" });
      pendingBlank = [];
    }
    if (rec.unclosedField !== -1) {
      issues.push(quoteIssue(row, rec.unclosedField, "a quote opens here and is never closed"));
      break;
    }
    if (rec.strayAfterQuote !== -1) {
      issues.push(
        quoteIssue(
          row,
          rec.strayAfterQuote,
          "text after the closing quote; quote the whole field and double any quote inside it",
        ),
      );
    }
    if (buf.count !== headerCount) {
      const hint =
        buf.count > headerCount && delimiter === ","
          ? "; a decimal comma in a comma-separated file splits a number in two — use a decimal point"
          : "";
      issues.push({
        code: "ragged_row",
        row,
        message: `has ${buf.count} field${buf.count === 1 ? "" : "s"}, the header has ${headerCount}${hint}`,
      });
    } else {
      for (let k = 0; k < numberCols.length; k++) {
        const col = numberCols[k]!;
        const s = buf.starts[col.field]!;
        const e = buf.ends[col.field]!;
        let v = buf.flags[col.field] === 2 ? NaN : parseDecimal(text, s, e, decimalComma);
        if (v !== v) {
          const raw = fieldText(text, buf, col.field);
          if (col.allowEmpty && raw.trim() === "") {
            v = NaN;
          } else {
            const message = describeBadNumber(raw, decimalComma, delimiter);
            issues.push({
              code: message.includes("decimal comma") ? "decimal_comma" : "bad_number",
              row,
              column: col.shown,
              message,
            });
            if (issues.length >= MAX_ISSUES) break;
          }
        }
        col.out[n] = v;
      }
      for (let k = 0; k < textCols.length; k++) {
        const col = textCols[k]!;
        col.out.push(fieldText(text, buf, col.field).trim());
      }
    }
    sourceRow[n] = row;
    n++;
    if (issues.length >= MAX_ISSUES) {
      truncated = pos < len;
      break;
    }
  }
  if (issues.length > 0) fail(issues.slice(0, MAX_ISSUES), truncated);
  if (n === 0) {
    fail([{ code: "too_few_rows", row: 1, message: "the file has a header row but no data rows" }]);
  }

  // Views, not copies, when the estimate was close (it counts line breaks, so it is off only by
  // blank or multi-line rows); a copy only when most of the buffer would be wasted.
  const trim = <A extends Float64Array | Int32Array>(a: A): A =>
    a.length === n ? a : a.length - n <= (n >> 3) + 16 ? (a.subarray(0, n) as A) : (a.slice(0, n) as A);
  for (const [k, a] of numbers) numbers.set(k, trim(a));
  return {
    rows: n,
    numbers,
    texts,
    headerNames: shownNames,
    sourceRow: trim(sourceRow),
    delimiter,
    warnings,
  };
}
