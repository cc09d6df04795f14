// Test-part evaluation: deviation and limits by definition; decisions per ISO 14253-1.
import { describe, expect, it } from "vitest";
import { evaluateTestPart, readTestPartCsv } from "@/geometry";
import { fixture } from "./csv-helpers";

describe("evaluateTestPart", () => {
  const rows = readTestPartCsv(fixture("test-part-good.csv"));

  it("simple rule: deviations, absolute limits, decisions, totals", () => {
    const r = evaluateTestPart(rows, { rule: "simple", defaultUMm: 0.002, defaultUByUnit: { arcsec: 3 } });
    expect(r.rows.map((x) => x.decision)).toEqual(["pass", "pass", "pass"]);
    expect(r.rows[0]).toMatchObject({
      feature: "bore A",
      unit: "mm",
      lower_limit: 25,
      upper_limit: 25.021,
      U: 0.002,
    });
    expect(r.rows[0]!.deviation).toBeCloseTo(0.004, 12);
    expect(r.rows[1]!.lower_limit).toBeNull();
    expect(r.rows[2]!.U).toBe(3);
    expect(r.totals).toEqual({ pass: 3, fail: 0, undecided: 0, total: 3 });
    expect(r.warnings).toEqual([]);
  });

  it("guarded rule (ISO 14253-1): the flatness row in its guard band is undecided; per-row U wins", () => {
    const r = evaluateTestPart(rows, {
      rule: "guarded",
      defaultUMm: 0.003,
      uPerRow: [undefined, undefined, 10],
    });
    // bore: 25.004 vs [25.003, 25.018] → pass; flatness 0.008 vs ≤ 0.007 → undecided; squareness 12″ vs ≤ 10″ → undecided.
    expect(r.rows.map((x) => x.decision)).toEqual(["pass", "undecided", "undecided"]);
    expect(r.totals).toEqual({ pass: 1, fail: 0, undecided: 2, total: 3 });
  });

  it("a mm default converts to inch rows exactly (1 in = 25.4 mm) and rows without U are warned", () => {
    const inch = readTestPartCsv(
      "feature,characteristic,nominal,measured,lower_tol,upper_tol,unit\nA,len,1,1.00095,-0.001,0.001,in\nB,angle,0,5,-10,10,deg\n",
    );
    const r = evaluateTestPart(inch, { rule: "guarded", defaultUMm: 0.00254 });
    expect(r.rows[0]!.U).toBeCloseTo(0.0001, 15);
    expect(r.rows[0]!.decision).toBe("undecided");
    expect(r.rows[1]!.U).toBe(0);
    // Guarded without U (ISO 14253-1 needs U to prove conformance): undecided — U missing, not a pass.
    expect(r.rows[1]!.decision).toBe("undecided");
    expect(r.rows[1]!.reason).toBe("U missing");
    expect(r.rows[0]!.reason).toBeUndefined();
    expect(r.warnings).toEqual([
      "no expanded uncertainty given for rows in deg; the guarded rule cannot decide them: undecided — U missing",
    ]);
    // The simple rule does not use U: the same row passes, U shown as 0 with a warning.
    const s = evaluateTestPart(inch, { rule: "simple", defaultUMm: 0.00254 });
    expect(s.rows[1]!.decision).toBe("pass");
    expect(s.rows[1]!.reason).toBeUndefined();
    expect(s.warnings).toEqual(["no expanded uncertainty given for rows in deg; U taken as 0"]);
  });
});
