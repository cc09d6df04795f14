import "server-only";
import { and, asc, eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { insertJobRecord } from "@/db/queries/audit";
import { getApprovedAnalysis, listJobAnalyses } from "@/db/queries/analyses";
import { getTestPartEvaluation, listDatasets } from "@/db/queries/datasets";
import { getIssuer } from "@/db/queries/issuer";
import { jobTcpChecks } from "@/db/queries/control-values";
import { jobRotaryPositioning, positioningJobOf } from "@/db/queries/positioning";
import { getJobDetail, type JobDetail, visibleJob } from "@/db/queries/jobs";
import { parameterLimitsOfTemplate } from "@/db/queries/parameter-limits";
import { getComparison, instrumentsInReadings } from "@/db/queries/readings";
import { jobStateSha256, preIssueSignatures } from "@/db/queries/signatures";
import { deviations, photos } from "@/db/schema";
import { needsInstrument } from "@/lib/step-kinds";
import type { Actor } from "@/lib/domain/roles";
import { forbidden, invalid, notFound } from "@/lib/errors";
import { parameterRows } from "@/lib/fit-display";
import { issuerDetailsMissing } from "@/lib/policy/issuer";
import { deviationRefusal } from "@/lib/policy/reports";
import { reportDecision } from "@/lib/report/build";
import {
  carriedCount,
  nonConformingResults,
  parameterSubject,
  readiness,
  testPartSubject,
  type Readiness,
  type ReadinessInput,
} from "@/lib/report/readiness";
import type { SignatureManifest } from "@/lib/report/signing";
import { tcpCheckSubject } from "@/lib/tcp-check-display";
import { HEAD_AXIS_ROLES } from "@/lib/domain/positioning";
import { rotaryPositioningSubject } from "@/lib/rotary-positioning-display";

/**
 * Gathers what the readiness check (lib/report/readiness.ts) judges, and records deviations: a
 * FAIL or undecided result carried into the report with a written justification.
 */

/** The test-part dataset the report shows: the latest after adjustment, else the latest. */
export function countingTestPart<T extends { kind: string; status: string; phase: string }>(
  list: readonly T[],
): T | undefined {
  const parts = list.filter((x) => x.kind === "test_part" && x.status === "stored");
  return parts.find((x) => x.phase === "post") ?? parts[0];
}

export async function readinessInput(actor: Actor, d: JobDetail): Promise<ReadinessInput> {
  const jobId = d.job.id;
  const [comparison, used, list, analysesList, limits, approved, sigs, state, carried, photoRows, issuer] =
    await Promise.all([
      getComparison(actor, jobId),
      instrumentsInReadings(jobId),
      listDatasets(actor, jobId),
      listJobAnalyses(actor, jobId),
      parameterLimitsOfTemplate(d.job.templateId),
      getApprovedAnalysis(actor, jobId),
      preIssueSignatures(jobId),
      jobStateSha256(jobId),
      db.select({ subject: deviations.subject }).from(deviations).where(eq(deviations.jobId, jobId)),
      db
        .select({ stepId: photos.stepId, n: sql<number>`count(*)::int` })
        .from(photos)
        .where(eq(photos.jobId, jobId))
        .groupBy(photos.stepId),
      getIssuer(),
    ]);
  const photoCounts = new Map(photoRows.map((p) => [p.stepId, p.n]));
  const [tcp, positioning] = await Promise.all([
    jobTcpChecks(jobId, d.job.templateId),
    jobRotaryPositioning(positioningJobOf(d)),
  ]);
  const latestTcp = tcp.checks[0];
  const stored = (list ?? []).filter((x) => x.status === "stored");
  const fitted = new Set((analysesList ?? []).map((a) => a.analysis.datasetId));
  const testPart = countingTestPart(stored);
  const evaluations = new Map(
    await Promise.all(
      stored
        .filter((x) => x.kind === "test_part")
        .map(async (x) => [x.id, (await getTestPartEvaluation(actor, x.id))?.evaluation ?? null] as const),
    ),
  );
  const approvedDataset = approved
    ? (list ?? []).find((x) => x.id === approved.detail.analysis.datasetId)
    : undefined;
  const results: ReadinessInput["results"] = [
    ...(approved
      ? parameterRows(approved.detail.analysis.result.fit, limits).map((p) => ({
          subject: parameterSubject(p.key),
          label: `Head parameter ${p.iso} (${p.words})`,
          decision: reportDecision(p.decision),
        }))
      : []),
    ...(testPart
      ? (evaluations.get(testPart.id)?.rows ?? []).map((r, i) => ({
          subject: testPartSubject(testPart.id, i),
          label: `Test part ${r.feature}, ${r.characteristic}`,
          decision: r.decision,
        }))
      : []),
    ...(latestTcp
      ? [
          {
            subject: tcpCheckSubject(latestTcp.datasetId),
            label: `Tool-centre-point check ${latestTcp.filename}`,
            decision: latestTcp.view.decision,
          },
        ]
      : []),
    ...Object.values(positioning.latest).map((t) => ({
      subject: rotaryPositioningSubject(t.datasetId),
      label: `Positioning of the ${t.view.axisText} ${t.filename}`,
      decision: t.view.decision,
    })),
  ];
  const step = (r: { decision: Parameters<typeof reportDecision>[0]; instrument: string | null } | null) =>
    r ? { decision: reportDecision(r.decision), instrumentSerial: r.instrument } : null;
  return {
    jobId,
    steps: (comparison?.rows ?? []).map((r) => ({
      id: r.stepId,
      position: r.position,
      title: r.title,
      pre: step(r.pre),
      post: step(r.post),
      needsInstrument: needsInstrument(r.derivation),
      photoRequired: r.photoRequired,
      photoCount: photoCounts.get(r.stepId) ?? 0,
    })),
    instruments: used,
    datasets: stored.map((x) => ({
      id: x.id,
      kind: x.kind,
      phase: x.phase,
      filename: x.originalFilename,
      evaluated: x.kind === "test_part" ? Boolean(evaluations.get(x.id)) : fitted.has(x.id),
    })),
    requiresFit: limits.length > 0,
    approvedFit: approved
      ? {
          datasetId: approved.detail.analysis.datasetId,
          phase: approvedDataset?.phase ?? "pre",
          datasetStored: approvedDataset?.status === "stored",
        }
      : null,
    results,
    issuerMissing: issuerDetailsMissing(issuer),
    signatures: sigs.flatMap((s) =>
      s.meaning === "performed" || s.meaning === "inspected"
        ? [
            {
              meaning: s.meaning,
              signerName: s.signerName,
              stateSha256: (s.manifest as SignatureManifest).stateSha256,
            },
          ]
        : [],
    ),
    currentStateSha256: state,
    deviationSubjects: carried.map((c) => c.subject),
    tcpCheck: {
      required: tcp.limits.required,
      latest: latestTcp ? { datasetId: latestTcp.datasetId, filename: latestTcp.filename } : null,
    },
    rotaryPositioning: {
      required: positioning.required,
      present: HEAD_AXIS_ROLES.filter((a) => positioning.latest[a]),
    },
  };
}

/** The job's readiness for issue; null when the actor may not see the job. */
export async function getReadiness(actor: Actor, jobId: string): Promise<Readiness | null> {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  return readiness(await readinessInput(actor, d));
}

/**
 * What the Report tab shows before issue: the blockers, the job's FAIL and undecided results each
 * with the deviation recorded for it (if any), and which pre-issue signatures are stale.
 */
export async function getReadinessView(actor: Actor, jobId: string) {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  const [input, carried, sigs] = await Promise.all([
    readinessInput(actor, d),
    listDeviations(jobId),
    preIssueSignatures(jobId),
  ]);
  return {
    readiness: readiness(input),
    nonConforming: nonConformingResults(input).map((r) => ({
      ...r,
      deviation: carried.find((c) => c.subject === r.subject) ?? null,
    })),
    deviations: carried,
    staleSignatureIds: sigs
      .filter((s) => (s.manifest as SignatureManifest).stateSha256 !== input.currentStateSha256)
      .map((s) => s.id),
  };
}

/**
 * How many of the job's FAIL or undecided results are carried by a deviation recorded for that
 * same result: what the statement of conformity counts (a deviation left over from a result that
 * has since been measured again, or recorded for another result, carries nothing).
 */
export async function carriedResultCount(actor: Actor, d: JobDetail): Promise<number> {
  const [input, carried] = await Promise.all([readinessInput(actor, d), listDeviations(d.job.id)]);
  return carriedCount(
    nonConformingResults(input),
    carried.map((c) => c.subject),
  );
}

/** Deviations recorded on a job, oldest first (the job's access is the caller's to check). */
export async function listDeviations(jobId: string) {
  return db.select().from(deviations).where(eq(deviations.jobId, jobId)).orderBy(asc(deviations.createdAt));
}

/**
 * An application engineer carries a FAIL or undecided result into the report as a deviation, with
 * a written justification. Only a result the job currently has as FAIL or undecided can be
 * carried, once; the deviation and its audit event are written together.
 */
export async function recordDeviation(
  actor: Actor,
  input: { jobId: string; subject: string; justification: string },
) {
  const d = await visibleJob(actor, input.jobId);
  const refusal = deviationRefusal(actor, { status: d.job.status });
  if (refusal) throw forbidden(refusal);
  const justification = input.justification.trim();
  if (justification.length < 10)
    throw invalid("Write why the result may be carried into the report.", [
      { field: "justification", message: "A justification of at least 10 characters is required." },
    ]);
  const result = nonConformingResults(await readinessInput(actor, d)).find(
    (r) => r.subject === input.subject,
  );
  if (!result) throw notFound("FAIL or undecided result");
  return db.transaction(async (tx) => {
    const [existing] = await tx
      .select({ id: deviations.id })
      .from(deviations)
      .where(and(eq(deviations.jobId, d.job.id), eq(deviations.subject, result.subject)));
    if (existing) throw invalid("A deviation is already recorded for this result.");
    return insertJobRecord(
      tx,
      actor,
      deviations,
      {
        jobId: d.job.id,
        subject: result.subject,
        subjectLabel: result.label,
        decision: result.decision,
        justification,
        approvedById: actor.id,
        approvedByName: actor.name,
      },
      {
        action: "deviation.recorded",
        entityType: "deviation",
        newValues: () => ({
          subject: result.subject,
          label: result.label,
          decision: result.decision,
          justification,
        }),
      },
    );
  });
}
