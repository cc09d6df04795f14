// Sphere-probe CSV reader against the rules of geometry/README.md "CSV formats" (RFC 4180 quoting).
import { describe, expect, it } from "vitest";
import { readSphereProbeCsv } from "@/geometry";
import { fixture, refused, thrown } from "./csv-helpers";

/** Reading this fixture file in mm, to hand to `refused`. */
const readingMm = (name: string) => () => readSphereProbeCsv(fixture(name), { units: "mm" });

describe("readSphereProbeCsv", () => {
  it("reads a good file with optional columns", () => {
    const d = readSphereProbeCsv(fixture("sphere-good.csv"), { units: "mm" });
    expect(d.rows).toBe(3);
    expect(Array.from(d.primaryDeg)).toEqual([0, 90, 180]);
    expect(Array.from(d.secondaryDeg)).toEqual([0, 0, -45.5]);
    expect(Array.from(d.xMm)).toEqual([100.001, 99.998, 100.0025]);
    expect(Array.from(d.zMm)).toEqual([-50.5, -50.501, -50.4995]);
    expect(Array.from(d.toolMm!)).toEqual([0, 0, 25.4]);
    expect(Array.from(d.point!)).toEqual([1, 2, 3]);
    expect(d.tempC).toBeUndefined();
    expect(Array.from(d.sourceRow!)).toEqual([2, 3, 4]);
    expect(d.warnings).toEqual([]);
  });

  it("converts inch coordinates exactly (1 in = 25.4 mm, NIST SP 811); tool_mm stays mm", () => {
    const d = readSphereProbeCsv("primary_deg,secondary_deg,x,y,z,tool_mm\n0,0,1,-2.5,0.0001,10\n", {
      units: "in",
    });
    expect(Array.from(d.xMm)).toEqual([25.4]);
    expect(Array.from(d.yMm)).toEqual([-63.5]);
    expect(d.zMm[0]).toBeCloseTo(0.00254, 15);
    expect(Array.from(d.toolMm!)).toEqual([10]);
  });

  it("UTF-8 BOM, semicolons, mixed-case padded header, CRLF, trailing blank lines, decimal comma allowed", () => {
    const d = readSphereProbeCsv(fixture("sphere-bom-semicolon-decimal-comma.csv"), {
      units: "mm",
      decimal: "comma",
    });
    expect(d.rows).toBe(2);
    expect(Array.from(d.xMm)).toEqual([100.001, 0.001]);
    expect(Array.from(d.yMm)).toEqual([200.002, -0.25]);
    expect(Array.from(d.secondaryDeg)).toEqual([0, 30]);
    expect(d.warnings).toEqual([]);
  });

  it("decimal comma in a semicolon file without the option is an error naming row and column", () => {
    const e = refused(readingMm("sphere-bom-semicolon-decimal-comma.csv"), "decimal_comma", [
      {
        row: 2,
        column: "X",
        message:
          "'100,001' uses a decimal comma; write a decimal point (100.001) or choose the decimal-comma option for this semicolon-separated file",
      },
      {
        row: 2,
        column: "Y",
        message:
          "'200,002' uses a decimal comma; write a decimal point (200.002) or choose the decimal-comma option for this semicolon-separated file",
      },
      {
        row: 2,
        column: "Z",
        message:
          "'-50,5' uses a decimal comma; write a decimal point (-50.5) or choose the decimal-comma option for this semicolon-separated file",
      },
      {
        row: 3,
        column: "Y",
        message:
          "'-0,25' uses a decimal comma; write a decimal point (-0.25) or choose the decimal-comma option for this semicolon-separated file",
      },
    ]);
    expect(e.message).toMatch(/^4 problems in the CSV file: row 2, column X: '100,001' uses a decimal comma/);
  });

  it("decimal comma (quoted) in a comma file is an error", () => {
    const e = refused(readingMm("sphere-decimal-comma-in-comma-file.csv"), "decimal_comma", [
      { row: 5, column: "x", message: "'1,25' uses a decimal comma; write a decimal point (1.25)" },
    ]);
    expect(e.message).toBe("row 5, column x: '1,25' uses a decimal comma; write a decimal point (1.25)");
  });

  it("the decimal-comma option with a comma-separated file is refused", () => {
    const e = thrown(() => readSphereProbeCsv(fixture("sphere-good.csv"), { units: "mm", decimal: "comma" }));
    expect(e.code).toBe("bad_option");
    expect(e.issues[0]).toMatchObject({ row: 1 });
  });

  it("decimal point under the decimal-comma option is an error (no guessing thousands separators)", () => {
    const e = thrown(() =>
      readSphereProbeCsv("primary_deg;secondary_deg;x;y;z\n0;0;1.5;2;3\n", { units: "mm", decimal: "comma" }),
    );
    expect(e.issues).toEqual([
      {
        row: 2,
        column: "x",
        message: "'1.5' uses a decimal point, but the decimal-comma option was chosen for this file",
      },
    ]);
  });

  it("missing column", () => {
    refused(readingMm("sphere-missing-column.csv"), "missing_column", [
      {
        row: 1,
        column: "z",
        message: "the required column 'z' is missing (expected: primary_deg, secondary_deg, x, y, z)",
      },
    ]);
  });

  it("duplicated column (case-insensitive)", () => {
    refused(readingMm("sphere-duplicate-column.csv"), "duplicate_column", [
      { row: 1, column: "X", message: "the column 'x' appears more than once in the header" },
    ]);
  });

  it("text, NaN, Infinity, empty and overflowing numbers: all collected", () => {
    refused(readingMm("sphere-bad-numbers.csv"), "bad_number", [
      { row: 2, column: "x", message: "'abc' is not a number" },
      { row: 3, column: "y", message: "'NaN' is not a finite number" },
      { row: 4, column: "z", message: "'Infinity' is not a finite number" },
      { row: 5, column: "secondary_deg", message: "empty; a number is required" },
      { row: 6, column: "x", message: "'1e999' is not a finite number (out of range)" },
    ]);
  });

  it("ragged rows: too few and too many fields", () => {
    refused(readingMm("sphere-ragged.csv"), "ragged_row", [
      { row: 3, message: "has 4 fields, the header has 5" },
      {
        row: 4,
        message:
          "has 6 fields, the header has 5; a decimal comma in a comma-separated file splits a number in two — use a decimal point",
      },
    ]);
  });

  it("unclosed quote names the row and column where it opens", () => {
    refused(readingMm("sphere-unclosed-quote.csv"), "quote", [
      { row: 3, column: "x", message: "a quote opens here and is never closed" },
    ]);
  });

  it("empty file and header only", () => {
    refused(readingMm("empty.csv"), "empty", [
      { row: 1, message: "the file is empty; a header row is required" },
    ]);
    expect(thrown(() => readSphereProbeCsv("\ufeff \r\n\n", { units: "mm" })).code).toBe("empty");
    refused(readingMm("sphere-header-only.csv"), "too_few_rows", [
      { row: 1, message: "the file has a header row but no data rows" },
    ]);
  });

  it("unknown columns and interior blank rows are warnings, not errors", () => {
    const d = readSphereProbeCsv("primary_deg,secondary_deg,x,y,z,probe\n0,0,1,2,3,a\n\n90,0,1,2,3,b\n", {
      units: "mm",
    });
    expect(d.rows).toBe(2);
    expect(Array.from(d.sourceRow!)).toEqual([2, 4]);
    expect(d.warnings).toEqual([
      { row: 1, column: "probe", message: "unknown column 'probe' is ignored" },
      { row: 3, message: "blank row is ignored" },
    ]);
  });

  it("accepts the number grammar: signs, exponents, leading/trailing point, spaces, quoted numbers", () => {
    const d = readSphereProbeCsv(
      'primary_deg,secondary_deg,x,y,z\n+1, -2 ,.5,5.,"1.5e-3"\n-0,1E+2,12345678901234567890,0.1,-1e-310\n',
      {
        units: "mm",
      },
    );
    expect(Array.from(d.primaryDeg)).toEqual([1, -0]);
    expect(Array.from(d.secondaryDeg)).toEqual([-2, 100]);
    expect(Array.from(d.xMm)).toEqual([0.5, 12345678901234567890]);
    expect(Array.from(d.yMm)).toEqual([5, 0.1]);
    expect(Array.from(d.zMm)).toEqual([0.0015, -1e-310]);
  });

  it("rejects hexadecimal, thousands separators and stray signs", () => {
    const e = thrown(() =>
      readSphereProbeCsv("primary_deg,secondary_deg,x,y,z\n0x10,1 000,-,1e,+-1\n", { units: "mm" }),
    );
    expect(e.issues.map((i) => i.column)).toEqual(["primary_deg", "secondary_deg", "x", "y", "z"]);
  });

  it("bad units option", () => {
    expect(thrown(() => readSphereProbeCsv(fixture("sphere-good.csv"), { units: "cm" as "mm" })).code).toBe(
      "bad_option",
    );
  });

  it("stops after 50 issues and says so", () => {
    const body = Array.from({ length: 80 }, () => "0,0,x,2,3").join("\n");
    const e = thrown(() => readSphereProbeCsv(`primary_deg,secondary_deg,x,y,z\n${body}\n`, { units: "mm" }));
    expect(e.issues).toHaveLength(50);
    expect(e.message).toContain("(and 45 more, reading stopped)");
  });
});
