/**
 * Browser-side first look at a CSV file, streamed through papaparse in a Web Worker: the header,
 * the first rows for the preview, the row count, and per column the rows whose field is not a
 * number (for both decimal conventions) or is empty, plus ragged rows and quote problems. Only a
 * preview: the server re-reads the file with geometry/'s readers and decides.
 */
import Papa from "papaparse";

export const MAX_LISTED = 50;
const PREVIEW_ROWS = 8;

export interface ColumnScan {
  /** Rows (file numbering, header = 1) whose field is not a number with a decimal point / comma. */
  readonly badPoint: { row: number; value: string }[];
  readonly badComma: { row: number; value: string }[];
  readonly empty: number[];
}

export interface CsvScan {
  readonly headers: string[];
  readonly preview: string[][];
  readonly rows: number;
  readonly delimiter: string;
  readonly columns: ColumnScan[];
  readonly ragged: { row: number; fields: number }[];
  readonly structural: { row: number; message: string }[];
  readonly looksDecimalComma: boolean;
}

const NUM_POINT = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const NUM_COMMA = /^[+-]?(\d+(,\d*)?|,\d+)([eE][+-]?\d+)?$/;

function finite(s: string, comma: boolean): boolean {
  if (!(comma ? NUM_COMMA : NUM_POINT).test(s)) return false;
  return Number.isFinite(Number(comma ? s.replace(",", ".") : s));
}

export function scanCsv(file: File, onProgress: (fraction: number) => void): Promise<CsvScan> {
  return new Promise((resolve, reject) => {
    let headers: string[] | null = null;
    const preview: string[][] = [];
    let columns: ColumnScan[] = [];
    const ragged: { row: number; fields: number }[] = [];
    const structural: { row: number; message: string }[] = [];
    let row = 0;
    let dataRows = 0;
    let delimiter = ",";
    let commaHits = 0;
    const handle = (data: string[][], errors: Papa.ParseError[], cursor: number) => {
      const base = row;
      for (const rec of data) {
        row++;
        if (!headers) {
          headers = rec.map((h, i) => (i === 0 ? h.replace(/^\uFEFF/, "") : h).trim());
          columns = headers.map(() => ({ badPoint: [], badComma: [], empty: [] }));
          continue;
        }
        if (rec.length === 1 && rec[0]!.trim() === "") continue; // blank line, skipped by the server too
        dataRows++;
        if (preview.length < PREVIEW_ROWS) preview.push(rec);
        if (rec.length !== headers.length) {
          if (ragged.length < MAX_LISTED) ragged.push({ row, fields: rec.length });
          continue;
        }
        for (let i = 0; i < rec.length; i++) {
          const v = rec[i]!.trim();
          const c = columns[i]!;
          if (v === "") {
            if (c.empty.length < MAX_LISTED) c.empty.push(row);
            continue;
          }
          if (c.badPoint.length < MAX_LISTED && !finite(v, false)) c.badPoint.push({ row, value: v });
          if (c.badComma.length < MAX_LISTED && !finite(v, true)) c.badComma.push({ row, value: v });
          if (/^[+-]?\d+,\d+$/.test(v)) commaHits++;
        }
      }
      for (const e of errors) {
        if (structural.length >= MAX_LISTED) break;
        if (e.type === "Quotes")
          structural.push({
            row: base + (e.row ?? 0) + 1,
            message: "a quote opens here and is never closed",
          });
      }
      onProgress(file.size ? Math.min(1, cursor / file.size) : 1);
    };
    const useWorker = typeof Worker !== "undefined";
    Papa.parse<string[]>(file, {
      worker: useWorker,
      header: false,
      dynamicTyping: false,
      skipEmptyLines: false,
      delimitersToGuess: [",", ";"],
      chunkSize: 256 * 1024,
      chunk: (results) => {
        delimiter = results.meta.delimiter || delimiter;
        handle(results.data, results.errors, results.meta.cursor);
      },
      complete: () => {
        onProgress(1);
        resolve({
          headers: headers ?? [],
          preview,
          rows: dataRows,
          delimiter,
          columns,
          ragged,
          structural,
          looksDecimalComma: delimiter === ";" && commaHits > 0,
        });
      },
      error: (err) => reject(err),
    });
  });
}
