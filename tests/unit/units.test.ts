// Display units of checklist values. Exact definitions: 1 in = 25.4 mm (International Yard and
// Pound Agreement 1959; NIST SP 811, B.8), so a tenth (0.0001 in) is 2.54 µm; 1″ = π/648000 rad
// (definition), so 1″ ≈ 4.8481 µm/m (follows from the two definitions).
import { describe, expect, it } from "vitest";
import {
  arcsecToUmPerM,
  displayUnit,
  formatLimits,
  formatValue,
  fromCanonical,
  roundForDisplay,
  toCanonical,
} from "@/lib/units";

describe("conversions (NIST SP 811: 1 in = 25.4 mm exactly)", () => {
  it("1 in is 25.4 mm and a tenth is 0.00254 mm", () => {
    expect(toCanonical(1, "in")).toBe(25.4);
    expect(toCanonical(0.0001, "in")).toBeCloseTo(0.00254, 15);
    expect(toCanonical(1000, "um")).toBe(1);
    expect(fromCanonical(25.4, "in")).toBe(1);
  });
  it("1/16 in = 1.5875 mm and 1/8 in = 3.175 mm (exact from the definition)", () => {
    expect(toCanonical(1 / 16, "in")).toBe(1.5875);
    expect(toCanonical(1 / 8, "in")).toBe(3.175);
  });
  it("angles are stored in arc seconds unchanged", () => {
    expect(toCanonical(10.31, "arcsec")).toBe(10.31);
  });
  it("1″ is 4.8481 µm/m (definition of the arc second)", () => {
    expect(arcsecToUmPerM(1)).toBeCloseTo(4.8481, 4);
  });
  it("the unit shown follows the user's system; angles are arc seconds in both", () => {
    expect(displayUnit("length", "inch")).toBe("in");
    expect(displayUnit("length", "metric")).toBe("mm");
    expect(displayUnit("angle", "inch")).toBe("arcsec");
  });
});

describe("display rounding: inch to tenths (0.0001 in), metric to 0.001 mm, angles to 0.1″", () => {
  it("0.0005 in TIR (12.7 µm, common practice) shows as 0.0005 in and 0.013 mm", () => {
    expect(formatValue(0.0127, "length", "inch")).toBe("0.0005 in");
    expect(formatValue(0.0127, "length", "metric")).toBe("0.013 mm");
  });
  it("a value that is a tenth in binary noise still shows as 0.0001 in", () => {
    expect(roundForDisplay(fromCanonical(0.00254, "in"), "in")).toBe("0.0001");
  });
  it("half a tenth rounds away from zero, and −0 never appears", () => {
    expect(roundForDisplay(0.00005, "in")).toBe("0.0001");
    expect(roundForDisplay(-0.00005, "in")).toBe("-0.0001");
    expect(roundForDisplay(-0.00004, "in")).toBe("0.0000");
    expect(roundForDisplay(0.0005, "mm")).toBe("0.001");
  });
  it("signed changes carry a plus or a minus sign", () => {
    expect(formatValue(-0.01524, "length", "inch", { signed: true })).toBe("−0.0006 in");
    expect(formatValue(0.00254, "length", "inch", { signed: true })).toBe("+0.0001 in");
    expect(formatValue(0, "length", "inch", { signed: true })).toBe("0.0000 in");
  });
  it("angles show to 0.1″: 0.0005 in over 10 in is 10.3″ (common practice: trigonometry of the trade)", () => {
    expect(formatValue(10.3132, "angle", "metric")).toBe("10.3″");
  });
  it("limits read as the trade writes them", () => {
    expect(formatLimits(null, 0.0127, "length", "inch")).toBe("≤ 0.0005 in");
    expect(formatLimits(1.5875, 3.175, "length", "inch")).toBe("0.0625 to 0.1250 in");
    expect(formatLimits(-10, 10, "angle", "inch")).toBe("± 10.0″");
    expect(formatLimits(null, null, "length", "metric")).toBe("no limit");
    // Limits are shown exactly: 0.0005 in = 12.7 µm reads 0.0127 mm, 1/16 in = 1.5875 mm.
    expect(formatLimits(null, 0.0127, "length", "metric")).toBe("≤ 0.0127 mm");
    expect(formatLimits(1.5875, 3.175, "length", "metric")).toBe("1.5875 to 3.175 mm");
  });
  it("no value is a dash", () => {
    expect(formatValue(null, "length", "inch")).toBe("—");
    expect(formatValue(Number.NaN, "length", "inch")).toBe("—");
  });
});
