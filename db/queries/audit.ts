import "server-only";
import { createHash } from "node:crypto";
import { asc, desc, eq, sql } from "drizzle-orm";
import type { NodePgDatabase } from "drizzle-orm/node-postgres";
import {
  analysisBudgetInputs,
  auditEvents,
  controlValueRecords,
  deviations,
  environmentRecords,
  jobInstruments,
  photos,
  signatures,
} from "@/db/schema";
import type * as schema from "@/db/schema";
import { canonicalJson } from "@/lib/canonical-json";

type Executor = NodePgDatabase<typeof schema>;

export const AUDIT_GENESIS = "0".repeat(64);
const AUDIT_CHAIN_LOCK = 724_002;

/** One event as stored and hashed: who, what, on which entity, in which job, and the values. */
export interface AuditInput {
  actorId: string | null;
  actorEmail: string | null;
  action: string;
  entityType: string;
  entityId: string;
  jobId?: string | null;
  oldValues?: unknown;
  newValues?: unknown;
}

/** Who made a change: a signed-in user, or null for the system (first setup, a reset request). */
export type AuditActor = { id: string | null; email: string | null } | null;

/** What a caller says about a change; the actor is passed beside it. */
export interface AuditEvent {
  action: string;
  entity: { type: string; id: string };
  jobId?: string | null;
  oldValues?: unknown;
  newValues?: unknown;
}

/**
 * An event about the job itself (created, changed, moved to another status): the job is both the
 * entity and the job the event belongs to.
 */
export function jobEvent(
  jobId: string,
  action: string,
  values: Pick<AuditEvent, "oldValues" | "newValues">,
): AuditEvent {
  return { action, entity: { type: "job", id: jobId }, jobId, ...values };
}

function auditRow(actor: AuditActor, { entity, ...event }: AuditEvent): AuditInput {
  const by = { actorId: actor?.id ?? null, actorEmail: actor?.email ?? null };
  return { ...by, entityType: entity.type, entityId: entity.id, ...event };
}

/** What an event records, as stored and hashed: a missing job or old/new value is null. */
function auditContent(e: AuditInput) {
  return {
    actorId: e.actorId,
    actorEmail: e.actorEmail,
    action: e.action,
    entityType: e.entityType,
    entityId: e.entityId,
    jobId: e.jobId ?? null,
    oldValues: e.oldValues ?? null,
    newValues: e.newValues ?? null,
  };
}

/** hash = SHA-256(prev_hash ‖ canonical JSON of the event's content), hex. */
export function auditHash(prevHash: string, e: AuditInput & { at: Date }): string {
  const content = canonicalJson({ at: e.at.toISOString(), ...auditContent(e) });
  return createHash("sha256").update(prevHash).update("\n").update(content).digest("hex");
}

/**
 * Appends one event to the chain. Call inside the transaction that makes the change, so the
 * change and its record commit together; the advisory lock orders concurrent writers. Callers
 * pass the actor and the event; the stored row itself is also accepted as it is.
 */
export async function appendAudit(tx: Executor, actor: AuditActor, event: AuditEvent): Promise<void>;
export async function appendAudit(tx: Executor, row: AuditInput): Promise<void>;
export async function appendAudit(
  tx: Executor,
  actorOrRow: AuditActor | AuditInput,
  event?: AuditEvent,
): Promise<void> {
  const input = event ? auditRow(actorOrRow as AuditActor, event) : (actorOrRow as AuditInput);
  await tx.execute(sql`select pg_advisory_xact_lock(${AUDIT_CHAIN_LOCK})`);
  const [last] = await tx
    .select({ hash: auditEvents.hash })
    .from(auditEvents)
    .orderBy(desc(auditEvents.id))
    .limit(1);
  const prevHash = last?.hash ?? AUDIT_GENESIS;
  // Millisecond precision, so the stored timestamp hashes the same when read back.
  const at = new Date(Math.floor(Date.now()));
  const hash = auditHash(prevHash, { ...input, at });
  await tx.insert(auditEvents).values({ at, ...auditContent(input), prevHash, hash });
}

/** The audited tables of records added to a job: each row has its own id and its job's id. */
type JobRecordTable =
  | typeof analysisBudgetInputs
  | typeof controlValueRecords
  | typeof deviations
  | typeof environmentRecords
  | typeof jobInstruments
  | typeof photos
  | typeof signatures;

/** What the event announcing a new record of a job says, besides the record and its job. */
export interface JobRecordEvent<Row> {
  action: string;
  entityType: string;
  oldValues?: unknown;
  newValues: (row: Row) => unknown;
}

/**
 * Adds one record to a job and appends the event that announces it, in the caller's transaction
 * so that both commit together: the new row is the event's entity and its job the event's job.
 * Returns the row.
 */
export async function insertJobRecord<T extends JobRecordTable>(
  tx: Executor,
  actor: AuditActor,
  table: T,
  values: T["$inferInsert"],
  event: JobRecordEvent<T["$inferSelect"]>,
): Promise<T["$inferSelect"]> {
  const t = table as typeof photos;
  const [row] = (await tx
    .insert(t)
    .values(values as typeof photos.$inferInsert)
    .returning()) as T["$inferSelect"][];
  await appendAudit(tx, actor, {
    action: event.action,
    entity: { type: event.entityType, id: row!.id },
    jobId: row!.jobId,
    oldValues: event.oldValues,
    newValues: event.newValues(row!),
  });
  return row!;
}

/** Checks the whole chain; returns the id of the first event whose link is broken, or null. */
export async function verifyAuditChain(
  tx: Executor,
): Promise<{ checked: number; firstBrokenId: number | null }> {
  const rows = await tx.select().from(auditEvents).orderBy(asc(auditEvents.id));
  let prev = AUDIT_GENESIS;
  for (const r of rows) {
    const expected = auditHash(prev, r);
    if (r.prevHash !== prev || r.hash !== expected) return { checked: rows.length, firstBrokenId: r.id };
    prev = r.hash;
  }
  return { checked: rows.length, firstBrokenId: null };
}

export async function listJobAudit(tx: Executor, jobId: string) {
  return tx.select().from(auditEvents).where(eq(auditEvents.jobId, jobId)).orderBy(asc(auditEvents.id));
}
