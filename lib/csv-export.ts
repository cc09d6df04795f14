/**
 * CSV export with spreadsheet-formula injection neutralised (OWASP "CSV Injection"): a cell
 * that begins with = + - @, a tab or a carriage return is prefixed with a single quote so a
 * spreadsheet shows it as text instead of evaluating it. Fields are quoted per RFC 4180.
 */
const DANGEROUS_START = /^[=+\-@\t\r]/;

/** Makes one cell safe for a spreadsheet. Numbers are written as numbers (a negative number is data, not a formula). */
export function neutraliseCell(value: unknown): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "number") return Number.isFinite(value) ? String(value) : "";
  const s = String(value);
  return DANGEROUS_START.test(s) ? `'${s}` : s;
}

/** RFC 4180 quoting: fields with a comma, quote, CR or LF are quoted and quotes doubled. */
export function quoteField(s: string): string {
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** Rows to CSV text (CRLF line ends, as RFC 4180 says), each cell neutralised then quoted. */
export function toCsv(header: readonly string[], rows: ReadonlyArray<readonly unknown[]>): string {
  const line = (cells: readonly unknown[]) => cells.map((c) => quoteField(neutraliseCell(c))).join(",");
  return [line(header), ...rows.map(line)].join("\r\n") + "\r\n";
}
