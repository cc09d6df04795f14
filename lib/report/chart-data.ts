/**
 * The numbers behind the report's charts, shared by the PDF (lib/report/charts.tsx) and the page
 * (components/report/report-charts.tsx) so both draw the same thing. Pure.
 */
import { horizontal, vertical } from "@/lib/chart-lines";
import { signed } from "@/lib/numbers";
import type { Decision, ReportCharts } from "./types";

const DECISION_WORD: Record<Decision, string> = {
  pass: "pass",
  fail: "fail",
  undecided: "undecided",
  not_measured: "not measured",
  recorded: "recorded",
};

export interface LimitRowMark {
  value: number;
  /** Expanded uncertainty drawn as a whisker, same unit. */
  U?: number;
  kind: "before" | "after" | "value";
}

export interface LimitRow {
  label: string;
  lower: number | null;
  upper: number | null;
  marks: LimitRowMark[];
  unit: string;
  note: string;
}

/**
 * The domain a row is drawn over: the limits and every value ± U, widened by a third of the band
 * so that a value on a limit is not on the edge. A one-sided limit takes 0 as its other edge.
 * Pure; exported for tests.
 */
export function rowDomain(row: Pick<LimitRow, "lower" | "upper" | "marks">): { from: number; to: number } {
  const ends = row.marks.flatMap((m) => [m.value - (m.U ?? 0), m.value + (m.U ?? 0)]);
  const lo = row.lower ?? Math.min(0, ...ends);
  const hi = row.upper ?? Math.max(0, ...ends);
  const span = hi - lo || Math.max(1e-9, ...ends.map(Math.abs)) || 1;
  return { from: Math.min(lo - span / 3, ...ends), to: Math.max(hi + span / 3, ...ends) };
}

/** The limits a row has (none, one or both), each drawn as a line across the row. */
export function rowLimits(row: Pick<LimitRow, "lower" | "upper">): number[] {
  return [row.lower, row.upper].filter((v): v is number => v != null);
}

/** A limit row's drawing: its size, and how far the band, the limit lines and the zero line stay off its edges. */
export interface LimitRowBox {
  width: number;
  height: number;
  insets: { band: number; limit: number; zero: number };
}

/** A limit row on the report page (SVG px) and in the PDF (pt). */
export const LIMIT_ROW_BOX = {
  page: { width: 360, height: 18, insets: { band: 2, limit: 0, zero: 3 } },
  pdf: { width: 225, height: 13, insets: { band: 1.5, limit: 0.5, zero: 2 } },
} satisfies Record<string, LimitRowBox>;

/**
 * Where a limit row's pieces sit in a box (4 units of margin each side), the same for the page and
 * the PDF: the shaded band between the limits, a line at each limit, the zero line when zero is
 * inside, the travel from before to after, each value's ± U bar and its mark, on the row's middle.
 */
export function limitRowLayout(row: Pick<LimitRow, "lower" | "upper" | "marks">, box: LimitRowBox) {
  const { width, height, insets } = box;
  const { from, to } = rowDomain(row);
  const x = (v: number) => 4 + ((v - from) / (to - from)) * (width - 8);
  const mid = height / 2;
  const bandFrom = x(row.lower ?? from);
  const before = row.marks.find((m) => m.kind === "before");
  const after = row.marks.find((m) => m.kind === "after");
  const across = (inset: number, at: number) => vertical(at, inset, height - inset);
  return {
    mid,
    band: {
      x: bandFrom,
      y: insets.band,
      width: Math.max(0.5, x(row.upper ?? to) - bandFrom),
      height: height - 2 * insets.band,
    },
    limits: rowLimits(row).map((v) => across(insets.limit, x(v))),
    zero: from < 0 && to > 0 ? across(insets.zero, x(0)) : null,
    travel: before && after ? horizontal(x(before.value), x(after.value), mid) : null,
    uBars: row.marks.flatMap((m) => (m.U ? [horizontal(x(m.value - m.U), x(m.value + m.U), mid)] : [])),
    marks: row.marks.map((m) => ({ kind: m.kind, x: x(m.value) })),
  };
}

const fmt = (v: number, d = 1) => signed(v, d);
/** A value with its unit: arc seconds sit on the number (+5.2″), other units after a space. */
const withUnit = (text: string, unit: string) => (unit === "″" ? `${text}″` : `${text} ${unit}`);
const limitsText = (lo: number | null, hi: number | null, unit: string, d = 1) =>
  withUnit(
    lo != null && hi != null
      ? `${fmt(lo, d)} … ${fmt(hi, d)}`
      : hi != null
        ? `≤ ${fmt(hi, d)}`
        : `≥ ${fmt(lo ?? 0, d)}`,
    unit,
  );

/** The before/after readings as limit rows. */
export function readingRows(readings: NonNullable<ReportCharts["readings"]>): LimitRow[] {
  return readings.map((r) => ({
    label: r.step,
    lower: r.lower,
    upper: r.upper,
    unit: r.unit,
    marks: [
      ...(r.pre != null ? [{ value: r.pre, kind: "before" as const }] : []),
      ...(r.post != null ? [{ value: r.post, kind: "after" as const }] : []),
    ],
    note: `${r.pre != null ? `before ${withUnit(fmt(r.pre, r.digits ?? 1), r.unit)}` : "no before"} → ${r.post != null ? `after ${withUnit(fmt(r.post, r.digits ?? 1), r.unit)}` : "no after"}; limits ${limitsText(r.lower, r.upper, r.unit, r.digits ?? 1)}`,
  }));
}

/** The judged head parameters as limit rows, with U as the whisker. */
export function parameterChartRows(params: NonNullable<ReportCharts["parameters"]>): LimitRow[] {
  return params.map((p) => ({
    label: p.symbol,
    lower: p.lower,
    upper: p.upper,
    unit: p.unit,
    marks: [{ value: p.value, U: p.U, kind: "value" as const }],
    note: `${fmt(p.value)} ± ${withUnit(p.U.toFixed(1), p.unit)}; limits ${limitsText(p.lower, p.upper, p.unit)}; ${DECISION_WORD[p.decision]}`,
  }));
}

/** One chart of the report's section 7, in the order printed: what it draws and the words around it. */
export type ReportChart =
  | { kind: "limits"; title: string; rows: LimitRow[]; legend: string; caption: string }
  | { kind: "residuals"; residuals: NonNullable<ReportCharts["residuals"]>; caption: string };

/**
 * The charts the report's numbers give, with their legends and captions: the PDF and the report
 * page draw the same list, so the two never say different things.
 */
export function reportCharts(charts: ReportCharts | undefined): ReportChart[] {
  const out: ReportChart[] = [];
  if (charts?.readings?.length)
    out.push({
      kind: "limits",
      title: "Readings before and after adjustment",
      rows: readingRows(charts.readings),
      legend:
        "Hollow ring: before adjustment; filled dot: after; green lines: the limits, shaded between. Each row has its own scale; lengths in mm, angles in arc seconds, as in the readings table.",
      caption: "Checklist readings before and after adjustment against their limits.",
    });
  if (charts?.parameters?.length)
    out.push({
      kind: "limits",
      title: "Head parameters against limits",
      rows: parameterChartRows(charts.parameters),
      legend:
        "Dot: the fitted value; bar: ± U (k = 2); green lines: the procedure's limits, shaded between. Each row has its own scale.",
      caption: "Fitted head parameters against the procedure's limits.",
    });
  if (charts?.residuals)
    out.push({
      kind: "residuals",
      residuals: charts.residuals,
      caption: "Residuals of the approved head fit per pose.",
    });
  return out;
}
