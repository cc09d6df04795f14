/**
 * The browser's checks of a scanned CSV before it is sent, under the chosen column mapping and
 * decimal separator (a preview of the server's), and the header line that renames the file's
 * columns to the canonical names when the mapping differs from the file's own.
 */
import { MAX_LISTED, type CsvScan } from "./csv-scan";
import { COLUMNS, type DatasetKindKey } from "./kinds";

export type Issue = { row?: number; column?: string; field?: string; message: string };

export /** Row-level checks of the scan under the chosen mapping and decimal separator (a preview of the server's). */
function clientIssues(
  kind: DatasetKindKey,
  scan: CsvScan,
  mapping: Record<string, number>,
  comma: boolean,
): Issue[] {
  const out: Issue[] = [];
  if (scan.headers.length === 0) return [{ row: 1, message: "the file is empty; a header row is required" }];
  const used = new Map<number, string>();
  for (const c of COLUMNS[kind]) {
    const i = mapping[c.name] ?? -1;
    if (i < 0) {
      if (c.required)
        out.push({
          row: 1,
          column: c.name,
          message: `the required column '${c.name}' is not mapped to a column of the file`,
        });
      continue;
    }
    if (used.has(i))
      out.push({
        row: 1,
        column: scan.headers[i],
        message: `mapped to both '${used.get(i)}' and '${c.name}'`,
      });
    used.set(i, c.name);
  }
  if (scan.rows === 0) out.push({ row: 1, message: "the file has a header row but no data rows" });
  for (const s of scan.structural) out.push(s);
  for (const r of scan.ragged)
    out.push({
      row: r.row,
      message: `has ${r.fields} field${r.fields === 1 ? "" : "s"}, the header has ${scan.headers.length}`,
    });
  for (const c of COLUMNS[kind]) {
    const i = mapping[c.name] ?? -1;
    if (i < 0) continue;
    const col = scan.columns[i]!;
    const shown = scan.headers[i]!;
    if (c.numeric) {
      for (const b of comma ? col.badComma : col.badPoint)
        out.push({ row: b.row, column: shown, message: `'${b.value.slice(0, 40)}' is not a number` });
      if (!c.allowEmpty)
        for (const r of col.empty)
          out.push({ row: r, column: shown, message: "empty; a number is required" });
    } else if (c.required) {
      for (const r of col.empty) out.push({ row: r, column: shown, message: `empty; name the ${c.name}` });
    }
  }
  return out.sort((a, b) => (a.row ?? 0) - (b.row ?? 0)).slice(0, MAX_LISTED);
}

/** The replacement header line when the mapping renames anything; undefined when the file's own names serve. */
export function renamedHeader(
  kind: DatasetKindKey,
  scan: CsvScan,
  mapping: Record<string, number>,
): string | undefined {
  const names = scan.headers.map((_, i) => `unused_${i + 1}`);
  let renamed = false;
  for (const c of COLUMNS[kind]) {
    const i = mapping[c.name] ?? -1;
    if (i < 0) continue;
    names[i] = c.name;
    if (scan.headers[i]!.trim().toLowerCase() !== c.name) renamed = true;
  }
  // A file column that carries a canonical name but is mapped elsewhere must be renamed too.
  scan.headers.forEach((h, i) => {
    if (names[i]!.startsWith("unused_") && COLUMNS[kind].some((c) => c.name === h.trim().toLowerCase()))
      renamed = true;
  });
  if (!renamed) return undefined;
  scan.headers.forEach((h, i) => {
    if (
      names[i]!.startsWith("unused_") &&
      /^[A-Za-z0-9_ ]+$/.test(h) &&
      !COLUMNS[kind].some((c) => c.name === h.trim().toLowerCase())
    )
      names[i] = h;
  });
  return names.join(scan.delimiter === ";" ? ";" : ",");
}
