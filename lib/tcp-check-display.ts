/**
 * A tool-centre-point check as the job and the report show it: the figures geometry/tcp-check.ts
 * computed at upload (range of the sphere centre in x, y and z over the swing, and the largest
 * distance from the mean centre, µm), each judged against the procedure's limit for it with the
 * simple rule (the figures are spreads of one measurement set; no U is subtracted or added), and
 * one decision for the check. Pure and unit-tested.
 */
import { decide } from "@/geometry";
import type { Decision } from "@/lib/report/types";

/** What geometry stored in the dataset's summary (tcpCheckToJson plus the mean centre). */
export interface TcpCheckSummary {
  range_um: { x: number; y: number; z: number };
  max_from_mean_um: number;
  worst_row: number;
  poses: number;
  warnings: readonly string[];
}

/** The procedure's TCP-check limits (procedure_templates), µm; null = recorded, not judged. */
export interface TcpLimits {
  required: boolean;
  rangeLimitUm: number | null;
  deviationLimitUm: number | null;
}

export interface TcpCheckRow {
  quantity: string;
  valueUm: number;
  valueText: string;
  limitText: string;
  decision: Decision;
}

export interface TcpCheckView {
  rows: TcpCheckRow[];
  /** Fail if any row fails; pass if every judged row passes; recorded when there is no limit. */
  decision: Decision;
  poses: number;
  worstRow: number;
}

function judged(value: number, limit: number | null): Decision {
  if (limit === null) return "recorded";
  return decide({ measured: value, lower: null, upper: limit, U: null, rule: "simple" }).decision as Decision;
}

export function judgeTcpCheck(s: TcpCheckSummary, limits: TcpLimits): TcpCheckView {
  const um = (v: number) => `${v.toFixed(1)} µm`;
  const lim = (v: number | null) => (v === null ? "—" : `≤ ${v.toFixed(1)} µm`);
  const rows: TcpCheckRow[] = [
    ...(["x", "y", "z"] as const).map((a) => ({
      quantity: `Range of the centre in ${a.toUpperCase()}`,
      valueUm: s.range_um[a],
      valueText: um(s.range_um[a]),
      limitText: lim(limits.rangeLimitUm),
      decision: judged(s.range_um[a], limits.rangeLimitUm),
    })),
    {
      quantity: `Largest distance from the mean centre (row ${s.worst_row})`,
      valueUm: s.max_from_mean_um,
      valueText: um(s.max_from_mean_um),
      limitText: lim(limits.deviationLimitUm),
      decision: judged(s.max_from_mean_um, limits.deviationLimitUm),
    },
  ];
  const ds = rows.map((r) => r.decision).filter((d) => d !== "recorded");
  const decision: Decision = ds.length === 0 ? "recorded" : ds.includes("fail") ? "fail" : "pass";
  return { rows, decision, poses: s.poses, worstRow: s.worst_row };
}

/** The deviation subject of a TCP check (shared by readiness and the deviation form). */
export const tcpCheckSubject = (datasetId: string) => `tcp_check:${datasetId}`;
