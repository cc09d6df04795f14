/**
 * The layout of the report's residual chart, shared by the online report
 * (components/report/residuals-figure.tsx) and the PDF (lib/report/charts.tsx): one bar per pose
 * (or per group of poses) of the largest residual component, the y axis from zero with nice ticks,
 * and the 3 s line of the outlier rule; bars above it are counted and drawn in the fail colour.
 * Pure: numbers in, coordinates and the caption out.
 */
import { horizontal } from "@/lib/chart-lines";
import { niceTicks } from "@/lib/chart-ticks";

export interface ResidualsSeries {
  valuesUm: number[];
  totalPoses: number;
  sUm: number;
  perPoint: number;
}

export interface ResidualsBox {
  width: number;
  height: number;
  margin: { l: number; r: number; t: number; b: number };
  /** The thinnest a bar may be drawn, and the least height it is given, in the drawing's units. */
  minBar: { width: number; height: number };
}

/** The chart's box on the report page (SVG px) and in the PDF (pt, the width of the text block). */
export const RESIDUALS_BOX = {
  page: {
    width: 880,
    height: 200,
    margin: { l: 40, r: 10, t: 10, b: 22 },
    minBar: { width: 0.6, height: 0.5 },
  },
  pdf: { width: 515, height: 110, margin: { l: 26, r: 6, t: 6, b: 14 }, minBar: { width: 0.4, height: 0.3 } },
} satisfies Record<string, ResidualsBox>;

export function residualsLayout(r: ResidualsSeries, box: ResidualsBox) {
  const { width: w, height: h, margin: m, minBar } = box;
  const limit = 3 * r.sUm;
  const axis = niceTicks(0, Math.max(limit * 1.25, ...r.valuesUm) || 1);
  const n = Math.max(1, r.valuesUm.length);
  const x = (i: number) => m.l + (i / n) * (w - m.l - m.r);
  const y = (v: number) => h - m.b - (v / axis.max) * (h - m.t - m.b);
  const bw = Math.max(minBar.width, ((w - m.l - m.r) / n) * 0.7);
  const bars = r.valuesUm.map((v, i) => ({
    x: x(i),
    y: y(v),
    width: bw,
    height: Math.max(minBar.height, y(0) - y(v)),
    over: v > limit,
  }));
  const over = bars.filter((b) => b.over).length;
  return {
    limit,
    ticks: axis.ticks,
    /** Where a value in µm sits on the drawing. */
    y,
    bars,
    over,
    /** A grid line across the plot at each tick. */
    grid: axis.ticks.map((t) => ({ value: t, line: horizontal(m.l, w - m.r, y(t)) })),
    /** The 3 s line, end to end, and the zero line. */
    limitY: y(limit),
    zeroY: y(0),
    limitLine: horizontal(m.l, w - m.r, y(limit)),
    zeroLine: horizontal(m.l, w - m.r, y(0)),
    width: w,
    height: h,
    left: m.l,
    right: w - m.r,
    caption:
      `Largest residual component per pose in µm, ${r.totalPoses} poses in file order` +
      (r.perPoint > 1 ? ` (each bar the largest of ${r.perPoint} consecutive poses)` : "") +
      `; dashed line: 3 s, beyond which a pose is reported as an outlier (${over} bar${over === 1 ? "" : "s"} ` +
      `beyond it, drawn in red). s = ${r.sUm.toFixed(2)} µm per coordinate.`,
  };
}
