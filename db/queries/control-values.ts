/**
 * The control loop of a job: the control's kinematic values as found and as left, and the values
 * to enter computed from the approved fit (lib/control-values). Reads and writes check the job's
 * tenant rule (404) and lib/policy/control-values (403 for the person, 409 for the job's state);
 * every record is audited in the transaction that writes it.
 */
import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db";
import { getApprovedAnalysis } from "@/db/queries/analyses";
import { insertJobRecord } from "@/db/queries/audit";
import { lockJob } from "@/db/queries/locks";
import { getJobDetail, visibleJob } from "@/db/queries/jobs";
import { controlValueRecords, datasets, procedureTemplates, users } from "@/db/schema";
import { controlLoop, toControlCanonical, type ControlUnitSystem } from "@/lib/control-values";
import {
  CONTROL_VALUE_DEFS,
  type ControlValueSet,
  type ControlValueStage,
} from "@/lib/domain/control-values";
import type { JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";
import { AppError, forbidden, notFound } from "@/lib/errors";
import {
  controlValuesReadRefusal,
  controlValuesRecorderRefusal,
  controlValuesWriteRefusal,
} from "@/lib/policy/control-values";
import { controlValuesSection } from "@/lib/report/sections/control";
import { judgeTcpCheck, type TcpCheckSummary, type TcpLimits } from "@/lib/tcp-check-display";
import type { ControlValuesRecordInput } from "@/lib/validations/control-values";

export interface ControlRecordMeta {
  id: string;
  unitSystem: ControlUnitSystem;
  values: ControlValueSet;
  analysisId: string | null;
  note: string | null;
  recordedBy: string | null;
  createdAt: Date;
}

/** The newest record of each stage for a job (no access check: callers have checked the job). */
export async function latestControlRecords(
  jobId: string,
): Promise<Record<ControlValueStage, ControlRecordMeta | null>> {
  const rows = await db
    .select({
      id: controlValueRecords.id,
      stage: controlValueRecords.stage,
      unitSystem: controlValueRecords.unitSystem,
      values: controlValueRecords.values,
      analysisId: controlValueRecords.analysisId,
      note: controlValueRecords.note,
      recordedBy: users.name,
      createdAt: controlValueRecords.createdAt,
    })
    .from(controlValueRecords)
    .leftJoin(users, eq(users.id, controlValueRecords.recordedById))
    .where(eq(controlValueRecords.jobId, jobId))
    .orderBy(desc(controlValueRecords.createdAt), desc(controlValueRecords.id));
  const pick = (stage: ControlValueStage) => {
    const r = rows.find((x) => x.stage === stage);
    if (!r) return null;
    const { stage: _s, ...meta } = r;
    return meta;
  };
  return { as_found: pick("as_found"), as_left: pick("as_left") };
}

/**
 * The job's control loop for staff: the records, the approved fit they are computed from and the
 * rows to show; null when the job is not visible (404), 403 for a customer.
 */
export async function getControlValues(actor: Actor, jobId: string) {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  const refusal = controlValuesReadRefusal(actor);
  if (refusal) throw forbidden(refusal);
  return controlValuesOfJob(actor, jobId, d.job.status);
}

/** The same without the read rule, for the report (whose own rules decide who reads it). */
export async function controlValuesOfJob(actor: Actor, jobId: string, status: JobStatus) {
  const [records, approved] = await Promise.all([
    latestControlRecords(jobId),
    getApprovedAnalysis(actor, jobId),
  ]);
  const unitSystem: ControlUnitSystem =
    records.as_found?.unitSystem ?? records.as_left?.unitSystem ?? "metric";
  const loop = controlLoop({
    asFound: records.as_found?.values ?? null,
    asLeft: records.as_left?.values ?? null,
    approvedFit: approved?.detail.analysis.result.fit ?? null,
    unitSystem,
  });
  return {
    jobId,
    status,
    asFound: records.as_found,
    asLeft: records.as_left,
    approved: approved
      ? {
          analysisId: approved.detail.analysis.id,
          approvedAt: approved.approvedAt,
          approvedBy: approved.approvedBy,
        }
      : null,
    /** The as-left record was made against another approval than the current one. */
    asLeftStale:
      records.as_left !== null &&
      approved !== null &&
      records.as_left.analysisId !== approved.detail.analysis.id,
    loop,
  };
}
export type JobControlValues = NonNullable<Awaited<ReturnType<typeof getControlValues>>>;

/**
 * Records one stage's values as the engineer typed them (control units → mm and degrees). The job
 * row is locked so a concurrent issue or approval cannot slip between the check and the write.
 */
export async function recordControlValues(actor: Actor, jobId: string, input: ControlValuesRecordInput) {
  await visibleJob(actor, jobId);
  const who = controlValuesRecorderRefusal(actor);
  if (who) throw forbidden(who);
  const approved = await getApprovedAnalysis(actor, jobId);
  const values: ControlValueSet = {};
  for (const def of CONTROL_VALUE_DEFS) {
    const v = input.values[def.key];
    if (v !== undefined) values[def.key] = toControlCanonical(v, def.kind, input.unitSystem);
  }
  return db.transaction(async (tx) => {
    const locked = await lockJob(tx, jobId);
    if (!locked) throw notFound("job");
    const refusal = controlValuesWriteRefusal(actor, {
      status: locked.status,
      stage: input.stage,
      hasApprovedFit: approved !== null,
    });
    if (refusal) throw new AppError(409, "fixed", refusal);
    const [previous] = await tx
      .select({ id: controlValueRecords.id, values: controlValueRecords.values })
      .from(controlValueRecords)
      .where(and(eq(controlValueRecords.jobId, jobId), eq(controlValueRecords.stage, input.stage)))
      .orderBy(desc(controlValueRecords.createdAt), desc(controlValueRecords.id))
      .limit(1);
    const analysisId = input.stage === "as_left" ? approved!.detail.analysis.id : null;
    return insertJobRecord(
      tx,
      actor,
      controlValueRecords,
      {
        jobId,
        stage: input.stage,
        unitSystem: input.unitSystem,
        values,
        analysisId,
        note: input.note ?? null,
        recordedById: actor.id,
      },
      {
        action: `control_values.${input.stage}_recorded`,
        entityType: "control_values",
        oldValues: previous ? { recordId: previous.id, values: previous.values } : null,
        newValues: (r) => ({
          stage: input.stage,
          unitSystem: input.unitSystem,
          values,
          analysisId,
          note: r.note,
        }),
      },
    );
  });
}

/** The API's JSON of a job's control loop: canonical numbers (mm, degrees) with the display texts. */
export function controlValuesJson(c: JobControlValues) {
  return {
    jobId: c.jobId,
    unitSystem: c.loop.unitSystem,
    units: { length: "mm", angle: "deg" },
    approved: c.approved,
    asFound: c.asFound,
    asLeft: c.asLeft,
    asLeftStale: c.asLeftStale,
    rows: c.loop.rows,
    flagged: c.loop.flagged.map((r) => ({ key: r.key, flag: r.flag, difference: r.difference })),
  };
}

/** The report's control-values section for a job whose access the report's query has checked. */
export async function reportControlValues(
  actor: Actor,
  job: { id: string; status: JobStatus; templateId: string | null },
) {
  const [c, tcp] = await Promise.all([
    controlValuesOfJob(actor, job.id, job.status),
    jobTcpChecks(job.id, job.templateId),
  ]);
  return controlValuesSection({
    tcp: tcp.checks[0] ?? null,
    tcpLimitSource: tcp.source,
    loop: c.loop,
    asFound: c.asFound,
    asLeft: c.asLeft,
    approved: c.approved,
    asLeftStale: c.asLeftStale,
  });
}

/**
 * The job's tool-centre-point checks, newest first, each judged against its procedure's limits
 * (no access check: callers have checked the job).
 */
export async function jobTcpChecks(jobId: string, templateId: string | null) {
  const [template] = templateId
    ? await db
        .select({
          required: procedureTemplates.tcpCheckRequired,
          rangeLimitUm: procedureTemplates.tcpRangeLimitUm,
          deviationLimitUm: procedureTemplates.tcpDeviationLimitUm,
          source: procedureTemplates.tcpLimitSource,
          note: procedureTemplates.tcpLimitSourceNote,
        })
        .from(procedureTemplates)
        .where(eq(procedureTemplates.id, templateId))
    : [];
  const limits: TcpLimits = template
    ? {
        required: template.required,
        rangeLimitUm: template.rangeLimitUm,
        deviationLimitUm: template.deviationLimitUm,
      }
    : { required: false, rangeLimitUm: null, deviationLimitUm: null };
  const source = template ? { source: template.source, note: template.note } : null;
  const rows = await db
    .select({
      id: datasets.id,
      filename: datasets.originalFilename,
      phase: datasets.phase,
      uploadedAt: datasets.uploadedAt,
      summary: datasets.summary,
    })
    .from(datasets)
    .where(and(eq(datasets.jobId, jobId), eq(datasets.kind, "tcp_check"), eq(datasets.status, "stored")))
    .orderBy(desc(datasets.uploadedAt), desc(datasets.id));
  const checks = rows.map((r) => ({
    datasetId: r.id,
    filename: r.filename,
    phase: r.phase,
    uploadedAt: r.uploadedAt,
    view: judgeTcpCheck((r.summary as { tcp: TcpCheckSummary }).tcp, limits),
  }));
  return { limits, source, checks };
}
export type JobTcpChecks = Awaited<ReturnType<typeof jobTcpChecks>>;
