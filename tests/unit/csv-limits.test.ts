// What no reader is handed: control bytes, over-long cells, over-wide files — refused with 422
// naming row and column before geometry/'s readers run.
// OWASP ASVS v4.0.3 5.1.4 (structured data checked against a defined schema of allowed characters,
// length and pattern) and 12.1.1 (files the app cannot process refused early); the probe found a NUL
// byte gave a 500, a 20 MB cell was stored, and 10^6 columns peaked the server at 866 MB.
import { readFileSync } from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import {
  checkCsvLimits,
  CSV_MAX_CELL_CHARS,
  CSV_MAX_COLUMNS,
  parseDatasetFile,
  parseUploadForm,
} from "@/lib/storage/parse-dataset";
import { thrownAs } from "./thrown";

const good = readFileSync(path.resolve(import.meta.dirname, "../fixtures/csv/test-part-good.csv"), "utf8");
const form = parseUploadForm({ kind: "test_part", phase: "post" });
const bytes = (s: string) => new TextEncoder().encode(s);

const refusal = (fn: () => unknown) => thrownAs(AppError, fn);

describe("CSV limits", () => {
  it("the good test-part file passes", () => {
    expect(() => checkCsvLimits(good)).not.toThrow();
    expect(parseDatasetFile(form, bytes(good)).rows).toBeGreaterThan(0);
  });

  it("a NUL byte in a test-part cell is a 422 naming row 2 and column 'feature' (it was a 500)", () => {
    const lines = good.split("\n");
    lines[1] = `bore\u0000A${lines[1]!.slice("bore A".length)}`;
    const e = refusal(() => parseDatasetFile(form, bytes(lines.join("\n"))));
    expect(e.status).toBe(422);
    expect(e.issues?.[0]).toMatchObject({ row: 2, column: "feature" });
    expect(e.message).toMatch(/row 2, column feature: the cell holds a NUL byte/);
  });

  it("any C0/C1 control character other than tab and line breaks is refused, also inside quotes", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 159 }).filter((c) => (c < 32 && ![9, 10, 13].includes(c)) || c >= 127),
        fc.boolean(),
        (code, quoted) => {
          const cell = `x${String.fromCharCode(code)}y`;
          const text = `a,b,c\n1,${quoted ? `"${cell}"` : cell},3\n`;
          const e = refusal(() => checkCsvLimits(text));
          expect(e.issues?.[0]).toMatchObject({ row: 2, column: "b" });
        },
      ),
    );
  });

  it("tabs, quoted line breaks and quoted delimiters are data, not problems; rows count as a spreadsheet does", () => {
    expect(() => checkCsvLimits('a,b\n"x\ny",\t2\r\n"1,2",3\n')).not.toThrow();
    const e = refusal(() => checkCsvLimits(`a,b\n"x\ny",2\n3,4\u0007\n`));
    expect(e.issues?.[0]).toMatchObject({ row: 3, column: "b" });
  });

  it(`a cell over ${CSV_MAX_CELL_CHARS} characters is refused; exactly ${CSV_MAX_CELL_CHARS} is not`, () => {
    expect(() => checkCsvLimits(`a,b\n1,${"9".repeat(CSV_MAX_CELL_CHARS)}\n`)).not.toThrow();
    const e = refusal(() => checkCsvLimits(`a,b\n1,${"9".repeat(CSV_MAX_CELL_CHARS + 1)}\n`));
    expect(e.issues?.[0]).toMatchObject({ row: 2, column: "b" });
    // 20 MB in one cell: refused without being stored.
    const big = refusal(() =>
      parseDatasetFile(form, bytes(`${good}bore C,diameter,${"1".repeat(20e6)},25,0,1,mm\n`)),
    );
    expect(big.status).toBe(422);
  });

  it(`more than ${CSV_MAX_COLUMNS} columns is refused at the first wide row, even a million of them`, () => {
    const ok = Array.from({ length: CSV_MAX_COLUMNS }, (_, i) => `c${i}`).join(",");
    expect(() => checkCsvLimits(`${ok}\n`)).not.toThrow();
    const e = refusal(() => checkCsvLimits(`${ok},extra\n`));
    expect(e.issues?.[0]).toMatchObject({ row: 1 });
    expect(e.message).toMatch(/more than 200 columns/);
    const wide = refusal(() => parseDatasetFile(form, bytes(`${",".repeat(1e6)}\n1\n`)));
    expect(wide.status).toBe(422);
    // semicolon files count their columns too
    expect(refusal(() => checkCsvLimits(`${";".repeat(CSV_MAX_COLUMNS)}\n`)).status).toBe(422);
  });
});
