// Axis ticks of the server-rendered charts (lib/chart-ticks.ts, shared by every chart on the pages and in the PDF): the 1-2-5 rule of chart
// axes (common practice), checked against ranges worked out by hand.
import { describe, expect, it } from "vitest";
import { niceTicks } from "@/lib/chart-ticks";

describe("niceTicks", () => {
  it("covers the range with steps of 1, 2 or 5 × 10ⁿ (worked by hand)", () => {
    // 0…38 in about 4 intervals: raw 9.5 → step 10, ticks 0…40.
    expect(niceTicks(0, 38)).toEqual({ min: 0, max: 40, step: 10, ticks: [0, 10, 20, 30, 40] });
    // −22…18: raw 10 → step 10, −30…20.
    expect(niceTicks(-22, 18).ticks).toEqual([-30, -20, -10, 0, 10, 20]);
    // 0.3…1.1: raw 0.2 → step 0.2, 0.2…1.2.
    expect(niceTicks(0.3, 1.1).ticks).toEqual([0.2, 0.4, 0.6, 0.8, 1, 1.2]);
    // −3…6: raw 2.25 → step 5, −5…10.
    expect(niceTicks(-3, 6)).toMatchObject({ min: -5, max: 10, step: 5 });
  });

  it("widens an empty range, swaps a reversed one and refuses a non-finite one", () => {
    expect(niceTicks(0, 0).ticks).toEqual([-1, -0.5, 0, 0.5, 1]);
    expect(niceTicks(10, 0).ticks).toEqual(niceTicks(0, 10).ticks);
    expect(() => niceTicks(0, Number.NaN)).toThrow(RangeError);
  });

  it("the ticks always include both ends of the data", () => {
    for (const [lo, hi] of [
      [-0.7, 51.3],
      [3.2, 3.9],
      [-1234, -2],
      [0.001, 0.0043],
    ] as const) {
      const t = niceTicks(lo, hi);
      expect(t.min).toBeLessThanOrEqual(lo);
      expect(t.max).toBeGreaterThanOrEqual(hi);
      expect(t.ticks.length).toBeGreaterThanOrEqual(2);
      expect(t.ticks.length).toBeLessThanOrEqual(9);
    }
  });
});
