/**
 * ISO 230-2 positioning tests of the head's rotary axes on a job: the procedure's limits
 * (template_positioning_limits), which axes the procedure asks for (those it sets a limit for),
 * and the stored tests, each judged by lib/rotary-positioning-display.ts with the job's decision
 * rule. No access check here: callers have checked the job.
 */
import "server-only";
import { and, asc, desc, eq } from "drizzle-orm";
import { db } from "@/db";
import { datasets, templatePositioningLimits } from "@/db/schema";
import type { DecisionRule } from "@/lib/domain/decisions";
import { HEAD_AXIS_ROLES, type HeadAxisRole, type PositioningQuantity } from "@/lib/domain/positioning";
import {
  judgeRotaryPositioning,
  type PositioningLimit,
  type RotaryPositioningSummary,
  type RotaryPositioningView,
} from "@/lib/rotary-positioning-display";

/** The positioning limits of a template version, axis then quantity. */
export async function positioningLimitsOfTemplate(templateId: string | null): Promise<PositioningLimit[]> {
  if (!templateId) return [];
  const rows = await db
    .select()
    .from(templatePositioningLimits)
    .where(eq(templatePositioningLimits.templateId, templateId))
    .orderBy(asc(templatePositioningLimits.axis), asc(templatePositioningLimits.quantity));
  return rows.map((r) => ({
    axis: r.axis,
    quantity: r.quantity as PositioningQuantity,
    upperLimitArcsec: r.upperLimitArcsec,
    limitSource: r.limitSource,
    limitSourceNote: r.limitSourceNote,
  }));
}

type StoredRow = {
  id: string;
  filename: string;
  phase: "pre" | "post";
  uploadedAt: Date;
  units: unknown;
  summary: unknown;
};

/** One stored positioning dataset judged against the procedure's limits with the job's rule. */
function judgeStoredTest(
  r: StoredRow,
  job: { decisionRule: DecisionRule; letters: Record<HeadAxisRole, string> },
  limits: readonly PositioningLimit[],
): RotaryPositioningTest {
  const units = r.units as { axis: HeadAxisRole; uncertainty_arcsec?: number };
  const U = units.uncertainty_arcsec ?? null;
  return {
    datasetId: r.id,
    filename: r.filename,
    phase: r.phase,
    uploadedAt: r.uploadedAt,
    U,
    view: judgeRotaryPositioning((r.summary as { rotary: RotaryPositioningSummary }).rotary, {
      axis: units.axis,
      letter: job.letters[units.axis],
      limits,
      rule: job.decisionRule,
      U,
    }),
  };
}

/** A positioning dataset of the job (stored or deleted) as the dataset page shows it. */
export async function positioningTestOf(d: Parameters<typeof positioningJobOf>[0], r: StoredRow) {
  const job = positioningJobOf(d);
  return judgeStoredTest(r, job, await positioningLimitsOfTemplate(job.templateId));
}

export interface RotaryPositioningTest {
  datasetId: string;
  filename: string;
  phase: "pre" | "post";
  uploadedAt: Date;
  U: number | null;
  view: RotaryPositioningView;
}

/**
 * The job's rotary positioning tests, newest first, judged; `latest` holds the test that counts
 * per axis (the newest after adjustment, else the newest), and `required` the axes the procedure
 * sets limits for.
 */
export async function jobRotaryPositioning(job: {
  id: string;
  templateId: string | null;
  decisionRule: DecisionRule;
  letters: Record<HeadAxisRole, string>;
}) {
  const [limits, rows] = await Promise.all([
    positioningLimitsOfTemplate(job.templateId),
    db
      .select({
        id: datasets.id,
        filename: datasets.originalFilename,
        phase: datasets.phase,
        uploadedAt: datasets.uploadedAt,
        units: datasets.units,
        summary: datasets.summary,
      })
      .from(datasets)
      .where(
        and(
          eq(datasets.jobId, job.id),
          eq(datasets.kind, "rotary_positioning"),
          eq(datasets.status, "stored"),
        ),
      )
      .orderBy(desc(datasets.uploadedAt), desc(datasets.id)),
  ]);
  const tests = rows.map((r) => judgeStoredTest(r, job, limits));
  const latest: Partial<Record<HeadAxisRole, RotaryPositioningTest>> = {};
  for (const axis of HEAD_AXIS_ROLES) {
    const of = tests.filter((t) => t.view.axis === axis);
    const counting = of.find((t) => t.phase === "post") ?? of[0];
    if (counting) latest[axis] = counting;
  }
  const required = HEAD_AXIS_ROLES.filter((a) => limits.some((l) => l.axis === a));
  return { limits, required, tests, latest };
}
export type JobRotaryPositioning = Awaited<ReturnType<typeof jobRotaryPositioning>>;

/** The arguments of jobRotaryPositioning from a job detail. */
export function positioningJobOf(d: {
  job: { id: string; templateId: string | null; decisionRule: DecisionRule };
  head: { primaryAxis: string; secondaryAxis: string };
}) {
  return {
    id: d.job.id,
    templateId: d.job.templateId,
    decisionRule: d.job.decisionRule,
    letters: { primary: d.head.primaryAxis, secondary: d.head.secondaryAxis },
  };
}
