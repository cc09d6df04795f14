// Coverage of the probed poses over the axes' range, counted by hand: the primary turn in twelve
// 30° sectors (angles read modulo 360°), the largest arc without a probed angle, the tilt span;
// and the advice that follows from it. The forecast itself is geometry's planner (tested there).
import { describe, expect, it } from "vitest";
import { coverageAdvice, nextVisitPlan, poseCoverage, turnAngle } from "@/lib/pose-coverage";

const grid = (primary: number[], secondary: number[], tools: number[]) => {
  const p: number[] = [];
  const s: number[] = [];
  const t: number[] = [];
  for (const tool of tools)
    for (const a of primary)
      for (const b of secondary) {
        p.push(a);
        s.push(b);
        t.push(tool);
      }
  return [p, s, t] as const;
};

describe("pose coverage", () => {
  it("reads primary angles modulo 360° (−30° is 330°, 360° is 0°)", () => {
    expect(turnAngle(-30)).toBe(330);
    expect(turnAngle(360)).toBe(0);
    expect(turnAngle(725)).toBe(5);
    expect(turnAngle(359.9996)).toBe(0);
  });

  it("counts the twelve 30° sectors, the largest gap and the tilt span of a full grid", () => {
    const c = poseCoverage(
      ...grid([0, 30, 60, 90, 120, 150, 180, 210, 240, 270, 300, 330], [-60, -30, 0, 30, 60], [100, 180]),
    );
    expect(c.poses).toBe(120);
    expect(c.primarySectors.every(Boolean)).toBe(true);
    expect(c.largestPrimaryGapDeg).toBe(30);
    expect([c.secondaryMinDeg, c.secondaryMaxDeg]).toEqual([-60, 60]);
    expect(c.toolLengthsMm).toEqual([100, 180]);
    // Every sector, a 30° gap and 120° of tilt: nothing to add.
    expect(coverageAdvice(c)).toEqual([]);
    // A tilt span under half of ±90° (here 60°) earns advice.
    const narrow = coverageAdvice(
      poseCoverage(...grid([0, 30, 60, 90, 120, 150, 180, 210, 240, 270, 300, 330], [-30, 0, 30], [100])),
    );
    expect(narrow).toHaveLength(1);
    expect(narrow[0]).toMatch(/−30° … 30° \(60° of travel\)/);
  });

  it("names the unprobed sectors and the gap of a half turn", () => {
    // 0…150° in 30° steps: sectors 0–5 probed, 6–11 not; the gap from 150° round to 360° is 210°.
    const c = poseCoverage(...grid([0, 30, 60, 90, 120, 150], [-90, 0, 90], [120]));
    expect(c.primarySectors.filter(Boolean)).toHaveLength(6);
    expect(c.largestPrimaryGapDeg).toBe(210);
    const advice = coverageAdvice(c).join(" ");
    expect(advice).toMatch(/6 of the 12 30° sectors/);
    expect(advice).toMatch(/180–210°/);
    expect(advice).toMatch(/largest gap is 210°/);
  });

  it("asks for more angles when the primary or the tilt axis was probed at too few", () => {
    const c = poseCoverage(...grid([0, 180], [0, 45], [120]));
    const advice = coverageAdvice(c).join(" ");
    expect(advice).toMatch(/only 2 angles/);
    expect(advice).toMatch(/tilt axis was probed at only 2 angles/);
    expect(c.largestPrimaryGapDeg).toBe(180);
  });

  it("refuses empty or ragged columns", () => {
    expect(() => poseCoverage([], [], [])).toThrow(RangeError);
    expect(() => poseCoverage([1, 2], [1], [1, 2])).toThrow(RangeError);
  });

  it("joins the planner's advice for the same poses: one tool length is flagged by geometry", () => {
    const [p, s, t] = grid([0, 45, 90, 135, 180, 225, 270, 315], [-60, -20, 20, 60], [150]);
    const v = nextVisitPlan({ primary: "C", secondary: "A", pivotLengthMm: 152.4 }, p, s, t);
    expect(v.plan).not.toBeNull();
    expect(v.advice.some((a) => /^Only one tool length/.test(a))).toBe(true);
    expect(v.plan!.parameters.some((q) => q.u_per_um_noise !== null)).toBe(true);
  });
});
