// Exact unit definitions: 1 in = 25.4 mm (International Yard and Pound Agreement 1959; NIST SP 811),
// 1″ = π/648000 rad (definition of the arc second), 1° = π/180 rad.
import fc from "fast-check";
import { unit } from "mathjs";
import { describe, expect, it } from "vitest";
import {
  fromMm,
  fromRad,
  MM_PER_INCH,
  RAD_PER_ARCSEC,
  RAD_PER_DEG,
  slopeToUmPerM,
  toMm,
  toRad,
} from "@/geometry";

describe("units", () => {
  it("every factor agrees with mathjs's unit system (an independent library)", () => {
    expect(toMm(1, "in")).toBe(unit(1, "inch").toNumber("mm"));
    expect(toMm(1, "um")).toBe(unit(1, "um").toNumber("mm"));
    expect(toRad(1, "deg")).toBe(unit(1, "deg").toNumber("rad"));
    expect(toRad(1, "arcsec")).toBe(unit(1, "arcsec").toNumber("rad"));
  });
  it("1 in = 25.4 mm exactly (NIST SP 811); a tenth is 2.54 µm; 1 in = 25 400 µm", () => {
    expect(MM_PER_INCH).toBe(25.4);
    expect(toMm(1, "in")).toBe(25.4);
    expect(toMm(0.0001, "in") * 1000).toBeCloseTo(2.54, 14);
    expect(MM_PER_INCH * 1000).toBe(25400);
    expect(toMm(1000, "um")).toBe(1);
  });
  it("1″ = π/648000 rad = 4.848137e-6 rad; 1° = π/180 rad (definitions)", () => {
    expect(RAD_PER_ARCSEC).toBe(Math.PI / 648000);
    expect(RAD_PER_ARCSEC).toBeCloseTo(4.848137e-6, 12);
    expect(RAD_PER_DEG).toBe(Math.PI / 180);
    expect(fromRad(toRad(1, "deg"), "arcsec")).toBeCloseTo(3600, 9);
  });
  it("1″ as a slope is 4.8481 µm/m (definition: 1″ = π/648000 rad)", () => {
    expect(slopeToUmPerM(Math.tan(RAD_PER_ARCSEC))).toBeCloseTo(4.8481, 4);
  });
  it("round trips: exact for mm and rad, within one ulp for in, µm, deg, arcsec on normal doubles (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e6, max: 1e6, noNaN: true }).filter((x) => x === 0 || Math.abs(x) > 1e-300),
        (v) => {
          expect(fromMm(toMm(v, "mm"), "mm")).toBe(v);
          expect(toRad(fromRad(v, "rad"), "rad")).toBe(v);
          for (const u of ["in", "um"] as const) {
            const back = fromMm(toMm(v, u), u);
            expect(Math.abs(back - v)).toBeLessThanOrEqual(Math.abs(v) * Number.EPSILON);
          }
          for (const u of ["deg", "arcsec"] as const) {
            const back = fromRad(toRad(v, u), u);
            expect(Math.abs(back - v)).toBeLessThanOrEqual(Math.abs(v) * Number.EPSILON);
          }
        },
      ),
      { numRuns: 500 },
    );
  });
  it("inch values written with up to 4 decimals round-trip exactly through mm and back to the printed value", () => {
    fc.assert(
      fc.property(fc.integer({ min: -(10 ** 8), max: 10 ** 8 }), (k) => {
        const inch = k / 10000;
        expect(Number(fromMm(toMm(inch, "in"), "in").toFixed(4))).toBe(inch);
      }),
      { numRuns: 500 },
    );
  });
});
