import "server-only";
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { activeHostMachine } from "@/db/queries/registers-admin";
import { newestAnalysesFirst, selectAnalysisSummaries } from "@/db/queries/analyses";
import { jobAccessCondition } from "@/db/queries/jobs";
import { analyses, auditEvents, customers, heads, jobs, machines, sites } from "@/db/schema";
import type { HeadHistoryJob } from "@/lib/domain/heads";
import { type Actor } from "@/lib/domain/roles";
import { headHistoryRefusal, headHistoryScope } from "@/lib/policy/heads";
import { registerEditRefusal, registerReadRefusal } from "@/lib/policy/registers";
import { forbidden, notFound } from "@/lib/errors";
import { isUuid } from "@/lib/domain/uuid";

/** One head with where it is mounted now and its mounting history (from the audit trail). */
export async function getHeadWithHistory(actor: Actor, headId: string) {
  const refusal = registerReadRefusal(actor, "heads");
  if (refusal) throw forbidden(refusal);
  if (!isUuid(headId)) return null;
  const [row] = await db
    .select({ head: heads, machineName: machines.name, siteName: sites.name, customerName: customers.name })
    .from(heads)
    .leftJoin(machines, eq(machines.id, heads.machineId))
    .leftJoin(sites, eq(sites.id, machines.siteId))
    .leftJoin(customers, eq(customers.id, sites.customerId))
    .where(eq(heads.id, headId));
  if (!row) return null;
  const history = await db
    .select()
    .from(auditEvents)
    .where(and(eq(auditEvents.entityType, "head"), eq(auditEvents.entityId, headId)))
    .orderBy(asc(auditEvents.id));
  return { ...row, history };
}

/** Mounts the head on a machine (or takes it off with null); audited so the history can be read back. */
export async function mountHead(actor: Actor, headId: string, machineId: string | null) {
  const refusal = registerEditRefusal(actor, "heads");
  if (refusal) throw forbidden(refusal);
  const [h] = await db.select().from(heads).where(eq(heads.id, headId));
  if (!h) throw notFound("head");
  let label = "not mounted";
  if (machineId) {
    const m = await activeHostMachine(machineId);
    label = `${m.machineName} (${m.customerName}, ${m.siteName})`;
  }
  if (h.machineId === machineId) return { changed: false };
  const [old] = h.machineId
    ? await db.select({ name: machines.name }).from(machines).where(eq(machines.id, h.machineId))
    : [];
  await db.transaction(async (tx) => {
    await tx.update(heads).set({ machineId }).where(eq(heads.id, headId));
    await appendAudit(tx, actor, {
      action: machineId ? "head.mounted" : "head.removed",
      entity: { type: "head", id: headId },
      oldValues: { machineId: h.machineId, machine: old?.name ?? null },
      newValues: { machineId, machine: label },
    });
  });
  return { changed: true };
}

export type { HeadHistoryJob };

/**
 * The fitted parameters of every job on a head, oldest first: for each job its approved fit (the
 * analysis named by its latest "analysis.approved" audit event) or, if none is approved, its
 * latest fit. Which jobs, by lib/policy/heads.ts `headHistoryScope`: the administrator and
 * engineers see every job on any head; installers and inspectors every job on a head that one of
 * the jobs they may see is on (404 otherwise, as for a head that does not exist); a customer only
 * their own company's jobs on it (404 when there is none).
 */
export async function getHeadFitHistory(actor: Actor, headId: string) {
  const refusal = headHistoryRefusal(actor);
  if (refusal) throw forbidden(refusal);
  const scope = headHistoryScope(actor);
  if (!isUuid(headId)) return null;
  const [head] = await db.select().from(heads).where(eq(heads.id, headId));
  if (!head) return null;
  const jobColumns = {
    id: jobs.id,
    reference: jobs.reference,
    title: jobs.title,
    kind: jobs.kind,
    status: jobs.status,
    scheduledFor: jobs.scheduledFor,
    createdAt: jobs.createdAt,
  };
  const visible = await db
    .select(jobColumns)
    .from(jobs)
    .where(and(eq(jobs.headId, headId), jobAccessCondition(actor)));
  if (scope !== "all" && visible.length === 0) return null;
  const jobRows =
    scope === "own" ? visible : await db.select(jobColumns).from(jobs).where(eq(jobs.headId, headId));
  const ids = jobRows.map((j) => j.id);
  const [fits, approvals] = ids.length
    ? await Promise.all([
        selectAnalysisSummaries()
          .where(inArray(analyses.jobId, ids))
          .orderBy(...newestAnalysesFirst),
        db
          .select({ jobId: auditEvents.jobId, analysisId: auditEvents.entityId })
          .from(auditEvents)
          .where(and(inArray(auditEvents.jobId, ids), eq(auditEvents.action, "analysis.approved")))
          .orderBy(desc(auditEvents.id)),
      ])
    : [[], []];
  const approvedOf = new Map<string, string>();
  for (const a of approvals) if (a.jobId && !approvedOf.has(a.jobId)) approvedOf.set(a.jobId, a.analysisId);
  const history: HeadHistoryJob[] = jobRows
    .map((j) => {
      const approvedId = approvedOf.get(j.id);
      const own = fits.filter((f) => f.analysis.jobId === j.id);
      const f = (approvedId ? own.find((x) => x.analysis.id === approvedId) : undefined) ?? own[0];
      return {
        id: j.id,
        reference: j.reference,
        title: j.title,
        kind: j.kind,
        status: j.status,
        date: j.scheduledFor ?? j.createdAt,
        open: scope === "all" || visible.some((v) => v.id === j.id),
        fit: f
          ? {
              analysisId: f.analysis.id,
              approved: f.analysis.id === approvedId,
              createdAt: f.analysis.createdAt,
              datasetFilename: f.datasetFilename,
              phase: f.datasetPhase,
              geometryVersion: f.analysis.geometryVersion,
              fit: f.analysis.result.fit,
            }
          : null,
      };
    })
    .sort((a, b) => a.date.getTime() - b.date.getTime() || a.reference.localeCompare(b.reference));
  return { head, jobs: history };
}
export type HeadFitHistory = NonNullable<Awaited<ReturnType<typeof getHeadFitHistory>>>;

/** The API's JSON of a head's history: identification and per job the fitted parameters (geometry's JSON). */
export function headHistoryJson(h: HeadFitHistory) {
  const { head } = h;
  return {
    head: {
      id: head.id,
      serial: head.serial,
      maker: head.maker,
      model: head.model,
      primaryAxis: head.primaryAxis,
      secondaryAxis: head.secondaryAxis,
      nominalPivotLengthMm: head.nominalPivotLengthMm,
    },
    jobs: h.jobs.map((j) => ({
      id: j.id,
      reference: j.reference,
      title: j.title,
      kind: j.kind,
      status: j.status,
      date: j.date,
      fit: j.fit
        ? {
            analysisId: j.fit.analysisId,
            approved: j.fit.approved,
            createdAt: j.fit.createdAt,
            datasetFilename: j.fit.datasetFilename,
            phase: j.fit.phase,
            geometryVersion: j.fit.geometryVersion,
            rms_um: j.fit.fit.rms_um,
            parameters: j.fit.fit.parameters.map((p) => ({
              key: p.key,
              iso: p.iso,
              value: p.value,
              U: p.U,
              unit: p.unit,
              identifiable: p.identifiable,
            })),
          }
        : null,
    })),
  };
}
