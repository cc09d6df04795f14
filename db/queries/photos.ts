import "server-only";
import { randomUUID } from "node:crypto";
import { and, asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { insertJobRecord } from "@/db/queries/audit";
import { getJobDetail, jobAccessCondition, visibleJob } from "@/db/queries/jobs";
import { lockJob, refuseLockedReadings } from "@/db/queries/locks";
import { stepOfJob } from "@/db/queries/readings";
import { jobs, photos, readings, users, type Photo } from "@/db/schema";
import { PHASES } from "@/lib/domain/datasets";
import type { Actor } from "@/lib/domain/roles";
import { isUuid } from "@/lib/domain/uuid";
import { AppError, forbidden, invalid } from "@/lib/errors";
import { processPhoto } from "@/lib/photos";
import { photoViewRefusal } from "@/lib/policy/photos";
import { readingsRefusal } from "@/lib/policy/readings";
import { getStorage } from "@/lib/storage";

/** The job a photo may be added to now, or the refusal (404 unseen, 403 not the recorder or locked). */
export async function requirePhotoJob(actor: Actor, jobId: string) {
  const d = await visibleJob(actor, jobId);
  const refusal = readingsRefusal(actor, d.job);
  if (refusal) throw forbidden(refusal);
  return d;
}

export interface PhotoForm {
  stepId: string;
  phase: "pre" | "post";
  /** The reading it shows: by id, or by the clientId the tablet gave it (sent before the photo). */
  readingId: string | null;
  readingClientId: string | null;
  clientId: string | null;
  takenAt: Date;
}

/** The upload's fields, checked (422 naming the field). */
export function parsePhotoForm(fields: Readonly<Record<string, string>>): PhotoForm {
  const uuid = (name: string, required: boolean) => {
    const v = (fields[name] ?? "").trim();
    if (!v && !required) return null;
    if (!isUuid(v)) throw invalid(`${name} must be a UUID.`, [{ field: name, message: "not a UUID" }]);
    return v.toLowerCase();
  };
  const phase = fields.phase ?? "";
  if (!(PHASES as readonly string[]).includes(phase))
    throw invalid("Say whether the photo is before or after the adjustment.", [
      { field: "phase", message: "pre or post" },
    ]);
  const takenAt = fields.takenAt ? new Date(fields.takenAt) : new Date();
  if (Number.isNaN(takenAt.getTime()))
    throw invalid("The time the photo was taken is not a date.", [
      { field: "takenAt", message: "not a date" },
    ]);
  if (takenAt.getTime() > Date.now() + 5 * 60_000)
    throw invalid("A photo cannot be taken in the future.", [{ field: "takenAt", message: "in the future" }]);
  return {
    stepId: uuid("stepId", true)!,
    phase: phase as "pre" | "post",
    readingId: uuid("readingId", false),
    readingClientId: uuid("readingClientId", false),
    clientId: uuid("clientId", false),
    takenAt,
  };
}

export type PhotoJson = ReturnType<typeof photoJson>;
function photoJson(p: Photo & { uploadedByName?: string | null }) {
  return {
    id: p.id,
    jobId: p.jobId,
    stepId: p.stepId,
    readingId: p.readingId,
    phase: p.phase,
    width: p.width,
    height: p.height,
    sizeBytes: p.sizeBytes,
    sha256: p.sha256,
    takenAt: p.takenAt.toISOString(),
    uploadedBy: p.uploadedByName ?? null,
    clientId: p.clientId,
    url: `/api/photos/${p.id}`,
    thumbUrl: `/api/photos/${p.id}/thumb`,
  };
}

async function byClientId(jobId: string, clientId: string | null) {
  if (!clientId) return null;
  const [p] = await db
    .select()
    .from(photos)
    .where(and(eq(photos.jobId, jobId), eq(photos.clientId, clientId)));
  return p ?? null;
}

/**
 * Stores a photo of a step: the job must take readings from this actor now (403), the step must be
 * the job's and the reading (if named) that step's (422), the bytes an image (415). A `clientId`
 * already stored answers with that photo (`replay`). The image and thumbnail go to storage first,
 * the row and its audit event in one transaction; if that fails the objects are removed again.
 */
export async function addPhoto(
  actor: Actor,
  jobId: string,
  form: PhotoForm,
  data: Buffer,
): Promise<{ photo: PhotoJson; replay: boolean }> {
  const d = await visibleJob(actor, jobId);
  const again = await byClientId(d.job.id, form.clientId);
  if (again) {
    if (again.uploadedById !== actor.id)
      throw new AppError(409, "conflict", "Another photo on this job already carries that clientId.");
    return { photo: photoJson(again), replay: true };
  }
  const refusal = readingsRefusal(actor, d.job);
  if (refusal) throw forbidden(refusal);
  const step = await stepOfJob(d.job.templateId, form.stepId);
  let readingId: string | null = null;
  if (form.readingId || form.readingClientId) {
    const [r] = await db
      .select({ id: readings.id, stepId: readings.stepId })
      .from(readings)
      .where(
        and(
          eq(readings.jobId, d.job.id),
          form.readingId ? eq(readings.id, form.readingId) : eq(readings.clientId, form.readingClientId!),
        ),
      );
    if (!r || r.stepId !== step.id)
      throw invalid("The reading the photo belongs to is not on this step of the job.", [
        { field: form.readingId ? "readingId" : "readingClientId", message: "No such reading on this step." },
      ]);
    readingId = r.id;
  }
  const processed = await processPhoto(data);
  const storage = getStorage();
  const base = `photos/${d.job.id}/${randomUUID()}`;
  const keys = { image: `${base}.jpg`, thumb: `${base}-thumb.jpg` };
  await storage.put(keys.image, processed.image, { contentType: "image/jpeg", sha256: processed.sha256 });
  await storage.put(keys.thumb, processed.thumb, { contentType: "image/jpeg", sha256: "" });
  try {
    const row = await db.transaction(async (tx) => {
      refuseLockedReadings(actor, await lockJob(tx, d.job.id));
      return insertJobRecord(
        tx,
        actor,
        photos,
        {
          jobId: d.job.id,
          stepId: step.id,
          readingId,
          phase: form.phase,
          storageKey: keys.image,
          thumbKey: keys.thumb,
          sha256: processed.sha256,
          contentType: "image/jpeg",
          sizeBytes: processed.image.length,
          width: processed.width,
          height: processed.height,
          takenAt: form.takenAt,
          uploadedById: actor.id,
          clientId: form.clientId,
        },
        {
          action: "photo.added",
          entityType: "photo",
          newValues: () => ({
            step: step.position,
            phase: form.phase,
            readingId,
            sha256: processed.sha256,
            width: processed.width,
            height: processed.height,
            clientId: form.clientId,
          }),
        },
      );
    });
    return { photo: photoJson({ ...row, uploadedByName: actor.name }), replay: false };
  } catch (err) {
    await Promise.all([storage.delete(keys.image), storage.delete(keys.thumb)]).catch(() => undefined);
    // Two sends of one clientId at once: the second finds the first.
    const raced = await byClientId(d.job.id, form.clientId);
    if (raced && raced.uploadedById === actor.id) return { photo: photoJson(raced), replay: true };
    throw err;
  }
}

/** A job's photos with the name of who uploaded each, in the order they were taken. */
function photosOfJob(jobId: string) {
  return db
    .select({ p: photos, name: users.name })
    .from(photos)
    .leftJoin(users, eq(users.id, photos.uploadedById))
    .where(eq(photos.jobId, jobId))
    .orderBy(asc(photos.takenAt), asc(photos.createdAt));
}

/** The job's photos for the checklist (staff who see the job; customers once it is issued). */
export async function listPhotos(actor: Actor, jobId: string): Promise<PhotoJson[]> {
  const d = await getJobDetail(actor, jobId);
  if (!d || photoViewRefusal(actor, d.job)) return [];
  const rows = await photosOfJob(d.job.id);
  return rows.map((r) => photoJson({ ...r.p, uploadedByName: r.name }));
}

/**
 * The stored image (or thumbnail) of a photo for someone who may see it: another tenant's photo
 * and one of a job the actor cannot see are 404; a customer before issue is 403.
 */
export async function getPhotoBytes(actor: Actor, photoId: string, which: "image" | "thumb") {
  if (!isUuid(photoId)) return null;
  const [row] = await db
    .select({ p: photos, status: jobs.status })
    .from(photos)
    .innerJoin(jobs, eq(jobs.id, photos.jobId))
    .where(and(eq(photos.id, photoId), jobAccessCondition(actor)))
    .limit(1);
  if (!row) return null;
  const refusal = photoViewRefusal(actor, { status: row.status });
  if (refusal) throw forbidden(refusal);
  const data = await getStorage().get(which === "image" ? row.p.storageKey : row.p.thumbKey);
  if (!data) throw new AppError(500, "missing_object", "The stored photo is missing.");
  return { photo: row.p, data };
}

/** The job's photos for its report (the caller has checked the job's access). */
export async function jobPhotosForReport(jobId: string) {
  const rows = await photosOfJob(jobId);
  return rows.map((r) => ({ ...r.p, uploadedBy: r.name }));
}
