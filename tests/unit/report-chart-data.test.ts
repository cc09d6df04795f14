// The charts of the report's section 7 as the PDF and the report page both draw them: which
// charts there are, in which order, and which limit lines each row has. The limit wording is the
// project's own; the interval arithmetic is checked by hand below.
import { describe, expect, it } from "vitest";
import { residualsLayout } from "@/lib/report/residuals-layout";
import { LIMIT_ROW_BOX, limitRowLayout, reportCharts, rowDomain, rowLimits } from "@/lib/report/chart-data";

const readings = [{ step: "1 Collar face", lower: -0.01, upper: 0.01, pre: 0.02, post: 0.004, unit: "mm" }];
const parameters = [
  { symbol: "EB0C", value: 12, U: 3, lower: null, upper: 20, unit: "″", decision: "pass" as const },
];
const residuals = { valuesUm: [1, 2, 9], totalPoses: 3, sUm: 2, perPoint: 1 };

describe("reportCharts", () => {
  it("lists nothing when the report has no numbers to chart", () => {
    expect(reportCharts(undefined)).toEqual([]);
    expect(reportCharts({ readings: [], parameters: [] })).toEqual([]);
  });
  it("lists readings, then parameters, then residuals, each with its own caption", () => {
    const list = reportCharts({ readings, parameters, residuals });
    expect(list.map((c) => c.kind)).toEqual(["limits", "limits", "residuals"]);
    expect(list.map((c) => c.caption)).toEqual([
      "Checklist readings before and after adjustment against their limits.",
      "Fitted head parameters against the procedure's limits.",
      "Residuals of the approved head fit per pose.",
    ]);
    const [r, p] = list;
    expect(r?.kind === "limits" && r.rows[0]?.marks.map((m) => m.kind)).toEqual(["before", "after"]);
    expect(p?.kind === "limits" && p.rows[0]?.marks[0]).toEqual({ value: 12, U: 3, kind: "value" });
  });
  it("leaves out a chart whose numbers are missing, keeping the order of the rest", () => {
    expect(reportCharts({ parameters, residuals }).map((c) => c.caption)).toEqual([
      "Fitted head parameters against the procedure's limits.",
      "Residuals of the approved head fit per pose.",
    ]);
  });
});

describe("rowLimits", () => {
  it("gives the limits a row has: both, only the upper, or none", () => {
    expect(rowLimits({ lower: -0.01, upper: 0.01 })).toEqual([-0.01, 0.01]);
    expect(rowLimits({ lower: null, upper: 20 })).toEqual([20]);
    expect(rowLimits({ lower: null, upper: null })).toEqual([]);
    // A limit of zero is a limit (checked by hand: 0 is not "missing").
    expect(rowLimits({ lower: 0, upper: null })).toEqual([0]);
  });
  it("every limit lies inside the row's drawn domain", () => {
    for (const row of reportCharts({ readings, parameters }).flatMap((c) =>
      c.kind === "limits" ? c.rows : [],
    )) {
      const { from, to } = rowDomain(row);
      for (const v of rowLimits(row)) expect(v > from && v < to).toBe(true);
    }
  });
});

describe("the residual chart's layout (page and PDF alike)", () => {
  // s = 1 µm, so the 3 s line sits at 3 µm; the y axis runs from 0 to a nice value above 3.75 µm.
  const series = { valuesUm: [0.5, 3.2, 1, 0], totalPoses: 8, sUm: 1, perPoint: 2 };
  const box = {
    width: 100,
    height: 60,
    margin: { l: 10, r: 10, t: 5, b: 5 },
    minBar: { width: 1, height: 0.5 },
  };
  const c = residualsLayout(series, box);

  it("draws one bar per value, flags and counts those above 3 s", () => {
    expect(c.limit).toBe(3);
    expect(c.bars.map((b) => b.over)).toEqual([false, true, false, false]);
    expect(c.over).toBe(1);
    expect(c.bars.map((b) => b.x)).toEqual([10, 30, 50, 70]);
    expect(c.bars[0]!.width).toBeCloseTo(14, 12); // 80 px over 4 bars, 70 % filled
  });

  it("puts zero at the bottom of the plot and gives an empty bar its least height", () => {
    expect(c.zeroY).toBe(55);
    expect(c.ticks[0]).toBe(0);
    expect(c.y(c.ticks.at(-1)!)).toBe(5);
    expect(c.limitY).toBeLessThan(c.zeroY);
    expect(c.bars[3]!.height).toBe(0.5);
  });

  it("runs the 3 s line, the zero line and each grid line across the plot, 10 to 90", () => {
    expect(c.zeroLine).toEqual({ x1: 10, x2: 90, y1: 55, y2: 55 });
    expect(c.limitLine).toEqual({ x1: 10, x2: 90, y1: c.y(3), y2: c.y(3) });
    expect(c.grid.map((g) => g.value)).toEqual(c.ticks);
    expect(c.grid.at(-1)!.line).toEqual({ x1: 10, x2: 90, y1: 5, y2: 5 });
  });

  it("says what the bars are, in one caption for both", () => {
    expect(c.caption).toBe(
      "Largest residual component per pose in µm, 8 poses in file order (each bar the largest of 2 consecutive poses); " +
        "dashed line: 3 s, beyond which a pose is reported as an outlier (1 bar beyond it, drawn in red). s = 1.00 µm per coordinate.",
    );
  });
});

describe("a limit row's layout (page and PDF alike)", () => {
  // Limits ±10″, before 14.2″, after 3.1″: the domain is the limits widened by a third of their
  // span each side, −16.67 … +16.67″, over 352 of the 360 units (4 each side), in a row 18 high.
  // Worked by hand.
  const l = limitRowLayout(
    {
      lower: -10,
      upper: 10,
      marks: [
        { kind: "before", value: 14.2 },
        { kind: "after", value: 3.1, U: 0.5 },
      ],
    },
    LIMIT_ROW_BOX.page,
  );
  it("places the band, the limits and the zero line", () => {
    expect(l.band.x).toBeCloseTo(74.4, 9);
    expect(l.band.width).toBeCloseTo(211.2, 9);
    expect([l.band.y, l.band.height]).toEqual([2, 14]); // 2 off the top and bottom of 18
    expect(l.limits[0]!.x1).toBeCloseTo(74.4, 9);
    expect(l.limits[1]!.x2).toBeCloseTo(285.6, 9);
    expect([l.limits[0]!.y1, l.limits[0]!.y2]).toEqual([0, 18]);
    expect(l.zero!.x1).toBeCloseTo(180, 9);
    expect([l.zero!.y1, l.zero!.y2]).toEqual([3, 15]);
  });
  it("draws the travel from before to after, the U bar and each mark", () => {
    expect(l.travel!.x1).toBeCloseTo(329.952, 9);
    expect(l.travel!.x2).toBeCloseTo(212.736, 9);
    expect([l.mid, l.travel!.y1, l.travel!.y2, l.uBars[0]!.y1]).toEqual([9, 9, 9, 9]);
    expect(l.uBars).toHaveLength(1);
    expect(l.uBars[0]!.x2 - l.uBars[0]!.x1).toBeCloseTo(10.56, 9); // 1″ of 33.33″ over 352
    expect(l.marks.map((m) => m.kind)).toEqual(["before", "after"]);
  });
  it("leaves out the zero line when zero is outside, and the travel without a before", () => {
    const one = limitRowLayout(
      { lower: 5, upper: 9, marks: [{ kind: "value", value: 7 }] },
      LIMIT_ROW_BOX.pdf,
    );
    expect(one.zero).toBeNull();
    expect(one.travel).toBeNull();
    expect(one.uBars).toEqual([]);
  });
});
