/**
 * The report's section 5.4: the ISO 230-2 positioning test of each rotary axis that has one (the
 * test that counts per axis: the newest after adjustment, else the newest), with the standard's
 * quantities bidirectional and per direction, each limited quantity's limit, its source and its
 * result, and the chart's numbers (mean positional deviation ± 2s per target and direction).
 */
import type { DecisionRule } from "@/lib/domain/decisions";
import { formatDateTimeUtc } from "@/lib/format";
import { PHASE_LABELS } from "@/lib/domain/datasets";
import type { Decision } from "@/lib/report/types";
import {
  arcsecText,
  type PositioningChartPoint,
  type RotaryPositioningView,
} from "@/lib/rotary-positioning-display";

export interface ReportPositioningTest {
  axis: string;
  file: string;
  basis: string;
  decision: Decision;
  rows: Array<{
    symbol: string;
    quantity: string;
    both: string;
    pos: string;
    neg: string;
    limit: string;
    source: string;
    decision: Decision;
    reason?: string;
  }>;
  chart: { pos: PositioningChartPoint[]; neg: PositioningChartPoint[] };
  warnings: string[];
}

export function positioningSection(
  tests: ReadonlyArray<{
    filename: string;
    phase: "pre" | "post";
    uploadedAt: Date;
    U: number | null;
    view: RotaryPositioningView;
  }>,
  rule: DecisionRule,
): ReportPositioningTest[] {
  return tests.map((t) => ({
    axis: t.view.axisText,
    file: t.filename,
    basis: `${t.view.targets} targets, each approached from both directions; ${PHASE_LABELS[t.phase].toLowerCase()}, uploaded ${formatDateTimeUtc(t.uploadedAt)}. Deviation = measured − target in arc seconds. Decision rule: ${rule === "guarded" ? "guarded acceptance (ISO 14253-1)" : "simple acceptance"}${t.U === null ? "; U of the angle measurement not stated" : `; U (k = 2) of the angle measurement ${arcsecText(t.U)}`}.`,
    decision: t.view.decision,
    rows: t.view.rows.map((r) => ({
      symbol: r.symbol,
      quantity: r.words,
      both: r.both,
      pos: r.pos ?? "—",
      neg: r.neg ?? "—",
      limit: r.limitText,
      source: r.source,
      decision: r.decision,
      ...(r.reason ? { reason: r.reason } : {}),
    })),
    chart: t.view.chart,
    warnings: [...t.view.warnings],
  }));
}
