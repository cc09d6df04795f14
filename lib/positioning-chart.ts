/**
 * The layout of the ISO 230-2 positioning chart, shared by the page (components/charts) and the
 * PDF (lib/report/sections/positioning-pdf.tsx): targets along x (degrees), the mean positional
 * deviation along y (arc seconds) with a bar of ± 2s, for each direction side by side (the
 * positive approach a little left of the target, the negative a little right, so the bars never
 * hide each other). Pure: numbers in, coordinates out.
 */
import { niceTicks } from "@/lib/chart-ticks";
import type { PositioningChartPoint } from "@/lib/rotary-positioning-display";

export const POSITIONING_CHART = { width: 560, height: 230, left: 52, right: 14, top: 14, bottom: 36 };
/** How far each direction's marker sits from its target, px. */
const SPLIT = 5;

export interface ChartMark {
  targetDeg: number;
  x: number;
  y: number;
  yLo: number;
  yHi: number;
  mean: number;
  lo: number;
  hi: number;
}

export interface PositioningChartLayout {
  width: number;
  height: number;
  plot: { x0: number; x1: number; y0: number; y1: number };
  /** The plot's frame as a rectangle, for either renderer's rect. */
  frame: { x: number; y: number; width: number; height: number };
  xTicks: Array<{ x: number; label: string }>;
  /** `label` with the unit (the page), `value` without it (the PDF's chart font has no ″). */
  yTicks: Array<{ y: number; label: string; value: string }>;
  /** y of the zero line. */
  zeroY: number;
  pos: ChartMark[];
  neg: ChartMark[];
}

/** A tick value at the step's decimals (a float's −5.6e−17 is 0). */
function tickText(v: number, step: number): string {
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  const t = v.toFixed(Math.min(decimals, 6));
  return Number(t) === 0 ? "0" : t;
}

export function positioningChartLayout(chart: {
  pos: readonly PositioningChartPoint[];
  neg: readonly PositioningChartPoint[];
}): PositioningChartLayout {
  const { width, height, left, right, top, bottom } = POSITIONING_CHART;
  const plot = { x0: left, x1: width - right, y0: top, y1: height - bottom };
  const all = [...chart.pos, ...chart.neg];
  const targets = [...new Set(all.map((p) => p.targetDeg))].sort((a, b) => a - b);
  const tMin = targets[0] ?? 0;
  const tMax = targets[targets.length - 1] ?? 1;
  const tSpan = tMax > tMin ? tMax - tMin : 1;
  const inner = 18; // keep the outer targets' bars off the frame
  const x = (t: number) =>
    targets.length <= 1
      ? (plot.x0 + plot.x1) / 2
      : plot.x0 + inner + ((t - tMin) / tSpan) * (plot.x1 - plot.x0 - 2 * inner);
  const yTicks = niceTicks(Math.min(0, ...all.map((p) => p.lo)), Math.max(0, ...all.map((p) => p.hi)), 5);
  const y = (v: number) => plot.y1 - ((v - yTicks.min) / (yTicks.max - yTicks.min)) * (plot.y1 - plot.y0);
  const marks = (ps: readonly PositioningChartPoint[], dx: number): ChartMark[] =>
    ps.map((p) => ({
      targetDeg: p.targetDeg,
      x: x(p.targetDeg) + dx,
      y: y(p.mean),
      yLo: y(p.lo),
      yHi: y(p.hi),
      mean: p.mean,
      lo: p.lo,
      hi: p.hi,
    }));
  // Label at most about 12 targets so the labels do not run into each other.
  const every = Math.max(1, Math.ceil(targets.length / 12));
  return {
    width,
    height,
    plot,
    frame: { x: plot.x0, y: plot.y0, width: plot.x1 - plot.x0, height: plot.y1 - plot.y0 },
    xTicks: targets
      .filter((_, i) => i % every === 0)
      .map((t) => ({ x: x(t), label: `${Number(t.toFixed(3))}°` })),
    yTicks: yTicks.ticks.map((v) => ({
      y: y(v),
      label: `${tickText(v, yTicks.step)}″`,
      value: tickText(v, yTicks.step),
    })),
    zeroY: y(0),
    pos: marks(chart.pos, -SPLIT),
    neg: marks(chart.neg, SPLIT),
  };
}
