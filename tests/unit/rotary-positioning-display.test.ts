// A rotary axis's ISO 230-2 positioning test judged against the procedure's limits with the job's
// decision rule (simple and guarded acceptance, ISO 14253-1: a value on the limit conforms; guarded
// shrinks the limit by U for a pass, and without U cannot decide), the chart's layout, the
// readiness blocker, and the statement of conformity counting the TCP check and the positioning
// tests (ISO/IEC 17025:2017 §7.8.6.1). Figures are worked by hand beside each case.
import { describe, expect, it } from "vitest";
import { readRotaryPositioningCsv, rotaryPositioning, rotaryPositioningToJson } from "@/geometry";
import { demoRotaryPositioningCsv } from "@/db/seed-positioning";
import { positioningChartLayout } from "@/lib/positioning-chart";
import { readingSection, reportConformity } from "@/lib/report/build";
import { readiness } from "@/lib/report/readiness";
import { positioningSection } from "@/lib/report/sections/positioning";
import {
  arcsecText,
  judgeRotaryPositioning,
  type PositioningLimit,
  type RotaryPositioningSummary,
} from "@/lib/rotary-positioning-display";
import { signedEmptyJob } from "./readiness-inputs";

const summary: RotaryPositioningSummary = {
  unit: "arcsec",
  axis: "C",
  targets: [
    { target_deg: 0, mean_pos: 1.5, mean_neg: 0.5, s_pos: 0.25, s_neg: 0.5, reversal: 1 },
    { target_deg: 90, mean_pos: -2, mean_neg: -3, s_pos: 0.5, s_neg: 0.25, reversal: 1 },
  ],
  A: 9.2,
  A_pos: 7.9,
  A_neg: 7.85,
  E: 8.1,
  E_pos: 6.7,
  E_neg: 7,
  M: 6.8,
  R: 2.4,
  R_pos: 1.3,
  R_neg: 1.1,
  B: 1.4,
  B_mean: 1.2,
  warnings: [],
};

const limit = (
  quantity: PositioningLimit["quantity"],
  upper: number,
  axis: PositioningLimit["axis"] = "primary",
) => ({
  axis,
  quantity,
  upperLimitArcsec: upper,
  limitSource: "customer_spec",
  limitSourceNote: "spec 12",
});

/**
 * Judges a test (`summary` above unless `of` is given) against these limits: the primary axis by
 * the simple rule without U, unless the options say otherwise.
 */
const judge = (
  limits: PositioningLimit[],
  {
    of = summary,
    ...o
  }: Partial<Parameters<typeof judgeRotaryPositioning>[1]> & { of?: RotaryPositioningSummary } = {},
) => judgeRotaryPositioning(of, { axis: "primary", rule: "simple", U: null, limits, ...o });

describe("judging a rotary positioning test", () => {
  it("shows every quantity both ways and per direction, and passes A 9.2″ ≤ 20″ and R 2.4″ ≤ 6″ (simple)", () => {
    const v = judge([limit("A", 20), limit("R", 6)], { letter: "C" });
    expect(v.axisText).toBe("primary (rotary) axis C");
    expect(v.rows.map((r) => [r.symbol, r.both, r.pos, r.neg, r.limitText, r.decision])).toEqual([
      ["A", "9.20″", "7.90″", "7.85″", "≤ 20.00″", "pass"],
      ["E", "8.10″", "6.70″", "7.00″", "—", "recorded"],
      ["M", "6.80″", null, null, "—", "recorded"],
      ["R", "2.40″", "1.30″", "1.10″", "≤ 6.00″", "pass"],
      ["B", "1.40″", null, null, "—", "recorded"],
      ["B̄", "1.20″", null, null, "—", "recorded"],
    ]);
    expect(v.rows[0]!.source).toBe("Customer specification: spec 12");
    expect(v.decision).toBe("pass");
  });

  it("fails the test when one quantity is over its limit (R 2.4″ > 2″); a value on the limit passes", () => {
    const fail = judge([limit("A", 20), limit("R", 2)]);
    expect(fail.rows.find((r) => r.key === "R")!.decision).toBe("fail");
    expect(fail.decision).toBe("fail");
    const on = judge([limit("A", 9.2)]);
    expect(on.decision).toBe("pass");
  });

  it("guarded: undecided — U missing without U; with U 1″, A 9.2″ against 10″ lies in the band 9″…11″", () => {
    const noU = judge([limit("A", 20)], { rule: "guarded" });
    expect(noU.rows[0]).toMatchObject({ decision: "undecided", reason: "U missing" });
    expect(noU.decision).toBe("undecided");
    const band = judge([limit("A", 10)], { rule: "guarded", U: 1 });
    expect(band.rows[0]!.decision).toBe("undecided");
    const clear = judge([limit("A", 10.2)], { rule: "guarded", U: 1 });
    expect(clear.rows[0]!.decision).toBe("pass"); // 9.2 ≤ 10.2 − 1
  });

  it("takes only the limits of its own axis; none: recorded, not judged", () => {
    const v = judge([limit("A", 1)], { axis: "secondary" });
    expect(v.axisText).toBe("secondary (tilt) axis C");
    expect(v.decision).toBe("recorded");
  });

  it("charts mean ± 2s per target and direction (1.5″ ± 2·0.25″ → 1.0″…2.0″)", () => {
    const v = judge([]);
    expect(v.chart.pos[0]).toEqual({ targetDeg: 0, mean: 1.5, lo: 1, hi: 2 });
    expect(v.chart.neg[1]).toEqual({ targetDeg: 90, mean: -3, lo: -3.5, hi: -2.5 });
  });

  it("writes arc seconds, and degrees beyond one degree (3960″ = 1.1°)", () => {
    expect(arcsecText(0.5)).toBe("0.50″");
    expect(arcsecText(-3960)).toBe("-3960.00″ (-1.1000°)");
  });

  it("the demo file passes its demo limits (A ≤ 20″, R ≤ 6″) with 12 targets and no warning", () => {
    const s = rotaryPositioningToJson(
      rotaryPositioning(readRotaryPositioningCsv(demoRotaryPositioningCsv())),
    );
    const v = judge([limit("A", 20), limit("R", 6)], { of: s, U: 0.5 });
    expect(v.targets).toBe(12);
    expect(v.decision).toBe("pass");
    // Its once-round error of 3″ and twice-round of 1.5″ make E at least 2·3″ less the overlap (invented data).
    expect(s.E).toBeGreaterThan(6);
  });
});

describe("the positioning chart's layout", () => {
  const l = positioningChartLayout({
    pos: [
      { targetDeg: 0, mean: 1.5, lo: 1, hi: 2 },
      { targetDeg: 90, mean: -2, lo: -3, hi: -1 },
    ],
    neg: [
      { targetDeg: 0, mean: 0.5, lo: -0.5, hi: 1.5 },
      { targetDeg: 90, mean: -3, lo: -3.5, hi: -2.5 },
    ],
  });

  it("puts targets left to right, the positive approach left of the negative, larger values higher", () => {
    expect(l.pos[0]!.x).toBeLessThan(l.pos[1]!.x);
    expect(l.neg[0]!.x - l.pos[0]!.x).toBe(10);
    expect(l.pos[0]!.y).toBeLessThan(l.zeroLine.y1);
    expect(l.pos[1]!.y).toBeGreaterThan(l.zeroLine.y1);
    expect(l.pos[0]!.yHi).toBeLessThan(l.pos[0]!.yLo);
  });

  it("keeps every bar inside the plot, with ticks covering −3.5″…2″", () => {
    for (const m of [...l.pos, ...l.neg]) {
      expect(m.yHi).toBeGreaterThanOrEqual(l.plot.y0);
      expect(m.yLo).toBeLessThanOrEqual(l.plot.y1);
      expect(m.x).toBeGreaterThan(l.plot.x0);
      expect(m.x).toBeLessThan(l.plot.x1);
    }
    expect(l.xTicks.map((t) => t.label)).toEqual(["0°", "90°"]);
    expect(l.yTicks[0]!.label).toBe("-4″");
    expect(l.yTicks[l.yTicks.length - 1]!.label).toBe("2″");
  });

  it("draws each ± 2s bar from lo to hi with a 6 px cap at each end, and lines across the plot", () => {
    const m = l.neg[1]!;
    expect(m.bar).toEqual({ x1: m.x, x2: m.x, y1: m.yLo, y2: m.yHi });
    expect(m.caps).toEqual([
      { x1: m.x - 3, x2: m.x + 3, y1: m.yLo, y2: m.yLo },
      { x1: m.x - 3, x2: m.x + 3, y1: m.yHi, y2: m.yHi },
    ]);
    const across = { x1: l.plot.x0, x2: l.plot.x1 };
    expect(l.zeroLine).toMatchObject(across);
    expect(l.zeroLine.y1).toBe(l.zeroLine.y2);
    for (const t of l.yTicks) expect(t.grid).toEqual({ ...across, y1: t.y, y2: t.y });
    expect(l.frame).toEqual({
      x: l.plot.x0,
      y: l.plot.y0,
      width: l.plot.x1 - l.plot.x0,
      height: l.plot.y1 - l.plot.y0,
    });
  });
});

describe("readiness and the statement of conformity", () => {
  const base = signedEmptyJob;

  it("blocks issue while an axis the procedure limits has no positioning test", () => {
    const r = readiness({ ...base, rotaryPositioning: { required: ["primary"], present: [] } });
    expect(r.blockers).toEqual([
      expect.objectContaining({ code: "rotary_positioning_missing", href: "/jobs/j/data" }),
    ]);
    expect(r.blockers[0]!.message).toContain("primary (rotary) axis");
    expect(
      readiness({ ...base, rotaryPositioning: { required: ["primary"], present: ["primary"] } }).ready,
    ).toBe(true);
    expect(readiness({ ...base, rotaryPositioning: { required: [], present: [] } }).ready).toBe(true);
  });

  const judged = (d: "pass" | "fail") =>
    positioningSection(
      [
        {
          filename: "c.csv",
          phase: "post",
          uploadedAt: new Date("2026-12-01T10:00:00Z"),
          U: null,
          view: judge([limit("A", d === "pass" ? 20 : 5)]),
        },
      ],
      "simple",
    );
  const none = { readings: readingSection([]), parameters: null, testPart: [] };
  const tcp = (decision: "pass" | "fail") => ({ tcpCheck: { decision } }) as never;

  it("a FAIL TCP check or positioning test not carried: does not conform", () => {
    const c = reportConformity({ ...none, carried: 0, controlValues: tcp("fail") }, "simple");
    expect(c.verdict).toBe("does_not_conform");
    expect(c.text).toContain("1 of 1 judged results");
    const p = reportConformity({ ...none, carried: 0, rotaryPositioning: judged("fail") }, "simple");
    expect(p.verdict).toBe("does_not_conform");
  });

  it("carried as deviations: conforms with deviations; both passing: conforms, counting both", () => {
    const c = reportConformity(
      { ...none, carried: 2, controlValues: tcp("fail"), rotaryPositioning: judged("fail") },
      "simple",
    );
    expect(c.verdict).toBe("conforms_with_deviations");
    expect(c.text).toContain("2 of 2 judged results");
    const ok = reportConformity(
      { ...none, carried: 0, controlValues: tcp("pass"), rotaryPositioning: judged("pass") },
      "simple",
    );
    expect(ok.verdict).toBe("conforms");
    expect(ok.text).toContain("all 2 judged results");
  });

  it("the report section states the rule and says when U is not stated", () => {
    const [s] = judged("pass");
    expect(s!.basis).toContain("Decision rule: simple acceptance; U of the angle measurement not stated");
    expect(s!.rows.map((r) => r.pos)).toEqual(["7.90″", "6.70″", "—", "1.30″", "—", "—"]);
  });
});
