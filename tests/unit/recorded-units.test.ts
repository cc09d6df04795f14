// Units as recorded (ISO/IEC 17025:2017 §7.8.2.1): the report prints values in the unit the job
// recorded them in. Conversions are checked against the exact definition 1 in = 25.4 mm (NIST SP
// 811, Appendix B.8; International Yard and Pound Agreement 1959) and 1° = 3600″ (definition of
// the arc second); decimals against the instrument's resolution.
import { describe, expect, it } from "vitest";
import {
  decimalsForResolution,
  formatAngleExpandedArcsec,
  formatExpanded,
  formatRecorded,
  formatRecordedLimits,
  recordedUnitSystem,
} from "@/lib/recorded-units";

describe("recordedUnitSystem", () => {
  it("is inch when most length readings were entered in inch", () => {
    expect(recordedUnitSystem(["in", "in", "mm", "arcsec"])).toBe("inch");
    expect(recordedUnitSystem(["mm", "um", "in"])).toBe("metric");
    expect(recordedUnitSystem(["in", "mm"])).toBe("metric");
    expect(recordedUnitSystem(["arcsec"])).toBe("metric");
    expect(recordedUnitSystem([])).toBe("metric");
  });
});

describe("decimalsForResolution", () => {
  it("shows one resolution step (0.0001 in = 0.00254 mm exactly, NIST SP 811)", () => {
    expect(decimalsForResolution(0.00254, "in")).toBe(4);
    expect(decimalsForResolution(0.0127, "in")).toBe(4); // 0.0005 in
    expect(decimalsForResolution(0.001, "mm")).toBe(3);
    expect(decimalsForResolution(0.0005, "mm")).toBe(4);
    expect(decimalsForResolution(0.01, "mm")).toBe(2);
    expect(decimalsForResolution(0.1, "arcsec")).toBe(1);
    expect(decimalsForResolution(1, "arcsec")).toBe(0);
    // A metric gauge (0.01 mm) read on an inch job: 0.01 / 25.4 = 0.000394 in, shown to 0.0001 in.
    expect(decimalsForResolution(0.01, "in")).toBe(4);
    // An inch indicator (0.0001 in = 0.00254 mm) shown in mm: to 0.001 mm.
    expect(decimalsForResolution(0.00254, "mm")).toBe(3);
  });
  it("falls back to the unit's usual decimals without a resolution", () => {
    expect(decimalsForResolution(null, "in")).toBe(4);
    expect(decimalsForResolution(0, "mm")).toBe(3);
  });
});

describe("formatRecorded", () => {
  it("prints an inch reading in inch with mm beside (0.0003 in = 0.00762 mm, NIST SP 811)", () => {
    expect(formatRecorded(0.0003 * 25.4, "length", "inch", { resolution: 0.00254 })).toBe(
      "0.0003 in (0.008 mm)",
    );
    expect(formatRecorded(-0.0012 * 25.4, "length", "inch", { resolution: 0.00254, signed: true })).toBe(
      "−0.0012 in (−0.030 mm)",
    );
  });
  it("prints a metric reading at the instrument's resolution", () => {
    expect(formatRecorded(0.0123, "length", "metric", { resolution: 0.001 })).toBe("0.012 mm");
    expect(formatRecorded(0.0123, "length", "metric", { resolution: 0.0005 })).toBe("0.0123 mm");
    expect(formatRecorded(0.004, "length", "metric", { signed: true })).toBe("+0.004 mm");
  });
  it("prints angles in arc seconds whatever the unit system", () => {
    expect(formatRecorded(10.31, "angle", "inch", { resolution: 0.1 })).toBe("10.3″");
  });
  it("prints an undefined value as a dash, never as zero", () => {
    expect(formatRecorded(null, "length", "inch")).toBe("—");
    expect(formatRecorded(Number.NaN, "length", "metric")).toBe("—");
  });
});

describe("formatRecordedLimits", () => {
  it("prints an inch limit in inch, exactly, with its exact mm value beside (0.0004 in = 0.01016 mm)", () => {
    expect(formatRecordedLimits(-0.0004 * 25.4, 0.0004 * 25.4, "length", "inch")).toBe(
      "± 0.0004 in (± 0.01016 mm)",
    );
    expect(formatRecordedLimits(null, 0.0005 * 25.4, "length", "inch")).toBe("≤ 0.0005 in (≤ 0.0127 mm)");
  });
  it("prints a metric limit in mm only", () => {
    expect(formatRecordedLimits(null, 0.01, "length", "metric")).toBe("≤ 0.010 mm");
    expect(formatRecordedLimits(null, null, "length", "inch")).toBe("no limit");
  });
});

describe("formatExpanded", () => {
  it("prints U one decimal finer than the reading, in the job's unit", () => {
    // 0.00508 mm = 0.0002 in exactly (NIST SP 811)
    expect(formatExpanded(0.00508, "length", "inch", { resolution: 0.00254 })).toBe(
      "± 0.00020 in (± 0.0051 mm)",
    );
    expect(formatExpanded(0.0042, "length", "metric", { resolution: 0.001 })).toBe("± 0.0042 mm");
  });
  it("prints a dash with the reason when U is undefined, never 0.000", () => {
    expect(formatExpanded(0, "length", "metric", { reason: "no instrument named" })).toBe(
      "— (no instrument named)",
    );
    expect(formatExpanded(null, "length", "inch")).not.toMatch(/0\.0+/);
  });
});

describe("formatAngleExpandedArcsec", () => {
  it("prints a test part angle's U in arc seconds (1° = 3600″ by definition)", () => {
    expect(formatAngleExpandedArcsec(0.001, "deg")).toBe("± 3.6″");
    expect(formatAngleExpandedArcsec(2.25, "arcsec")).toBe("± 2.3″");
    expect(formatAngleExpandedArcsec(0, "deg")).toBe("— (not stated)");
  });
});
