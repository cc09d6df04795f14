import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { getJobDetail, jobAccessCondition, visibleJob } from "@/db/queries/jobs";
import { datasetColumns, datasets, jobs, users } from "@/db/schema";
import { evaluateTestPart, type TestPartRow } from "@/geometry";
import type { DatasetKind, DatasetListRow } from "@/lib/domain/datasets";
import type { Actor } from "@/lib/domain/roles";
import { dataHandlerRefusal, datasetDeleteRefusal, uploadRefusal } from "@/lib/policy/datasets";
import { AppError, forbidden, notFound } from "@/lib/errors";
import { datasetObjectKey, getStorage } from "@/lib/storage";
import type { UploadedFile } from "@/lib/storage/multipart";
import {
  bytesToColumn,
  columnToBytes,
  type ParsedDataset,
  type UploadForm,
} from "@/lib/storage/parse-dataset";
import { isUuid } from "@/lib/domain/uuid";

/**
 * The job an upload goes to, checked before the body is read: 404 when the actor may not see it,
 * 403 when their role may not upload, 409 when the job is past the stage that takes data.
 */
export async function requireUploadableJob(actor: Actor, jobId: string, kind?: DatasetKind) {
  const d = await visibleJob(actor, jobId);
  const who = dataHandlerRefusal(actor, "upload");
  if (who) throw forbidden(who);
  const when = uploadRefusal(actor, d.job, kind);
  if (when) throw new AppError(409, "job_closed", when);
  return d;
}

/**
 * Stores a validated upload: the original bytes first (under a key we make), then the dataset
 * row, its columns and the audit event in one transaction. If the transaction fails the object is
 * removed again, so a failed upload leaves nothing behind.
 */
export async function insertDataset(
  actor: Actor,
  jobId: string,
  form: UploadForm,
  file: UploadedFile,
  parsed: ParsedDataset,
) {
  const storage = getStorage();
  const key = datasetObjectKey(jobId);
  await storage.put(key, file.data, { contentType: "text/csv", sha256: file.sha256 });
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(datasets)
        .values({
          jobId,
          kind: form.kind,
          phase: form.phase,
          rows: parsed.rows,
          sha256: file.sha256,
          storageKey: key,
          sizeBytes: file.data.length,
          originalFilename: safeFilename(file.filename),
          contentType: "text/csv",
          units: parsed.units,
          options: parsed.options,
          warnings: parsed.warnings.slice(0, 200),
          summary: parsed.summary,
          uploadedById: actor.id,
        })
        .returning();
      for (const c of parsed.columns) {
        await tx
          .insert(datasetColumns)
          .values({ datasetId: row!.id, name: c.name, unit: c.unit, data: columnToBytes(c.values) });
      }
      await appendAudit(tx, actor, {
        action: "dataset.uploaded",
        entity: { type: "dataset", id: row!.id },
        jobId,
        newValues: {
          kind: row!.kind,
          phase: row!.phase,
          rows: row!.rows,
          sha256: row!.sha256,
          filename: row!.originalFilename,
          units: parsed.units,
        },
      });
      return row!;
    });
  } catch (err) {
    await storage.delete(key).catch(() => undefined);
    throw err;
  }
}

/** A file name fit to show and to offer in Content-Disposition: no paths, no control characters. */
export function safeFilename(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? "";
  const clean = base
    .normalize("NFC")
    .replace(/[\u0000-\u001f\u007f"*:<>?|]/g, "_")
    .replace(/^\.+/, "")
    .trim()
    .slice(0, 120);
  return clean || "dataset.csv";
}

const listColumns = {
  id: datasets.id,
  jobId: datasets.jobId,
  kind: datasets.kind,
  phase: datasets.phase,
  status: datasets.status,
  rows: datasets.rows,
  sha256: datasets.sha256,
  sizeBytes: datasets.sizeBytes,
  originalFilename: datasets.originalFilename,
  units: datasets.units,
  warnings: datasets.warnings,
  uploadedAt: datasets.uploadedAt,
  deletedAt: datasets.deletedAt,
  uploaderName: users.name,
};
export type { DatasetListRow };

/** The datasets of a job the actor may see, newest first; null when the job is not visible. */
export async function listDatasets(actor: Actor, jobId: string): Promise<DatasetListRow[] | null> {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  return db
    .select(listColumns)
    .from(datasets)
    .leftJoin(users, eq(users.id, datasets.uploadedById))
    .where(eq(datasets.jobId, jobId))
    .orderBy(desc(datasets.uploadedAt), desc(datasets.id));
}

/** One dataset with its job's owner fields; null when missing or not visible to the actor. */
export async function getDataset(actor: Actor, datasetId: string) {
  if (!isUuid(datasetId)) return null;
  const [row] = await db
    .select({
      dataset: datasets,
      job: { id: jobs.id, reference: jobs.reference, status: jobs.status, decisionRule: jobs.decisionRule },
      uploaderName: users.name,
    })
    .from(datasets)
    .innerJoin(jobs, eq(jobs.id, datasets.jobId))
    .leftJoin(users, eq(users.id, datasets.uploadedById))
    .where(and(eq(datasets.id, datasetId), jobAccessCondition(actor)))
    .limit(1);
  return row ?? null;
}
export type DatasetDetail = NonNullable<Awaited<ReturnType<typeof getDataset>>>;

/** The API's parse summary of a dataset. */
export function datasetJson(d: DatasetDetail) {
  const x = d.dataset;
  return {
    id: x.id,
    jobId: x.jobId,
    jobReference: d.job.reference,
    kind: x.kind,
    phase: x.phase,
    status: x.status,
    rows: x.rows,
    sha256: x.sha256,
    sizeBytes: x.sizeBytes,
    originalFilename: x.originalFilename,
    units: x.units,
    options: x.options,
    warnings: x.warnings,
    summary: x.summary,
    uploadedBy: d.uploaderName,
    uploadedAt: x.uploadedAt,
    deletedAt: x.deletedAt,
  };
}

/** The stored original bytes of a dataset the actor may see (null: not visible or missing). */
export async function getDatasetOriginal(actor: Actor, datasetId: string) {
  const d = await getDataset(actor, datasetId);
  if (!d) return null;
  const data = await getStorage().get(d.dataset.storageKey);
  if (!data) return null;
  return { detail: d, data };
}

/** Stored columns of a dataset (SI-based units), by name. */
export async function getDatasetColumns(
  actor: Actor,
  datasetId: string,
): Promise<Map<string, { unit: string; values: Float64Array }> | null> {
  const d = await getDataset(actor, datasetId);
  if (!d) return null;
  const rows = await db.select().from(datasetColumns).where(eq(datasetColumns.datasetId, datasetId));
  return new Map(rows.map((r) => [r.name, { unit: r.unit, values: bytesToColumn(r.data) }]));
}

/** Soft delete (status deleted) while the job is draft or measuring; audited. */
export async function deleteDataset(actor: Actor, datasetId: string) {
  const d = await getDataset(actor, datasetId);
  if (!d) throw notFound("dataset");
  const who = dataHandlerRefusal(actor, "delete");
  if (who) throw forbidden(who);
  if (d.dataset.status === "deleted")
    throw new AppError(409, "already_deleted", "This dataset is already deleted.");
  const when = datasetDeleteRefusal(actor, d.job);
  if (when) throw new AppError(409, "job_closed", when);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(datasets)
      .set({ status: "deleted", deletedAt: new Date(), deletedById: actor.id })
      .where(and(eq(datasets.id, datasetId), eq(datasets.status, "stored")))
      .returning();
    if (!row) throw new AppError(409, "already_deleted", "This dataset is already deleted.");
    await appendAudit(tx, actor, {
      action: "dataset.deleted",
      entity: { type: "dataset", id: row.id },
      jobId: row.jobId,
      oldValues: { status: "stored" },
      newValues: { status: "deleted" },
    });
    return row;
  });
}

/**
 * A test-part dataset judged under its job's decision rule (ISO 14253-1 simple or guarded
 * acceptance, geometry/test-part.ts), with the expanded uncertainty given at upload.
 */
export async function getTestPartEvaluation(actor: Actor, datasetId: string) {
  const d = await getDataset(actor, datasetId);
  if (!d) return null;
  if (d.dataset.kind !== "test_part") return { detail: d, evaluation: null };
  const summary = (d.dataset.summary ?? {}) as { test_part_rows?: TestPartRow[] };
  const units = (d.dataset.units ?? {}) as { uncertainty_mm?: number };
  const evaluation = evaluateTestPart(summary.test_part_rows ?? [], {
    rule: d.job.decisionRule,
    ...(units.uncertainty_mm !== undefined ? { defaultUMm: units.uncertainty_mm } : {}),
  });
  return { detail: d, evaluation };
}
