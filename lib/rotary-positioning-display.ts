/**
 * A rotary axis's ISO 230-2 positioning test as the job and the report show it: the quantities
 * geometry/rotary-positioning.ts computed at upload (arc seconds), bidirectional and per
 * direction, each limited quantity judged against the procedure's limit with the job's decision
 * rule (the expanded uncertainty U of the angle measurement given at upload; guarded without U is
 * undecided — U missing), one decision for the test, and the chart's points: the mean positional
 * deviation ± 2s per target for each direction. Pure and unit-tested.
 */
import { decide, type DecisionRule } from "@/geometry";
import {
  HEAD_AXIS_ROLE_WORDS,
  POSITIONING_QUANTITY_WORDS,
  type HeadAxisRole,
  type PositioningQuantity,
} from "@/lib/domain/positioning";
import { limitSourceWords } from "@/lib/fit-display";
import type { Decision } from "@/lib/report/types";

/** What geometry stored in the dataset's summary (rotaryPositioningToJson), arc seconds. */
export interface RotaryPositioningSummary {
  unit: "arcsec";
  axis?: string;
  targets: ReadonlyArray<{
    target_deg: number;
    mean_pos: number;
    mean_neg: number;
    s_pos: number;
    s_neg: number;
    reversal: number;
  }>;
  A: number;
  A_pos: number;
  A_neg: number;
  E: number;
  E_pos: number;
  E_neg: number;
  M: number;
  R: number;
  R_pos: number;
  R_neg: number;
  B: number;
  B_mean: number;
  warnings: readonly string[];
}

/** One limit of the procedure (template_positioning_limits), arc seconds. */
export interface PositioningLimit {
  axis: HeadAxisRole;
  quantity: PositioningQuantity;
  upperLimitArcsec: number;
  limitSource: string;
  limitSourceNote: string | null;
}

export interface PositioningRow {
  key: PositioningQuantity | "B_mean";
  symbol: string;
  words: string;
  /** Both directions; per direction only where the standard defines it (A, E, R). */
  both: string;
  pos: string | null;
  neg: string | null;
  valueArcsec: number;
  limitText: string;
  /** Where the limit comes from, in words ("—" without a limit). */
  source: string;
  decision: Decision;
  /** "U missing" when the guarded rule had no U. */
  reason?: string;
}

export interface PositioningChartPoint {
  targetDeg: number;
  mean: number;
  lo: number;
  hi: number;
}

export interface RotaryPositioningView {
  axis: HeadAxisRole;
  axisText: string;
  rows: PositioningRow[];
  /** Fail if any row fails, else undecided if any is, else pass; recorded when nothing is limited. */
  decision: Decision;
  targets: number;
  chart: { pos: PositioningChartPoint[]; neg: PositioningChartPoint[] };
  warnings: readonly string[];
}

/** Arc seconds with two decimals; beyond one degree in degrees as well. */
export function arcsecText(v: number): string {
  const s = `${v.toFixed(2)}″`;
  return Math.abs(v) >= 3600 ? `${s} (${(v / 3600).toFixed(4)}°)` : s;
}

/** The axis words of a test: "primary (rotary) axis C" (letter from the head or the file). */
export function positioningAxisText(axis: HeadAxisRole, letter: string | null | undefined): string {
  return `${HEAD_AXIS_ROLE_WORDS[axis]}${letter ? ` ${letter}` : ""}`;
}

export function judgeRotaryPositioning(
  s: RotaryPositioningSummary,
  opts: {
    axis: HeadAxisRole;
    letter?: string | null;
    limits: readonly PositioningLimit[];
    rule: DecisionRule;
    /** Expanded uncertainty (k = 2) of the angle measurement, arc seconds; null when not given. */
    U: number | null;
  },
): RotaryPositioningView {
  const limits = new Map(opts.limits.filter((l) => l.axis === opts.axis).map((l) => [l.quantity, l]));
  const row = (
    key: PositioningQuantity,
    both: number,
    pos: number | null,
    neg: number | null,
  ): PositioningRow => {
    const limit = limits.get(key);
    const judged = limit
      ? decide({ measured: both, lower: null, upper: limit.upperLimitArcsec, U: opts.U, rule: opts.rule })
      : null;
    return {
      key,
      symbol: key,
      words: POSITIONING_QUANTITY_WORDS[key],
      both: arcsecText(both),
      pos: pos === null ? null : arcsecText(pos),
      neg: neg === null ? null : arcsecText(neg),
      valueArcsec: both,
      limitText: limit ? `≤ ${arcsecText(limit.upperLimitArcsec)}` : "—",
      source: limit ? limitSourceWords(limit.limitSource, limit.limitSourceNote) : "—",
      decision: judged ? judged.decision : "recorded",
      ...(judged?.reason ? { reason: judged.reason } : {}),
    };
  };
  const rows: PositioningRow[] = [
    row("A", s.A, s.A_pos, s.A_neg),
    row("E", s.E, s.E_pos, s.E_neg),
    row("M", s.M, null, null),
    row("R", s.R, s.R_pos, s.R_neg),
    row("B", s.B, null, null),
    {
      key: "B_mean",
      symbol: "B̄",
      words: "Mean reversal value",
      both: arcsecText(s.B_mean),
      pos: null,
      neg: null,
      valueArcsec: s.B_mean,
      limitText: "—",
      source: "—",
      decision: "recorded",
    },
  ];
  const ds = rows.map((r) => r.decision).filter((d) => d !== "recorded");
  const decision: Decision =
    ds.length === 0
      ? "recorded"
      : ds.includes("fail")
        ? "fail"
        : ds.includes("undecided")
          ? "undecided"
          : "pass";
  const points = (dir: "pos" | "neg") =>
    s.targets.map((t) => {
      const mean = dir === "pos" ? t.mean_pos : t.mean_neg;
      const sd = dir === "pos" ? t.s_pos : t.s_neg;
      return { targetDeg: t.target_deg, mean, lo: mean - 2 * sd, hi: mean + 2 * sd };
    });
  return {
    axis: opts.axis,
    axisText: positioningAxisText(opts.axis, opts.letter ?? s.axis),
    rows,
    decision,
    targets: s.targets.length,
    chart: { pos: points("pos"), neg: points("neg") },
    warnings: s.warnings,
  };
}

/** The deviation subject of a positioning test (shared by readiness and the deviation form). */
export const rotaryPositioningSubject = (datasetId: string) => `rotary_positioning:${datasetId}`;
