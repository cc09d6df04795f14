// Judging a checklist reading against its step's limits with geometry's ISO 14253-1 decision
// rules, and deriving the tilt angle from an indicator reading over a travel.
import { describe, expect, it } from "vitest";
import {
  calibrationRefusal,
  deriveReading,
  expandedUncertainty,
  judge,
  type StepRule,
} from "@/lib/checklist";

const IN = 25.4;
const collar: StepRule = {
  quantityKind: "length",
  derivation: "direct",
  distanceMm: null,
  lowerLimit: null,
  upperLimit: 0.0005 * IN,
  decisionRule: "simple",
};
const gap: StepRule = { ...collar, lowerLimit: IN / 16, upperLimit: IN / 8 };
const tilt: StepRule = {
  quantityKind: "angle",
  derivation: "angle_over_distance",
  distanceMm: 10 * IN,
  lowerLimit: -15,
  upperLimit: 15,
  decisionRule: "simple",
};

describe("decision against limits (ISO 14253-1 via geometry/decision)", () => {
  it("collar TIR ≤ 0.0005 in (common practice): 0.0003 in passes, 0.0009 in fails, exactly on the limit conforms", () => {
    expect(judge(collar, deriveReading(collar, { value: 0.0003, unit: "in" }).value)).toBe("pass");
    expect(judge(collar, deriveReading(collar, { value: 0.0009, unit: "in" }).value)).toBe("fail");
    expect(judge(collar, deriveReading(collar, { value: 0.0005, unit: "in" }).value)).toBe("pass");
  });
  it("gap 1/16 to 1/8 in (common practice): 0.094 in passes, 0.05 and 0.13 in fail", () => {
    expect(judge(gap, toMm(0.094))).toBe("pass");
    expect(judge(gap, toMm(0.05))).toBe("fail");
    expect(judge(gap, toMm(0.13))).toBe("fail");
  });
  it("guarded acceptance shrinks the zone by U: pass inside [L+U, U−U], undecided in the guard band, fail outside [L−U, U+U]", () => {
    const guarded: StepRule = { ...collar, decisionRule: "guarded" };
    const U = 0.003;
    expect(judge(guarded, 0.009, U)).toBe("pass");
    expect(judge(guarded, 0.011, U)).toBe("undecided");
    expect(judge(guarded, 0.014, U)).toBe("undecided");
    expect(judge(guarded, 0.016, U)).toBe("fail");
    // No instrument uncertainty (U 0 or none): the guarded rule cannot decide — U missing (ISO 14253-1).
    expect(judge(guarded, 0.009)).toBe("undecided");
    expect(judge(guarded, 0.009, expandedUncertainty(guarded, null))).toBe("undecided");
    expect(judge(collar, 0.009)).not.toBe("undecided");
  });
  it("a lower-only limit is judged by mirroring", () => {
    const atLeast: StepRule = { ...collar, lowerLimit: 1, upperLimit: null };
    expect(judge(atLeast, 1.2)).toBe("pass");
    expect(judge(atLeast, 0.8)).toBe("fail");
  });
  it("no value is not measured; no limits is recorded only", () => {
    expect(judge(collar, null)).toBe("not_measured");
    expect(judge({ ...collar, upperLimit: null }, 1)).toBe("no_limit");
  });
  it("U (k = 2, JCGM 100) is twice the instrument's standard uncertainty; over a travel it becomes an angle", () => {
    expect(expandedUncertainty(collar, 0.0012)).toBeCloseTo(0.0024, 12);
    // 0.0024 mm over 254 mm = 9.449e-6 rad = 1.949″
    expect(expandedUncertainty(tilt, 0.0012)).toBeCloseTo(1.949, 3);
    expect(expandedUncertainty(collar, null)).toBe(0);
  });
});

describe("tilt from a reading over a travel (geometry/angle)", () => {
  it("0.0005 in over 10 in is 50 µm/m, 10.31″ (common practice: trigonometry of the trade)", () => {
    const d = deriveReading(tilt, { value: 0.0005, unit: "in" });
    expect(d.value).toBeCloseTo(10.31, 2);
    expect(d.inputs?.slope_um_per_m).toBeCloseTo(50, 9);
    expect(judge(tilt, d.value)).toBe("pass");
  });
  it("the travel entered replaces the step's default distance", () => {
    const d = deriveReading(tilt, { value: 0.0005, unit: "in", travelMm: 5 * IN });
    expect(d.value).toBeCloseTo(20.63, 2);
  });
  it("an angle typed where a reading is expected, or a unit of the wrong kind, is refused with the reason", () => {
    expect(() => deriveReading(tilt, { value: 10, unit: "arcsec" })).toThrow(/length/);
    expect(() => deriveReading(collar, { value: 10, unit: "arcsec" })).toThrow(/length/);
    expect(() => deriveReading(tilt, { value: 1, unit: "in", travelMm: 0 })).toThrow();
  });
});

describe("calibration", () => {
  const inst = { serial: "DTI-0417", calibrationDueOn: "2026-09-30", retired: false };
  it("an instrument is usable up to and including its due date, and refused the day after with the reason", () => {
    expect(calibrationRefusal(inst, new Date("2026-09-30T23:00:00Z"))).toBeNull();
    expect(calibrationRefusal(inst, new Date("2026-10-01T07:00:00Z"))).toMatch(
      /DTI-0417 was due for calibration on 2026-09-30/,
    );
    expect(calibrationRefusal({ ...inst, retired: true }, new Date("2026-01-01"))).toMatch(/retired/);
  });
});

function toMm(inches: number) {
  return inches * IN;
}
