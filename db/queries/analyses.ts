import "server-only";
import { createHash } from "node:crypto";
import { and, desc, eq, getTableColumns, sql } from "drizzle-orm";
import type { SelectedFields } from "drizzle-orm/pg-core";
import { db } from "@/db";
import { appendAudit, jobEvent } from "@/db/queries/audit";
import { getDataset, getDatasetColumns } from "@/db/queries/datasets";
import { getJobDetail, jobAccessCondition, visibleJob } from "@/db/queries/jobs";
import { parameterLimitsOfTemplate } from "@/db/queries/parameter-limits";
import {
  jobStateSha256,
  manifestFor,
  refuseSameSigner,
  requirePasswordReentry,
} from "@/db/queries/signatures";
import {
  analyses,
  auditEvents,
  datasets,
  jobs,
  signatures,
  users,
  type Analysis,
  type Head,
} from "@/db/schema";
import {
  fitHead,
  GEOMETRY_VERSION,
  GeometryError,
  headFitToJson,
  type HeadConfig,
  type HeadFitJson,
  type HeadFitOptions,
  type HeadVec3,
  type SphereProbeData,
} from "@/geometry";
import { canonicalJson } from "@/lib/canonical-json";
import { nextVisitPlan, type NextVisitPlan } from "@/lib/pose-coverage";
import { parameterRows } from "@/lib/fit-display";
import { getSigningKey } from "@/lib/report/keys";
import { signManifest } from "@/lib/report/signing";

import { type Actor } from "@/lib/domain/roles";
import {
  fitApprovalRefusal,
  fitApproverRefusal,
  headFitRefusal,
  headFitterRefusal,
} from "@/lib/policy/analyses";
import { AppError, forbidden, invalid, notFound } from "@/lib/errors";
import { isUuid } from "@/lib/domain/uuid";
import { lockJob } from "./locks";

/** The head configuration geometry/ needs, from the heads register (lengths in mm). */
export function headConfigOf(
  head: Pick<Head, "primaryAxis" | "secondaryAxis" | "nominalPivotLengthMm" | "toolDirection">,
): HeadConfig {
  return {
    primary: head.primaryAxis,
    secondary: head.secondaryAxis,
    pivotLengthMm: head.nominalPivotLengthMm,
    toolDirection: [head.toolDirection[0], head.toolDirection[1], head.toolDirection[2]],
  };
}

/** The options a fit runs with: geometry's defaults (secondary yaw pinned, 50 iterations). Stored and hashed. */
export const DEFAULT_HEAD_FIT_OPTIONS: HeadFitOptions = { maxIterations: 50 };

/**
 * What the analysis page draws besides geometry's JSON: each pose (degrees, mm), the residual per
 * pose (measured − modelled sphere centre, µm) and the measured tip deviation c − mᵢ (µm), which
 * by the measurement model m = c − (tip − tip₀) is the tip error the probe saw at that pose.
 */
export interface HeadFitPoses {
  readonly row: number[];
  readonly primary_deg: number[];
  readonly secondary_deg: number[];
  readonly tool_mm: number[];
  readonly residual_um: HeadVec3[];
  readonly measured_deviation_um: HeadVec3[];
}

/** The stored result: `fit` is exactly headFitToJson's output; the rest is for the page. */
export interface StoredHeadFit {
  readonly fit: HeadFitJson;
  readonly s_um: number;
  readonly degrees_of_freedom: number;
  readonly pinned: string[];
  readonly head: { primary: string; secondary: string; pivot_length_mm: number; tool_direction: HeadVec3 };
  readonly poses: HeadFitPoses;
}

/** Stored dataset columns (mm, degrees) as geometry's SphereProbeData; 422 naming a missing column. */
export function sphereProbeFromColumns(
  cols: Map<string, { unit: string; values: Float64Array }>,
): SphereProbeData {
  const need = (name: string, unit: string) => {
    const c = cols.get(name);
    if (!c)
      throw invalid(`The dataset has no ${name} column; it cannot be fitted.`, [
        { column: name, message: `column ${name} is missing` },
      ]);
    if (c.unit !== unit)
      throw invalid(`Column ${name} is stored in ${c.unit}, not ${unit}.`, [
        { column: name, message: `unit ${c.unit}, expected ${unit}` },
      ]);
    return c.values;
  };
  const primaryDeg = need("primary_deg", "deg");
  const n = primaryDeg.length;
  const tool = cols.get("tool_mm")?.values;
  const repeat = cols.get("repeat")?.values;
  const sourceRow = new Int32Array(n);
  for (let i = 0; i < n; i++) sourceRow[i] = i + 2;
  return {
    rows: n,
    primaryDeg,
    secondaryDeg: need("secondary_deg", "deg"),
    xMm: need("x_mm", "mm"),
    yMm: need("y_mm", "mm"),
    zMm: need("z_mm", "mm"),
    ...(tool ? { toolMm: tool } : {}),
    ...(repeat ? { repeat } : {}),
    sourceRow,
  };
}

/** SHA-256 over the dataset's SHA-256 and the canonical JSON of the options and head configuration. */
export function headFitInputSha256(
  datasetSha256: string,
  options: HeadFitOptions,
  config: HeadConfig,
): string {
  return createHash("sha256")
    .update(datasetSha256)
    .update("\n")
    .update(canonicalJson({ options, head: config }))
    .digest("hex");
}

/** Runs the fit (pure geometry/) and shapes what is stored. GeometryErrors become 422 naming the rows. */
export function computeHeadFit(
  config: HeadConfig,
  data: SphereProbeData,
  options: HeadFitOptions,
): StoredHeadFit {
  let r;
  try {
    r = fitHead(config, data, options);
  } catch (err) {
    if (err instanceof GeometryError) {
      throw new AppError(
        422,
        err.code,
        `The fit could not run: ${err.message}`,
        err.issues.slice(0, 50).map((i) => ({
          ...(i.row ? { row: i.row } : {}),
          ...(i.column ? { column: i.column } : {}),
          message: i.message,
        })),
      );
    }
    throw err;
  }
  const n = data.rows;
  const c = r.sphere_centre_mm;
  const poses: HeadFitPoses = {
    row: [],
    primary_deg: [],
    secondary_deg: [],
    tool_mm: [],
    residual_um: [],
    measured_deviation_um: [],
  };
  for (let i = 0; i < n; i++) {
    poses.row.push(data.sourceRow ? data.sourceRow[i]! : i + 2);
    poses.primary_deg.push(data.primaryDeg[i]!);
    poses.secondary_deg.push(data.secondaryDeg[i]!);
    poses.tool_mm.push(data.toolMm ? data.toolMm[i]! : 0);
    poses.residual_um.push([r.residuals_um[3 * i]!, r.residuals_um[3 * i + 1]!, r.residuals_um[3 * i + 2]!]);
    poses.measured_deviation_um.push([
      1000 * (c[0] - data.xMm[i]!),
      1000 * (c[1] - data.yMm[i]!),
      1000 * (c[2] - data.zMm[i]!),
    ]);
  }
  const t = config.toolDirection ?? [0, 0, -1];
  return {
    fit: headFitToJson(r),
    s_um: r.s_um,
    degrees_of_freedom: r.degrees_of_freedom,
    pinned: r.parameters.filter((p) => p.pinned).map((p) => p.key),
    head: {
      primary: config.primary,
      secondary: config.secondary,
      pivot_length_mm: config.pivotLengthMm,
      tool_direction: [t[0], t[1], t[2]],
    },
    poses,
  };
}

export type AnalysisRow = Omit<Analysis, "result"> & { result: StoredHeadFit };

/**
 * Runs the head fit of a sphere-probe dataset on the server and stores it, or returns the stored
 * analysis of the same input (same dataset, options, head configuration and geometry version).
 * 404 when the actor may not see the dataset; 403 when their role may not run fits; 409 once the
 * job's parameters are approved; 422 when the data cannot be fitted. Audited when new.
 */
export async function runHeadFit(
  actor: Actor,
  datasetId: string,
): Promise<{ analysis: AnalysisRow; created: boolean }> {
  const d = await getDataset(actor, datasetId);
  if (!d) throw notFound("dataset");
  const who = headFitterRefusal(actor);
  if (who) throw forbidden(who);
  const refusal = headFitRefusal(actor, d.job);
  if (refusal) throw new AppError(409, "job_closed", refusal);
  if (d.dataset.status !== "stored")
    throw new AppError(409, "dataset_deleted", "This dataset is deleted; it cannot be fitted.");
  if (d.dataset.kind !== "sphere_probe")
    throw invalid(
      `A head fit needs a sphere-probe dataset; this one is ${d.dataset.kind.replace("_", " ")}.`,
      [{ field: "dataset", message: "not a sphere-probe dataset" }],
    );
  const job = await getJobDetail(actor, d.dataset.jobId);
  if (!job) throw notFound("dataset");
  const config = headConfigOf(job.head);
  const options = DEFAULT_HEAD_FIT_OPTIONS;
  const inputSha256 = headFitInputSha256(d.dataset.sha256, options, config);
  const existing = await findAnalysis(datasetId, inputSha256);
  if (existing) return { analysis: existing, created: false };

  const cols = await getDatasetColumns(actor, datasetId);
  if (!cols) throw notFound("dataset");
  const result = computeHeadFit(config, sphereProbeFromColumns(cols), options);

  const row = await db.transaction(async (tx) => {
    const [inserted] = await tx
      .insert(analyses)
      .values({
        jobId: d.dataset.jobId,
        datasetId,
        kind: "head_fit",
        geometryVersion: GEOMETRY_VERSION,
        inputSha256,
        options,
        result,
        createdById: actor.id,
      })
      .onConflictDoNothing()
      .returning();
    if (!inserted) return null;
    await appendAudit(tx, actor, {
      action: "analysis.created",
      entity: { type: "analysis", id: inserted.id },
      jobId: inserted.jobId,
      newValues: {
        kind: "head_fit",
        datasetId,
        inputSha256,
        geometryVersion: GEOMETRY_VERSION,
        rms_um: result.fit.rms_um,
        parameters: Object.fromEntries(result.fit.parameters.map((p) => [p.key, p.value])),
      },
    });
    return inserted;
  });
  if (!row) {
    // Another request stored the same input meanwhile: that one is the analysis.
    const again = await findAnalysis(datasetId, inputSha256);
    if (again) return { analysis: again, created: false };
    throw new AppError(409, "conflict", "The analysis changed meanwhile; try again.");
  }
  return { analysis: row as AnalysisRow, created: true };
}

async function findAnalysis(datasetId: string, inputSha256: string): Promise<AnalysisRow | null> {
  const [row] = await db
    .select()
    .from(analyses)
    .where(
      and(
        eq(analyses.datasetId, datasetId),
        eq(analyses.inputSha256, inputSha256),
        eq(analyses.geometryVersion, GEOMETRY_VERSION),
      ),
    )
    .limit(1);
  return (row as AnalysisRow | undefined) ?? null;
}

/**
 * Analyses joined to their job (for jobAccessCondition), their dataset and their author, with the
 * author's name beside the given columns; the caller filters and sorts.
 */
function selectAnalyses<S extends SelectedFields>(columns: S) {
  return db
    .select({ ...columns, createdByName: users.name })
    .from(analyses)
    .innerJoin(jobs, eq(jobs.id, analyses.jobId))
    .innerJoin(datasets, eq(datasets.id, analyses.datasetId))
    .leftJoin(users, eq(users.id, analyses.createdById))
    .$dynamic();
}

/** One analysis the actor may see (through its job's tenant rule); null otherwise, also for a malformed id. */
export async function getAnalysis(actor: Actor, id: string) {
  if (!isUuid(id)) return null;
  const [row] = await selectAnalyses({
    analysis: analyses,
    job: { id: jobs.id, reference: jobs.reference, status: jobs.status },
    dataset: {
      id: datasets.id,
      sha256: datasets.sha256,
      originalFilename: datasets.originalFilename,
      rows: datasets.rows,
    },
  })
    .where(and(eq(analyses.id, id), jobAccessCondition(actor)))
    .limit(1);
  if (!row) return null;
  return { ...row, analysis: row.analysis as AnalysisRow };
}
export type AnalysisDetail = NonNullable<Awaited<ReturnType<typeof getAnalysis>>>;

/** The API's JSON of an analysis: identification, then geometry's JSON (`fit`) and the page's extras. */
export function analysisJson(d: AnalysisDetail) {
  const a = d.analysis;
  return {
    id: a.id,
    jobId: a.jobId,
    jobReference: d.job.reference,
    datasetId: a.datasetId,
    datasetSha256: d.dataset.sha256,
    kind: a.kind,
    geometryVersion: a.geometryVersion,
    inputSha256: a.inputSha256,
    options: a.options,
    createdBy: d.createdByName,
    createdAt: a.createdAt,
    ...a.result,
  };
}

/** A stored fit without its per-pose arrays: what lists and overlays need. */
export type StoredHeadFitSummary = Omit<StoredHeadFit, "poses">;
export type AnalysisSummaryRow = Omit<Analysis, "result"> & { result: StoredHeadFitSummary };

/**
 * Analyses with their dataset's file name and phase and their author's name, without the per-pose
 * arrays, which grow with the dataset (about 150 bytes a pose) and are read for the fit shown only
 * (withPoses). No access check: the caller filters (and checks) and sorts.
 */
export function selectAnalysisSummaries() {
  const { result: _result, ...columns } = getTableColumns(analyses);
  return selectAnalyses({
    analysis: { ...columns, result: sql<StoredHeadFitSummary>`${analyses.result} - 'poses'` },
    datasetFilename: datasets.originalFilename,
    datasetPhase: datasets.phase,
  });
}

/** Newest first, ties by id: the order analyses are listed in. */
export const newestAnalysesFirst = [desc(analyses.createdAt), desc(analyses.id)];

/** Analyses of a job, newest first (see selectAnalysisSummaries); null when the job is not visible. */
export async function listJobAnalyses(actor: Actor, jobId: string) {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  const rows = await selectAnalysisSummaries()
    .where(eq(analyses.jobId, jobId))
    .orderBy(...newestAnalysesFirst);
  return rows.map((r) => ({ ...r, analysis: r.analysis as AnalysisSummaryRow }));
}
export type AnalysisListRow = NonNullable<Awaited<ReturnType<typeof listJobAnalyses>>>[number];

/** A row of listJobAnalyses with its per-pose arrays read back (the row came through the job's access check). */
export async function withPoses<R extends AnalysisListRow>(row: R): Promise<R & { analysis: AnalysisRow }> {
  const [p] = await db
    .select({ poses: sql<HeadFitPoses>`${analyses.result} -> 'poses'` })
    .from(analyses)
    .where(eq(analyses.id, row.analysis.id));
  if (!p) throw notFound("analysis");
  return { ...row, analysis: { ...row.analysis, result: { ...row.analysis.result, poses: p.poses } } };
}

/** How many visit plans each process keeps (one per fit recently shown; the oldest goes first). */
const MAX_CACHED_PLANS = 64;
const plans = new Map<string, NextVisitPlan>();

/**
 * The coverage and pose-planner advice of a stored fit for the head configuration shown: the
 * planner's work grows with the poses (about 0.1–0.3 s at 100 000), and a stored analysis never
 * changes (no query updates or deletes one), so each process computes it once per fit and
 * configuration and then reuses the same result.
 */
export function visitPlanOf(a: Pick<AnalysisRow, "id" | "result">, config: HeadConfig): NextVisitPlan {
  const key = `${a.id}\n${canonicalJson(config)}`;
  const hit = plans.get(key);
  if (hit) return hit;
  const p = a.result.poses;
  const plan = nextVisitPlan(config, p.primary_deg, p.secondary_deg, p.tool_mm);
  if (plans.size >= MAX_CACHED_PLANS) plans.delete(plans.keys().next().value!);
  plans.set(key, plan);
  return plan;
}

/**
 * The approved parameter set of a job: the analysis named by the latest "analysis.approved" audit
 * event (the approval lives in the hash-chained trail with the status change; no column records it).
 * One indexed read of that event with its actor's name, not the job's whole trail.
 */
export async function getApprovedAnalysis(actor: Actor, jobId: string) {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  const [last] = await db
    .select({
      entityId: auditEvents.entityId,
      at: auditEvents.at,
      actorEmail: auditEvents.actorEmail,
      actorName: users.name,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(and(eq(auditEvents.jobId, jobId), eq(auditEvents.action, "analysis.approved")))
    .orderBy(desc(auditEvents.id))
    .limit(1);
  if (!last) return null;
  const a = await getAnalysis(actor, last.entityId);
  if (!a) return null;
  return { detail: a, approvedAt: last.at, approvedBy: last.actorName ?? last.actorEmail };
}

function nonConformingOf(
  fit: Parameters<typeof parameterRows>[0],
  limits: Parameters<typeof parameterRows>[1],
) {
  return parameterRows(fit, limits)
    .filter((p) => p.decision === "fail" || p.decision === "undecided")
    .map((p) => ({ key: p.key, decision: p.decision }));
}

/** The fitted parameters judged FAIL or undecided against the job's limits: what approval must confirm. */
export async function nonConformingParameters(actor: Actor, analysisId: string) {
  const a = await getAnalysis(actor, analysisId);
  if (!a) throw notFound("analysis");
  const job = (await visibleJob(actor, a.job.id)).job;
  return nonConformingOf(a.analysis.result.fit, await parameterLimitsOfTemplate(job.templateId));
}

/**
 * An engineer approves a stored fit as the job's parameter set, and the approval is a signature
 * (meaning "parameters approved", 21 CFR 11.50 and 11.200: the password is entered again). The
 * job moves in review → approved (lib/policy/analyses.fitApprovalRefusal); the signature, the
 * approval and the status change are written and audited in one transaction. The signature's
 * manifest names the analysis (its input SHA-256 and computation version) and the parameters
 * judged FAIL or undecided that the engineer confirmed. 404 when not visible; 403 for any other
 * role (or when the same person signed the work as performed and the company does not allow
 * it); 409 when the job is not in review; 422 naming the field `acknowledged` when a FAIL or
 * undecided parameter was not confirmed; a wrong password is refused for its field.
 */
export async function approveAnalysis(
  actor: Actor,
  analysisId: string,
  password: string,
  /** The keys of the FAIL or undecided parameters the engineer confirmed having read. */
  acknowledged: readonly string[] = [],
) {
  const a = await getAnalysis(actor, analysisId);
  if (!a) throw notFound("analysis");
  const who = fitApproverRefusal(actor);
  if (who) throw forbidden(who);
  const status = a.job.status;
  const refusal = fitApprovalRefusal(actor, { status });
  if (refusal) throw new AppError(409, "not_in_review", refusal);
  await refuseSameSigner(actor, a.job.id, "parameters_approved");
  const job = (await visibleJob(actor, a.job.id)).job;
  const fit = a.analysis.result.fit;
  const nonConforming = nonConformingOf(fit, await parameterLimitsOfTemplate(job.templateId));
  const unconfirmed = nonConforming.filter((p) => !acknowledged.includes(p.key));
  if (unconfirmed.length > 0)
    throw invalid("Confirm that you have read the parameters that do not conform before signing.", [
      {
        field: "acknowledged",
        message: `Not confirmed: ${unconfirmed.map((p) => `${p.key} (${p.decision})`).join(", ")}.`,
      },
    ]);
  await requirePasswordReentry(actor, password);
  const signedAt = new Date();
  const manifest = {
    ...manifestFor(
      actor,
      "parameters_approved",
      job,
      { stateSha256: await jobStateSha256(job.id) },
      signedAt,
    ),
    analysis: {
      id: a.analysis.id,
      inputSha256: a.analysis.inputSha256,
      geometryVersion: a.analysis.geometryVersion,
      nonConforming,
    },
  };
  const signature = signManifest(manifest, getSigningKey());
  return db.transaction(async (tx) => {
    const locked = await lockJob(tx, a.job.id);
    if (locked?.status !== status)
      throw new AppError(409, "conflict", "The job changed meanwhile; open it again.");
    await tx.update(jobs).set({ status: "approved", updatedAt: new Date() }).where(eq(jobs.id, a.job.id));
    const [sig] = await tx
      .insert(signatures)
      .values({
        jobId: job.id,
        meaning: "parameters_approved",
        signerId: actor.id,
        signerName: actor.name,
        signerRole: actor.role,
        signedAt,
        comment: null,
        manifest,
        signature,
        keyId: manifest.keyId,
      })
      .returning({ id: signatures.id });
    await appendAudit(tx, actor, {
      action: "signature.parameters_approved",
      entity: { type: "signature", id: sig!.id },
      jobId: job.id,
      newValues: {
        meaning: "parameters_approved",
        signedAtUtc: manifest.signedAtUtc,
        analysisId: a.analysis.id,
      },
    });
    await appendAudit(tx, actor, {
      action: "analysis.approved",
      entity: { type: "analysis", id: a.analysis.id },
      jobId: a.job.id,
      newValues: {
        inputSha256: a.analysis.inputSha256,
        geometryVersion: a.analysis.geometryVersion,
        parameters: Object.fromEntries(fit.parameters.map((p) => [p.key, p.value])),
        nonConforming,
        signatureId: sig!.id,
      },
    });
    await appendAudit(
      tx,
      actor,
      jobEvent(a.job.id, "job.status_changed", {
        oldValues: { status },
        newValues: { status: "approved", analysisId: a.analysis.id },
      }),
    );
    return { status: "approved" as const, analysisId: a.analysis.id, signatureId: sig!.id };
  });
}
