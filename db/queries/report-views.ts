import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { approvedAnalysisIdOf, pictureColumns } from "@/db/queries/analysis-views";
import { jobAccessCondition } from "@/db/queries/jobs";
import { analysisViews, jobs, reportViews, users } from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import { forbidden, invalid, notFound } from "@/lib/errors";
import { isUuid } from "@/lib/domain/uuid";
import { viewSaveRefusal } from "@/lib/policy/analyses";
import { reportViewRefusal } from "@/lib/report/view-choice";
import { getStorage } from "@/lib/storage";

/**
 * The engineer's choice of saved 3D views for the report (report_views): tick or untick a view;
 * only views of the approved fit of at least 600 × 400 px may be ticked (lib/report/view-choice),
 * and the report prints the ticked views that still qualify. Each change is audited with the
 * old and new choice in the same transaction.
 */

/**
 * Includes or leaves out one saved view. 404 when the actor may not see the view's job; 403
 * unless an application engineer (who saves the views); 422 with the reason when the view may not
 * go into the report. Leaving a view out is always allowed.
 */
export async function chooseReportView(actor: Actor, input: { viewId: string; include: boolean }) {
  if (!isUuid(input.viewId)) throw notFound("saved view");
  const [view] = await db
    .select({
      id: analysisViews.id,
      jobId: analysisViews.jobId,
      analysisId: analysisViews.analysisId,
      widthPx: analysisViews.widthPx,
      heightPx: analysisViews.heightPx,
    })
    .from(analysisViews)
    .innerJoin(jobs, eq(jobs.id, analysisViews.jobId))
    .where(and(eq(analysisViews.id, input.viewId), jobAccessCondition(actor)))
    .limit(1);
  if (!view) throw notFound("saved view");
  const who = viewSaveRefusal(actor);
  if (who) throw forbidden(who);
  if (input.include) {
    const refusal = reportViewRefusal(view, await approvedAnalysisIdOf(view.jobId));
    if (refusal) throw invalid(refusal, [{ field: "include", message: refusal }]);
  }
  return db.transaction(async (tx) => {
    const [old] = await tx.select().from(reportViews).where(eq(reportViews.viewId, view.id)).for("update");
    const values = { included: input.include, chosenById: actor.id, chosenAt: new Date() };
    await tx
      .insert(reportViews)
      .values({ viewId: view.id, jobId: view.jobId, ...values })
      .onConflictDoUpdate({ target: reportViews.viewId, set: values });
    await appendAudit(tx, actor, {
      action: input.include ? "analysis_view.included_in_report" : "analysis_view.left_out_of_report",
      entity: { type: "analysis_view", id: view.id },
      jobId: view.jobId,
      oldValues: old ? { included: old.included } : null,
      newValues: { included: input.include },
    });
    return { viewId: view.id, included: input.include };
  });
}

/** The job's view choices, view id → included, for a page whose caller checked the job's access. */
export async function reportViewChoices(jobId: string): Promise<Map<string, boolean>> {
  if (!isUuid(jobId)) return new Map();
  const rows = await db
    .select({ viewId: reportViews.viewId, included: reportViews.included })
    .from(reportViews)
    .where(eq(reportViews.jobId, jobId));
  return new Map(rows.map((r) => [r.viewId, r.included]));
}

/**
 * The views the report prints, oldest first, with their PNG bytes: ticked, of the approved fit,
 * large enough. No actor: for the report code, whose callers have checked the job's access.
 */
export async function reportFigureViews(jobId: string) {
  const approved = await approvedAnalysisIdOf(jobId);
  if (!approved) return [];
  const rows = await db
    .select(pictureColumns)
    .from(reportViews)
    .innerJoin(analysisViews, eq(analysisViews.id, reportViews.viewId))
    .leftJoin(users, eq(users.id, analysisViews.createdById))
    .where(and(eq(reportViews.jobId, jobId), eq(reportViews.included, true)))
    .orderBy(asc(analysisViews.createdAt), asc(analysisViews.id));
  const out = [];
  for (const r of rows.filter((v) => reportViewRefusal(v, approved) === null)) {
    const png = await getStorage().get(r.storageKey);
    if (!png) continue;
    const { storageKey: _key, ...rest } = r;
    out.push({ ...rest, png });
  }
  return out;
}
