/**
 * Reading a large CSV file for the `sweep`, `circle`, `tram` and `fit-head` commands in bounded
 * memory: the file is read in blocks of whole lines, each block is read by the same geometry/csv
 * reader with the header line put in front, and the blocks' typed columns are appended into one set
 * of typed arrays. The file's text is never held whole (a 10^6-row file is 20–60 MB of text; as a string,
 * plus the bytes it was decoded from, that is most of a process's memory).
 *
 * The result is the reader's result on the whole text, value for value: the same numbers, the
 * same file rows in `sourceRow`, the same header warnings. Whatever a block cannot decide alone
 * makes this return `undefined` and the caller reads the whole text as before, so errors and
 * warnings stay exactly those of the whole-file reader:
 * - any quote character in the file (a quoted field may span lines, so a block edge could split it);
 * - a lone carriage return as a line break, or a blank row between data rows (the row count of a
 *   block would no longer match its lines);
 * - any bad input (GeometryError) in a block: the whole-file reader then reports it with every
 *   issue and row number as it always has.
 * Blank lines at the very end of the file are ignored, as the whole-file reader ignores them.
 */
import { closeSync, openSync, readSync } from "node:fs";
import { GeometryError, type CsvWarning } from "@/geometry";
import { csvOptionsOf, passWarnings, type CliContext, type CsvOptions } from "./command";

/** What the readers of geometry/csv return: columns of equal length, rows, warnings. */
interface ReaderResult {
  readonly rows: number;
  readonly warnings: readonly unknown[];
}

const LF = 0x0a;
const CR = 0x0d;
const QUOTE = 0x22;
const BLOCK_BYTES = 1 << 20;

/** A typed array that grows by doubling; `view()` is the filled part. */
class Growing<A extends Float64Array | Int32Array> {
  private data: A;
  length = 0;
  constructor(private readonly make: (n: number) => A) {
    this.data = make(1 << 16);
  }
  append(src: A, add = 0): void {
    if (this.length + src.length > this.data.length) {
      let cap = this.data.length;
      while (cap < this.length + src.length) cap *= 2;
      const next = this.make(cap);
      next.set(this.data.subarray(0, this.length));
      this.data = next;
    }
    if (add === 0) this.data.set(src, this.length);
    else for (let i = 0; i < src.length; i++) this.data[this.length + i] = src[i]! + add;
    this.length += src.length;
  }
  view(): A {
    return this.data.subarray(0, this.length) as A;
  }
}

/** Lines (records) in a block of whole lines: LF count, plus one for an unterminated last line. */
function countLines(block: Buffer<ArrayBufferLike>): number {
  let n = 0;
  let p = block.indexOf(LF);
  while (p !== -1) {
    n++;
    p = block.indexOf(LF, p + 1);
  }
  if (block.length > 0 && block[block.length - 1] !== LF) n++;
  return n;
}

/** True when every CR in the block is followed by LF (CR LF line ends are fine, a lone CR is not). */
function onlyCrLf(block: Buffer<ArrayBufferLike>): boolean {
  let p = block.indexOf(CR);
  while (p !== -1) {
    if (block[p + 1] !== LF) return false;
    p = block.indexOf(CR, p + 1);
  }
  return true;
}

const isBlankByte = (b: number) => b === 0x20 || b === 0x09 || b === LF || b === CR;

/** The block without its trailing blank lines (spaces, tabs and line breaks after the last data line). */
function withoutTrailingBlankLines(block: Buffer): Buffer<ArrayBufferLike> {
  let last = block.length - 1;
  while (last >= 0 && isBlankByte(block[last]!)) last--;
  if (last < 0) return block.subarray(0, 0);
  let end = last + 1;
  while (end < block.length && block[end] !== LF && block[end] !== CR) end++;
  return block.subarray(0, end);
}

/**
 * Read `file` block by block (of `blockBytes`; tests use small blocks) with `read` (one of the readers of geometry/csv, given the header line
 * and a block of whole lines) and join the blocks. `undefined`: read the whole text instead (see
 * above). Throws only what reading the file throws (the caller has checked it can be opened).
 */
export function readCsvInBlocks<T extends ReaderResult>(
  file: string,
  read: (text: string) => T,
  blockBytes = BLOCK_BYTES,
): T | undefined {
  const fd = openSync(file, "r");
  try {
    let carry: Buffer = Buffer.alloc(0);
    let header: string | undefined;
    let headerWarnings: readonly unknown[] = [];
    let first: T | undefined;
    const columns = new Map<string, Growing<Float64Array> | Growing<Int32Array>>();
    const lists = new Map<string, unknown[]>();
    let rows = 0;
    const buffer = Buffer.allocUnsafe(blockBytes);
    let eof = false;
    while (!eof) {
      const got = readSync(fd, buffer, 0, blockBytes, null);
      eof = got === 0;
      const bytes =
        carry.length > 0 ? Buffer.concat([carry, buffer.subarray(0, got)]) : buffer.subarray(0, got);
      if (bytes.indexOf(QUOTE) !== -1) return undefined;
      // Whole lines only: up to the LF (never inside a UTF-8 sequence) of the last line that is not
      // blank, so blank lines wait for the next block (blank rows inside the data make the row
      // count differ below; blank lines at the end are dropped); at the end, everything.
      let cut = bytes.length;
      if (!eof) {
        let last = bytes.lastIndexOf(LF) - 1;
        while (last >= 0 && isBlankByte(bytes[last]!)) last--;
        cut = last < 0 ? 0 : bytes.indexOf(LF, last) + 1;
      }
      if (cut === 0) {
        if (bytes.length > 16 * BLOCK_BYTES) return undefined; // a 16 MB line: not a table of numbers
        carry = Buffer.from(bytes);
        continue;
      }
      let block: Buffer<ArrayBufferLike> = bytes.subarray(0, cut);
      carry = Buffer.from(bytes.subarray(cut));
      if (!onlyCrLf(block)) return undefined;
      if (header === undefined) {
        const h = block.indexOf(LF);
        header = block.toString("utf8", 0, h === -1 ? block.length : h + 1);
        if (h === -1) header += "\n";
        block = block.subarray(h === -1 ? block.length : h + 1);
      }
      if (eof) block = withoutTrailingBlankLines(block);
      if (block.length === 0) continue;
      const lines = countLines(block);
      let part: T;
      try {
        part = read(header + block.toString("utf8"));
      } catch (e) {
        if (e instanceof GeometryError) return undefined;
        throw e;
      }
      if (part.rows !== lines) return undefined;
      if (first === undefined) {
        first = part;
        headerWarnings = part.warnings;
      } else if (part.warnings.length !== headerWarnings.length) return undefined;
      for (const [key, value] of Object.entries(part)) {
        if (value instanceof Float64Array || value instanceof Int32Array) {
          let col = columns.get(key);
          if (!col) {
            col =
              value instanceof Float64Array
                ? new Growing((n) => new Float64Array(n))
                : new Growing((n) => new Int32Array(n));
            columns.set(key, col);
          }
          // sourceRow counts file rows from the header (row 1) of the text it was given.
          (col as Growing<typeof value>).append(value, key === "sourceRow" ? rows : 0);
        } else if (Array.isArray(value) && key !== "warnings") {
          let list = lists.get(key);
          if (!list) lists.set(key, (list = []));
          for (const v of value) list.push(v);
        }
      }
      rows += part.rows;
    }
    if (first === undefined) return undefined;
    const joined: Record<string, unknown> = { ...(first as object), rows, warnings: headerWarnings };
    for (const [key, col] of columns) joined[key] = col.view();
    for (const [key, list] of lists) joined[key] = list;
    return joined as unknown as T;
  } finally {
    closeSync(fd);
  }
}

type Warned = { readonly warnings: readonly CsvWarning[] };
type Reader<T> = (text: string, options: CsvOptions) => T;

/**
 * A command's input file (its whole text) through one of the readers of geometry/csv with the
 * command line's options (csvOptionsOf), its warnings printed.
 */
export function readInput<T extends Warned>(ctx: CliContext, read: Reader<T>): T {
  const options = csvOptionsOf(ctx);
  return printingWarnings(ctx, read(ctx.text, options));
}

/**
 * As readInput, for the readers of numeric columns: block by block into typed columns where the
 * file allows, else (see above) its whole text.
 */
export function readLargeInput<T extends ReaderResult & Warned>(ctx: CliContext, read: Reader<T>): T {
  const options = csvOptionsOf(ctx);
  const readText = (text: string) => read(text, options);
  return printingWarnings(ctx, readCsvInBlocks(ctx.file, readText) ?? readText(ctx.text));
}

function printingWarnings<T extends Warned>(ctx: CliContext, data: T): T {
  passWarnings(ctx, data.warnings);
  return data;
}
