// Property (fast-check): any text either reads as finite numbers or throws a GeometryError whose
// issues each name a row or a column — never another exception, never a non-finite number.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { GeometryError, readSphereProbeCsv, readTestPartCsv, readTramCsv } from "@/geometry";

const HEADER = "primary_deg,secondary_deg,x,y,z";
const piece = fc.constantFrom(
  ",",
  ";",
  '"',
  '""',
  "\n",
  "\r\n",
  "\r",
  " ",
  "1",
  "-2.5",
  "1,5",
  "1e3",
  "NaN",
  "Infinity",
  "x",
  "\ufeff",
  "",
  "0.",
);
const csvish = fc.oneof(
  fc.string({ maxLength: 80 }),
  fc.array(piece, { maxLength: 40 }).map((a) => a.join("")),
  fc.array(piece, { maxLength: 40 }).map((a) => `${HEADER}\n${a.join("")}`),
  fc
    .array(fc.tuple(fc.double(), fc.double(), fc.double(), fc.double(), fc.double()), { maxLength: 6 })
    .map((rows) => `${HEADER}\n${rows.map((r) => r.join(",")).join("\n")}`),
);

function check(fn: () => { rows: number }): void {
  try {
    const d = fn();
    expect(d.rows).toBeGreaterThan(0);
    for (const v of Object.values(d as object)) {
      if (v instanceof Float64Array) for (const x of v) expect(Number.isFinite(x)).toBe(true);
    }
  } catch (e) {
    expect(e).toBeInstanceOf(GeometryError);
    for (const issue of (e as GeometryError).issues) {
      expect(issue.row !== undefined || issue.column !== undefined).toBe(true);
      expect(issue.message.length).toBeGreaterThan(0);
    }
  }
}

describe("CSV readers on arbitrary text", () => {
  it("yield finite data or a GeometryError with located issues", () => {
    fc.assert(
      fc.property(csvish, fc.constantFrom("point" as const, "comma" as const), (text, decimal) => {
        check(() => readSphereProbeCsv(text, { units: "in", decimal }));
        check(() =>
          readTramCsv(text.replace(HEADER, "travel,reading,note"), {
            travelUnits: "mm",
            readingUnits: "um",
            decimal,
          }),
        );
        try {
          const rows = readTestPartCsv(
            text.replace(HEADER, "feature,characteristic,nominal,measured,lower_tol,upper_tol"),
            {
              decimal,
            },
          );
          for (const r of rows) expect(Number.isFinite(r.measured) && Number.isFinite(r.upperTol)).toBe(true);
        } catch (e) {
          expect(e).toBeInstanceOf(GeometryError);
          for (const i of (e as GeometryError).issues)
            expect(i.row !== undefined || i.column !== undefined).toBe(true);
        }
      }),
      { numRuns: 400 },
    );
  });

  it("round-trips every double written by JavaScript (correctly rounded parsing, ECMA-262 Number)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ noNaN: true, noDefaultInfinity: true }), { minLength: 5, maxLength: 5 }),
        (v) => {
          const d = readSphereProbeCsv(
            `${HEADER}\n${v.map((x) => (Object.is(x, -0) ? "-0" : String(x))).join(",")}\n`,
            {
              units: "mm",
            },
          );
          expect([d.primaryDeg[0], d.secondaryDeg[0], d.xMm[0], d.yMm[0], d.zMm[0]]).toEqual(v);
        },
      ),
      { numRuns: 300 },
    );
  });

  it("fixed-point decimals like instrument output parse exactly as Number() does", () => {
    fc.assert(
      fc.property(fc.integer({ min: -(10 ** 12), max: 10 ** 12 }), fc.integer({ min: 0, max: 9 }), (m, k) => {
        const s = (m / 10 ** k).toFixed(k);
        const d = readTramCsv(`travel,reading\n${s},0\n`, { travelUnits: "mm", readingUnits: "um" });
        expect(d.travelMm[0]).toBe(Number(s));
      }),
      { numRuns: 300 },
    );
  });
});
