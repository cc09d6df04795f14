/**
 * Saved pictures of the 3D view ("save view for the report"): the PNG the engineer's browser took
 * of the canvas, stored through lib/storage under a key the server makes, with a row in
 * analysis_views (written once: migration 0006 refuses UPDATE and DELETE) and an audit event in
 * the same transaction. Reads go through the job's tenant rule (jobAccessCondition).
 */
import "server-only";
import { createHash, randomUUID } from "node:crypto";
import { and, desc, eq } from "drizzle-orm";
import type { SelectedFields } from "drizzle-orm/pg-core";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { getAnalysis } from "@/db/queries/analyses";
import { jobAccessCondition } from "@/db/queries/jobs";
import { analyses, analysisViews, auditEvents, datasets, jobs, users } from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import { viewSaveRefusal } from "@/lib/policy/analyses";
import { AppError, forbidden, invalid, notFound } from "@/lib/errors";
import { PngError, readPngInfo } from "@/lib/png-info";
import { getStorage } from "@/lib/storage";
import { isUuid } from "@/lib/domain/uuid";

/** Largest picture accepted, bytes (a 1440 × 960 canvas at device pixel ratio 2 is well below this). */
export const VIEW_MAX_BYTES = 4 * 1024 * 1024;
/** Largest exaggeration the 3D view offers is ×10 000; a little headroom for a future slider. */
export const VIEW_MAX_FACTOR = 100_000;
export const VIEW_CAPTION_MAX = 200;

/** `views/<job uuid>/<random uuid>`: nothing in it comes from the request. */
export function viewObjectKey(jobId: string): string {
  if (!isUuid(jobId)) throw new Error("viewObjectKey: job id must be a uuid");
  return `views/${jobId.toLowerCase()}/${randomUUID()}`;
}

export interface SaveViewInput {
  readonly png: Buffer;
  readonly factor: number;
  readonly overlayAnalysisId: string | null;
  readonly caption: string | null;
}

const viewColumns = {
  id: analysisViews.id,
  jobId: analysisViews.jobId,
  analysisId: analysisViews.analysisId,
  overlayAnalysisId: analysisViews.overlayAnalysisId,
  sha256: analysisViews.sha256,
  sizeBytes: analysisViews.sizeBytes,
  widthPx: analysisViews.widthPx,
  heightPx: analysisViews.heightPx,
  factor: analysisViews.factor,
  caption: analysisViews.caption,
  createdAt: analysisViews.createdAt,
  createdByName: users.name,
};
/** A saved view as the report draws it: where its PNG is, its size, factor, caption and author. */
export const pictureColumns = {
  id: analysisViews.id,
  analysisId: analysisViews.analysisId,
  storageKey: analysisViews.storageKey,
  factor: analysisViews.factor,
  caption: analysisViews.caption,
  widthPx: analysisViews.widthPx,
  heightPx: analysisViews.heightPx,
  createdAt: analysisViews.createdAt,
  createdByName: users.name,
};

export type ViewRow = {
  id: string;
  jobId: string;
  analysisId: string;
  overlayAnalysisId: string | null;
  sha256: string;
  sizeBytes: number;
  widthPx: number;
  heightPx: number;
  factor: number;
  caption: string | null;
  createdAt: Date;
  createdByName: string | null;
};

/** The API's JSON of a saved view (the picture itself is at imageUrl). */
export function viewJson(v: ViewRow) {
  return { ...v, imageUrl: `/api/analysis-views/${v.id}/image` };
}

/**
 * Stores a picture of the 3D view of analysis `analysisId`. 404 when the actor may not see the
 * analysis; 403 unless an application engineer; 422 for a file that is not a PNG, a factor out of
 * range or an overlay fit of another job; 413 over VIEW_MAX_BYTES. The object is written first and
 * removed again if the row cannot be stored, so nothing half-saved remains.
 */
export async function saveAnalysisView(
  actor: Actor,
  analysisId: string,
  input: SaveViewInput,
): Promise<ViewRow> {
  const a = await getAnalysis(actor, analysisId);
  if (!a) throw notFound("analysis");
  const refusal = viewSaveRefusal(actor);
  if (refusal) throw forbidden(refusal);
  if (a.job.status === "cancelled")
    throw forbidden("The job is cancelled; it stays readable and takes no more changes.");
  if (input.png.length > VIEW_MAX_BYTES)
    throw new AppError(
      413,
      "too_large",
      `The picture is larger than the limit of ${VIEW_MAX_BYTES / (1024 * 1024)} MiB.`,
    );
  let info;
  try {
    info = readPngInfo(input.png);
  } catch (e) {
    if (e instanceof PngError) throw invalid(e.message, [{ field: "file", message: e.message }]);
    throw e;
  }
  if (!Number.isFinite(input.factor) || input.factor < 1 || input.factor > VIEW_MAX_FACTOR) {
    throw invalid(`The exaggeration factor must be a number from 1 to ${VIEW_MAX_FACTOR}.`, [
      { field: "factor", message: `got ${input.factor}` },
    ]);
  }
  const caption = input.caption?.trim() || null;
  if (caption && caption.length > VIEW_CAPTION_MAX)
    throw invalid(`The caption is longer than ${VIEW_CAPTION_MAX} characters.`, [
      { field: "caption", message: `${caption.length} characters` },
    ]);
  if (input.overlayAnalysisId) {
    const [o] = isUuid(input.overlayAnalysisId)
      ? await db
          .select({ jobId: analyses.jobId })
          .from(analyses)
          .where(eq(analyses.id, input.overlayAnalysisId))
      : [];
    if (!o || o.jobId !== a.job.id || input.overlayAnalysisId === analysisId) {
      throw invalid("The overlaid fit must be another fit of the same job.", [
        { field: "overlayAnalysisId", message: "not another fit of this job" },
      ]);
    }
  }

  const storage = getStorage();
  const key = viewObjectKey(a.job.id);
  const sha256 = createHash("sha256").update(input.png).digest("hex");
  await storage.put(key, input.png, { contentType: "image/png", sha256 });
  // What the row holds about the picture, and what the audit event records of it.
  const picture = {
    analysisId,
    overlayAnalysisId: input.overlayAnalysisId,
    sha256,
    sizeBytes: input.png.length,
    widthPx: info.widthPx,
    heightPx: info.heightPx,
    factor: input.factor,
    caption,
  };
  try {
    const id = await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(analysisViews)
        .values({ jobId: a.job.id, ...picture, storageKey: key, createdById: actor.id })
        .returning({ id: analysisViews.id });
      await appendAudit(tx, actor, {
        action: "analysis_view.saved",
        entity: { type: "analysis_view", id: row!.id },
        jobId: a.job.id,
        newValues: picture,
      });
      return row!.id;
    });
    const [saved] = await selectViews().where(eq(analysisViews.id, id));
    return saved as ViewRow;
  } catch (err) {
    await storage.delete(key).catch(() => undefined);
    throw err;
  }
}

/** Newest first, ties by id: the order every list of views is shown in. */
const newestViewsFirst = [desc(analysisViews.createdAt), desc(analysisViews.id)];

/** Saved views with their job (for jobAccessCondition) and author's name, plus any extra columns. */
function selectViews<X extends SelectedFields>(extra: X = {} as X) {
  return db
    .select({ ...viewColumns, ...extra })
    .from(analysisViews)
    .innerJoin(jobs, eq(jobs.id, analysisViews.jobId))
    .leftJoin(users, eq(users.id, analysisViews.createdById))
    .$dynamic();
}

/** Views of one analysis, newest first; null when the actor may not see the analysis. */
export async function listAnalysisViews(actor: Actor, analysisId: string): Promise<ViewRow[] | null> {
  const a = await getAnalysis(actor, analysisId);
  if (!a) return null;
  return (await selectViews()
    .where(and(eq(analysisViews.analysisId, analysisId), jobAccessCondition(actor)))
    .orderBy(...newestViewsFirst)) as ViewRow[];
}

/** Views of every fit of a job, newest first, with the dataset each fit came from (empty when the job is not visible). */
export async function listJobViews(actor: Actor, jobId: string) {
  if (!isUuid(jobId)) return [];
  return selectViews({ datasetFilename: datasets.originalFilename, phase: datasets.phase })
    .innerJoin(analyses, eq(analyses.id, analysisViews.analysisId))
    .innerJoin(datasets, eq(datasets.id, analyses.datasetId))
    .where(and(eq(analysisViews.jobId, jobId), jobAccessCondition(actor)))
    .orderBy(...newestViewsFirst)
    .limit(60);
}

/** One view's PNG for anyone who may see its job; null otherwise (also for a malformed id or a missing object). */
export async function getViewImage(
  actor: Actor,
  viewId: string,
): Promise<{ view: ViewRow; png: Buffer } | null> {
  if (!isUuid(viewId)) return null;
  const [row] = await selectViews({ storageKey: analysisViews.storageKey })
    .where(and(eq(analysisViews.id, viewId), jobAccessCondition(actor)))
    .limit(1);
  if (!row) return null;
  const png = await getStorage().get(row.storageKey);
  if (!png) {
    console.error(`[views] stored object missing for view ${row.id}`);
    return null;
  }
  const { storageKey: _key, ...view } = row;
  return { view: view as ViewRow, png };
}

export interface LatestJobView {
  readonly id: string;
  readonly analysisId: string;
  readonly png: Buffer;
  readonly factor: number;
  readonly caption: string | null;
  readonly widthPx: number;
  readonly heightPx: number;
  readonly createdAt: Date;
  readonly createdByName: string | null;
}

/**
 * The id of the job's approved fit: the analysis named by its latest "analysis.approved" audit
 * event (as getApprovedAnalysis reads it). No actor: callers have checked the job's access.
 */
export async function approvedAnalysisIdOf(jobId: string): Promise<string | null> {
  const [approval] = await db
    .select({ analysisId: auditEvents.entityId })
    .from(auditEvents)
    .where(and(eq(auditEvents.jobId, jobId), eq(auditEvents.action, "analysis.approved")))
    .orderBy(desc(auditEvents.id))
    .limit(1);
  return approval?.analysisId ?? null;
}

/**
 * The latest saved view of the job's *approved* fit (the analysis named by the job's latest
 * "analysis.approved" audit event, as getApprovedAnalysis reads it), with its PNG bytes; null
 * when no fit is approved, the approved fit has no saved view, or the stored object is missing.
 * Views saved of other fits of the job (even with the approved one overlaid) are not returned.
 *
 * No actor: for the report code, whose callers have already checked that the user may see the
 * job (getJobDetail / jobAccessCondition). Do not call it with a job id straight from a request.
 */
export async function latestJobView(jobId: string): Promise<LatestJobView | null> {
  if (!isUuid(jobId)) return null;
  const approved = await approvedAnalysisIdOf(jobId);
  if (!approved) return null;
  const approval = { analysisId: approved };
  const [row] = await db
    .select(pictureColumns)
    .from(analysisViews)
    .leftJoin(users, eq(users.id, analysisViews.createdById))
    .where(and(eq(analysisViews.jobId, jobId), eq(analysisViews.analysisId, approval.analysisId)))
    .orderBy(...newestViewsFirst)
    .limit(1);
  if (!row) return null;
  const png = await getStorage().get(row.storageKey);
  if (!png) return null;
  const { storageKey: _key, ...rest } = row;
  return { ...rest, png };
}
