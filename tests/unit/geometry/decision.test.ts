// ISO 14253-1 decision rules: simple acceptance (U shown, not subtracted) and guarded acceptance
// (conformance proven inside [LSL + U, USL − U], non-conformance outside [LSL − U, USL + U],
// neither between); one-sided tolerances have only the upper limit.
import { describe, expect, it } from "vitest";
import { decide, decisionText, GeometryError } from "@/geometry";

const two = { lower: 9.98, upper: 10.02, U: 0.005 };

describe("decide (ISO 14253-1)", () => {
  it.each([
    ["inside the shrunk zone", 10.0, "pass"],
    ["on LSL + U (inclusive)", 9.985, "pass"],
    ["in the lower guard band, inside the limit", 9.982, "undecided"],
    ["in the lower guard band, outside the limit", 9.977, "undecided"],
    ["in the upper guard band, inside the limit", 10.018, "undecided"],
    ["in the upper guard band, outside the limit", 10.023, "undecided"],
    ["below LSL − U", 9.974, "fail"],
    ["above USL + U", 10.026, "fail"],
  ] as const)("guarded, two-sided: %s → %s", (_label, measured, expected) => {
    const r = decide({ ...two, measured, rule: "guarded", unit: "mm" });
    expect(r.decision).toBe(expected);
    expect(r).toMatchObject({ measured, lower: 9.98, upper: 10.02, U: 0.005, rule: "guarded", unit: "mm" });
  });

  it.each([
    [10.0, "pass"],
    [9.982, "pass"],
    [10.02, "pass"],
    [10.023, "fail"],
    [9.977, "fail"],
  ] as const)("simple acceptance: %s → %s (U shown, not subtracted)", (measured, expected) => {
    const r = decide({ ...two, measured, rule: "simple" });
    expect(r.decision).toBe(expected);
    expect(r.U).toBe(0.005);
  });

  it.each([
    [0.004, "pass"],
    [0.008, "undecided"],
    [0.012, "undecided"],
    [0.016, "fail"],
    [-1, "pass"],
  ] as const)("guarded, one-sided (flatness ≤ 0.01, U 0.003): %s → %s", (measured, expected) => {
    expect(decide({ measured, lower: null, upper: 0.01, U: 0.003, rule: "guarded" }).decision).toBe(expected);
  });

  it("U larger than half the tolerance leaves no pass zone (guarded)", () => {
    expect(decide({ measured: 10, lower: 9.99, upper: 10.01, U: 0.02, rule: "guarded" }).decision).toBe(
      "undecided",
    );
  });

  it("refuses impossible input", () => {
    expect(() => decide({ measured: 1, lower: 2, upper: 1, U: 0, rule: "simple" })).toThrow(GeometryError);
    expect(() => decide({ measured: 1, lower: 0, upper: 2, U: -1, rule: "guarded" })).toThrow(GeometryError);
    expect(() => decide({ measured: NaN, lower: 0, upper: 2, U: 0, rule: "guarded" })).toThrow(GeometryError);
    expect(() => decide({ measured: 1, lower: 0, upper: 2, U: 0, rule: "strict" as "simple" })).toThrow(
      GeometryError,
    );
  });

  it("guarded without U is undecided — U missing, never a silent simple decision (ISO 14253-1)", () => {
    // 19.5″ against a 20″ limit: passes by the simple rule, cannot be proven by the guarded rule.
    const r = decide({ measured: 19.5, lower: null, upper: 20, U: null, rule: "guarded", unit: "arcsec" });
    expect(r.decision).toBe("undecided");
    expect(r.reason).toBe("U missing");
    expect(decisionText(r)).toBe("undecided — U missing");
    // Even far outside the limits: without U the guarded rule states what is missing.
    expect(decide({ measured: 50, lower: null, upper: 20, U: null, rule: "guarded" }).reason).toBe(
      "U missing",
    );
    const simple = decide({ measured: 19.5, lower: null, upper: 20, U: null, rule: "simple" });
    expect(simple.decision).toBe("pass");
    expect(simple.reason).toBeUndefined();
    expect(decisionText(simple)).toBe("pass");
    expect(decide({ measured: 19.5, lower: null, upper: 20, U: 1, rule: "guarded" }).decision).toBe(
      "undecided",
    );
    expect(decide({ measured: 18.5, lower: null, upper: 20, U: 1, rule: "guarded" }).decision).toBe("pass");
  });
});
