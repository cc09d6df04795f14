/** Heads: their axis letters and what the heads register and a head's history show. */
import type { HeadFitJson } from "@/geometry";
import type { JobKind, JobStatus } from "./jobs";
import type { Phase } from "./datasets";

export const AXIS_LETTERS = ["A", "B", "C"] as const;
export type AxisLetter = (typeof AXIS_LETTERS)[number];

/** One row of the heads register. */
export interface HeadListRow {
  id: string;
  serial: string;
  maker: string | null;
  model: string | null;
  primaryAxis: AxisLetter;
  secondaryAxis: AxisLetter;
  nominalPivotLengthMm: number;
  massKg: number | null;
  machineName: string | null;
  /** Set when the head is retired: it stays on its old jobs and takes no new work. */
  retiredAt?: Date | null;
}

/** One job on a head with the fit that stands for it: the approved one, or else the latest. */
export interface HeadHistoryJob {
  readonly id: string;
  readonly reference: string;
  readonly title: string;
  readonly kind: JobKind;
  readonly status: JobStatus;
  /** When the work was (or is) scheduled, else when the job was created. */
  readonly date: Date;
  /** May the reader open this job? (An installer reads a head's whole history, opens only their jobs.) */
  readonly open?: boolean;
  readonly fit: {
    readonly analysisId: string;
    readonly approved: boolean;
    readonly createdAt: Date;
    readonly datasetFilename: string;
    readonly phase: Phase;
    readonly geometryVersion: string;
    readonly fit: HeadFitJson;
  } | null;
}
