// Tram, sweep and test-part CSV readers against geometry/README.md "CSV formats" (RFC 4180 quoting).
import { describe, expect, it } from "vitest";
import { readPointsCsv, readSweepCsv, readTestPartCsv, readTramCsv } from "@/geometry";
import { fixture, refused, thrown } from "./csv-helpers";

describe("readTramCsv", () => {
  it("quoted notes (delimiter, doubled quote, line break), CRLF, unknown column, blank rows", () => {
    const d = readTramCsv(fixture("tram-good.csv"), { travelUnits: "mm", readingUnits: "um" });
    expect(d.rows).toBe(4);
    expect(Array.from(d.travelMm)).toEqual([0, 100, 200, 300]);
    expect(Array.from(d.readingUm)).toEqual([0, 2.5, 5, 7.5]);
    expect(d.note).toEqual(["start, at the left", 'he said "ok"', "two\r\nlines", undefined]);
    // The quoted line break stays in row 4; row 5 is blank, so the last reading is row 6.
    expect(Array.from(d.sourceRow!)).toEqual([2, 3, 4, 6]);
    expect(d.warnings).toEqual([
      { row: 1, column: "operator", message: "unknown column 'operator' is ignored" },
      { row: 5, message: "blank row is ignored" },
    ]);
  });

  it("converts inch travel and inch / mm readings exactly (1 in = 25.4 mm = 25 400 µm, NIST SP 811)", () => {
    const d = readTramCsv("travel,reading\n10,0.0005\n", { travelUnits: "in", readingUnits: "in" });
    expect(d.travelMm[0]).toBe(254);
    expect(d.readingUm[0]).toBeCloseTo(12.7, 12);
    const m = readTramCsv("travel,reading\n10,0.004\n", { travelUnits: "mm", readingUnits: "mm" });
    expect(m.readingUm[0]).toBe(4);
  });

  it("text after a closing quote is an error", () => {
    const read = () =>
      readTramCsv('travel,reading,note\n0,1,"a"b\n', { travelUnits: "mm", readingUnits: "um" });
    refused(read, "quote", [
      {
        row: 2,
        column: "note",
        message: "text after the closing quote; quote the whole field and double any quote inside it",
      },
    ]);
  });

  it("mixed line endings (LF, CR LF, lone CR) all end a row; no row is lost", () => {
    const d = readTramCsv("travel,reading\r0,1\n1,2\r\n2,3\r3,4\r4,5\n", {
      travelUnits: "mm",
      readingUnits: "um",
    });
    expect(Array.from(d.travelMm)).toEqual([0, 1, 2, 3, 4]);
    expect(Array.from(d.sourceRow!)).toEqual([2, 3, 4, 5, 6]);
  });

  it("bad reading units option", () => {
    expect(
      thrown(() => readTramCsv("travel,reading\n0,1\n", { travelUnits: "mm", readingUnits: "nm" as "um" }))
        .code,
    ).toBe("bad_option");
  });
});

describe("readSweepCsv", () => {
  it("reads angle and reading", () => {
    const d = readSweepCsv(fixture("sweep-good.csv"), { readingUnits: "um" });
    expect(Array.from(d.angleDeg)).toEqual([0, 90, 180, 270]);
    expect(Array.from(d.readingUm)).toEqual([10, 20, 10, 0]);
  });
  it("missing reading column", () => {
    const e = thrown(() => readSweepCsv("angle_deg,value\n0,1\n", { readingUnits: "um" }));
    expect(e.issues).toEqual([
      {
        row: 1,
        column: "reading",
        message: "the required column 'reading' is missing (expected: angle_deg, reading)",
      },
    ]);
  });
});

describe("readTestPartCsv", () => {
  it("reads rows; empty lower_tol is a one-sided tolerance; unit defaults to mm", () => {
    const rows = readTestPartCsv(fixture("test-part-good.csv"));
    expect(rows).toHaveLength(3);
    expect(rows[0]).toEqual({
      feature: "bore A",
      characteristic: "diameter",
      nominal: 25,
      measured: 25.004,
      lowerTol: 0,
      upperTol: 0.021,
      unit: "mm",
      sourceRow: 2,
    });
    expect(rows[1]!.lowerTol).toBeNull();
    expect(rows[1]!.unit).toBe("mm");
    expect(rows[2]!.unit).toBe("arcsec");
    expect(rows.warnings).toEqual([]);
  });
  it("unit column is optional", () => {
    const rows = readTestPartCsv(
      "feature,characteristic,nominal,measured,lower_tol,upper_tol\nA,len,1,1,-0.1,0.1\n",
    );
    expect(rows[0]!.unit).toBe("mm");
  });
  it("empty names, an unknown unit, an empty upper_tol and lower above upper are errors", () => {
    const e = thrown(() =>
      readTestPartCsv(
        "feature,characteristic,nominal,measured,lower_tol,upper_tol,unit\n,len,1,1,-0.1,0.1,mm\nA,,1,1,0.2,0.1,cm\nB,len,1,1,0,,mm\n",
      ),
    );
    expect(e.issues).toEqual([{ row: 4, column: "upper_tol", message: "empty; a number is required" }]);
    const f = thrown(() =>
      readTestPartCsv(
        "feature,characteristic,nominal,measured,lower_tol,upper_tol,unit\n,len,1,1,-0.1,0.1,mm\nA,,1,1,0.2,0.1,cm\n",
      ),
    );
    expect(f.code).toBe("bad_value");
    expect(f.issues).toEqual([
      { row: 2, column: "feature", message: "empty; name the feature" },
      { row: 3, column: "characteristic", message: "empty; name the characteristic" },
      { row: 3, column: "unit", message: "'cm' is not one of mm, in, um, deg, arcsec, um/m" },
      { row: 3, column: "lower_tol", message: "lower_tol 0.2 is above upper_tol 0.1" },
    ]);
  });
});

describe("readPointsCsv", () => {
  it("reads x, y, z from a sphere-probe file and warns about the columns it does not use", () => {
    const d = readPointsCsv(fixture("sphere-good.csv"), { units: "in" });
    expect(d.rows).toBe(3);
    expect(d.xMm[0]).toBeCloseTo(100.001 * 25.4, 10); // 1 in = 25.4 mm (NIST SP 811)
    expect(d.warnings.map((w) => w.column)).toEqual([
      "primary_deg",
      "secondary_deg",
      "point",
      "repeat",
      "tool_mm",
    ]);
  });
});
