import "server-only";
import { and, asc, count, desc, eq, inArray, isNotNull, isNull, max, sql } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { updateAudited } from "@/db/queries/registers-admin";
import {
  heads,
  jobs,
  procedureTemplates,
  templateParameterLimits,
  templatePositioningLimits,
  templateSteps,
} from "@/db/schema";
import type { JobKind } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";
import { isUuid } from "@/lib/domain/uuid";
import { AppError, forbidden, invalid, notFound } from "@/lib/errors";
import { procedureEditRefusal, procedureRetireRefusal } from "@/lib/policy/procedures";
import { procedureApplies } from "@/lib/policy/jobs";
import { registerReadRefusal } from "@/lib/policy/registers";
import {
  procedureRows,
  procedureSchema,
  procedureVersionSchema,
  versionPlan,
  type ProcedureRows,
  type TcpRows,
} from "@/lib/validations/procedures";

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/** Parse a body with the schema, check the cross-field rules, or throw 422 naming each field. */
function rowsOrThrow(body: unknown, version: boolean): ProcedureRows {
  const parsed = (version ? procedureVersionSchema : procedureSchema).parse(body);
  const out = procedureRows(parsed);
  if (!out.rows)
    throw invalid(
      out.issues.length === 1
        ? out.issues[0]!.message
        : `${out.issues.length} fields need attention; each is named beside it.`,
      out.issues,
    );
  return out.rows;
}

async function insertSteps(tx: Tx, templateId: string, rows: ProcedureRows) {
  await tx.insert(templateSteps).values(rows.steps.map((s) => ({ ...s, templateId })));
}

type LimitTable = typeof templateParameterLimits | typeof templatePositioningLimits;

/**
 * The limits of a version in one limits table (head parameters or rotary-axis positioning): those
 * sent replace what it had; none sent, a version changed in place keeps its own and a new version
 * copies those of `keepFrom`.
 */
async function writeLimits<T extends LimitTable>(
  tx: Tx,
  table: T,
  templateId: string,
  sent: Omit<T["$inferInsert"], "templateId">[] | null,
  keepFrom: string,
) {
  // Both tables key their rows by id and templateId; the cast lets one set of queries serve both.
  const t = table as typeof templateParameterLimits;
  if (templateId === keepFrom) {
    if (sent === null) return;
    await tx.delete(t).where(eq(t.templateId, templateId));
  }
  const limits: object[] =
    sent ??
    (await tx
      .select()
      .from(t)
      .where(eq(t.templateId, keepFrom))
      .then((ls) => ls.map(({ id: _i, templateId: _t, ...l }) => l)));
  if (limits.length) await tx.insert(t).values(limits.map((l) => ({ ...l, templateId }) as never));
}

/** Both limits tables of a version (see writeLimits). */
async function writeAllLimits(tx: Tx, templateId: string, rows: ProcedureRows, keepFrom: string) {
  await writeLimits(tx, templateParameterLimits, templateId, rows.parameterLimits, keepFrom);
  await writeLimits(tx, templatePositioningLimits, templateId, rows.positioningLimits, keepFrom);
}

/** A version's stored limits rows without their ids, for the audit trail. */
async function limitsOf(tx: Tx, templateId: string) {
  const strip = <R extends { id: string; templateId: string }>({ id: _i, templateId: _t, ...l }: R) => l;
  const parameterLimits = await tx
    .select()
    .from(templateParameterLimits)
    .where(eq(templateParameterLimits.templateId, templateId));
  const positioningLimits = await tx
    .select()
    .from(templatePositioningLimits)
    .where(eq(templatePositioningLimits.templateId, templateId))
    .orderBy(asc(templatePositioningLimits.axis), asc(templatePositioningLimits.quantity));
  return { parameterLimits: parameterLimits.map(strip), positioningLimits: positioningLimits.map(strip) };
}

/** The TCP-check columns of a version: those sent, or (none sent) those of `base`. */
function tcpColumns(rows: ProcedureRows, base: TcpRows | null): Partial<TcpRows> {
  const t = rows.tcp ?? base;
  return t
    ? {
        tcpCheckRequired: t.tcpCheckRequired,
        tcpRangeLimitUm: t.tcpRangeLimitUm,
        tcpDeviationLimitUm: t.tcpDeviationLimitUm,
        tcpLimitSource: t.tcpLimitSource,
        tcpLimitSourceNote: t.tcpLimitSourceNote,
      }
    : {};
}

/**
 * The list filter of the API and the builder: a null filter value matches every procedure. Which
 * procedures a new job may follow is the stricter rule procedureApplies (lib/policy/jobs.ts).
 */
function matchesFilter(
  t: { jobKinds: JobKind[] | null; headModel: string | null },
  jobKind: JobKind | null,
  headModel: string | null,
): boolean {
  const kindOk = !jobKind || !t.jobKinds || t.jobKinds.length === 0 || t.jobKinds.includes(jobKind);
  const modelOk =
    !headModel || !t.headModel || t.headModel.trim().toLowerCase() === headModel.trim().toLowerCase();
  return kindOk && modelOk;
}

/**
 * The procedures a new job may follow: the current version of every procedure that is not
 * retired and applies to the job kind and the head model (a procedure for every kind or every
 * model applies too; one written for a model does not apply to a head whose model is not recorded). Procedures written for this head model come first. The caller has checked
 * that the actor may open a job.
 */
export async function proceduresFor(jobKind: JobKind, headModel: string | null) {
  const rows = await db
    .select({
      id: procedureTemplates.id,
      name: procedureTemplates.name,
      version: procedureTemplates.version,
      description: procedureTemplates.description,
      jobKinds: procedureTemplates.jobKinds,
      headModel: procedureTemplates.headModel,
      isCurrent: procedureTemplates.isCurrent,
      retiredAt: procedureTemplates.retiredAt,
    })
    .from(procedureTemplates)
    .where(and(eq(procedureTemplates.isCurrent, true), isNull(procedureTemplates.retiredAt)))
    .orderBy(asc(procedureTemplates.name));
  return rows
    .filter((t) => procedureApplies(t, jobKind, headModel))
    .sort((a, b) => Number(Boolean(b.headModel)) - Number(Boolean(a.headModel)));
}

/**
 * The steps (in order), head-parameter limits and rotary-axis positioning limits of procedure
 * versions, read together; returns a function giving one version's three lists by its id.
 */
export async function templateContents(ids: string[]) {
  const [steps, limits, positioning] = await Promise.all([
    db
      .select()
      .from(templateSteps)
      .where(inArray(templateSteps.templateId, ids))
      .orderBy(asc(templateSteps.position)),
    db.select().from(templateParameterLimits).where(inArray(templateParameterLimits.templateId, ids)),
    db
      .select()
      .from(templatePositioningLimits)
      .where(inArray(templatePositioningLimits.templateId, ids))
      .orderBy(asc(templatePositioningLimits.axis), asc(templatePositioningLimits.quantity)),
  ]);
  return (id: string) => ({
    steps: steps.filter((s) => s.templateId === id),
    parameterLimits: limits.filter((l) => l.templateId === id),
    positioningLimits: positioning.filter((l) => l.templateId === id),
  });
}

/**
 * Every procedure version with its steps, for the staff (the API's list and the builder's list),
 * optionally only those that apply to a job kind and a head model.
 */
export async function listProcedures(
  actor: Actor,
  filter: { jobKind?: JobKind | null; headModel?: string | null } = {},
) {
  const refusal = registerReadRefusal(actor, "procedures");
  if (refusal) throw forbidden(refusal);
  const ts = await db
    .select()
    .from(procedureTemplates)
    .orderBy(asc(procedureTemplates.name), desc(procedureTemplates.version));
  const chosen = ts.filter((t) => matchesFilter(t, filter.jobKind ?? null, filter.headModel ?? null));
  const ids = chosen.map((t) => t.id);
  if (ids.length === 0) return [];
  const [contentsOf, used] = await Promise.all([
    templateContents(ids),
    db
      .select({ templateId: jobs.templateId, n: count() })
      .from(jobs)
      .where(inArray(jobs.templateId, ids))
      .groupBy(jobs.templateId),
  ]);
  return chosen.map((t) => ({
    ...t,
    jobsUsing: used.find((u) => u.templateId === t.id)?.n ?? 0,
    ...contentsOf(t.id),
  }));
}

/** How many jobs follow this version (they keep it whatever happens to the procedure later). */
export async function jobsUsingVersion(id: string): Promise<number> {
  if (!isUuid(id)) return 0;
  const [r] = await db.select({ n: count() }).from(jobs).where(eq(jobs.templateId, id));
  return r?.n ?? 0;
}

/** A new procedure, version 1, with its steps. 409 when the name is taken. Audited. */
export async function createProcedure(actor: Actor, body: unknown) {
  const refusal = procedureEditRefusal(actor, null);
  if (refusal) throw forbidden(refusal);
  const rows = rowsOrThrow(body, false);
  const name = rows.name!;
  return db.transaction(async (tx) => {
    // One writer per name at a time, so two creations cannot both take version 1.
    await tx.execute(sql`select pg_advisory_xact_lock(724015, hashtext(${name}))`);
    const [taken] = await tx
      .select({ id: procedureTemplates.id })
      .from(procedureTemplates)
      .where(eq(procedureTemplates.name, name))
      .limit(1);
    if (taken)
      throw new AppError(
        409,
        "conflict",
        `A procedure named "${name}" exists; save a new version of it instead.`,
        [{ field: "name", message: "This name is taken." }],
      );
    const [t] = await tx
      .insert(procedureTemplates)
      .values({
        name,
        version: 1,
        description: rows.description,
        isCurrent: true,
        jobKinds: rows.jobKinds,
        headModel: rows.headModel,
        ...tcpColumns(rows, null),
        createdById: actor.id,
      })
      .returning();
    await insertSteps(tx, t!.id, rows);
    // A new procedure has nothing to keep: what is not sent is empty.
    await writeAllLimits(
      tx,
      t!.id,
      {
        ...rows,
        parameterLimits: rows.parameterLimits ?? [],
        positioningLimits: rows.positioningLimits ?? [],
      },
      t!.id,
    );
    await appendAudit(tx, actor, {
      action: "procedure.created",
      entity: { type: "procedure_template", id: t!.id },
      newValues: {
        name,
        version: 1,
        jobKinds: rows.jobKinds,
        headModel: rows.headModel,
        steps: rows.steps,
        tcp: rows.tcp,
        parameterLimits: rows.parameterLimits,
        positioningLimits: rows.positioningLimits,
      },
    });
    return { ...t!, steps: rows.steps };
  });
}

/**
 * Save the steps of a procedure. The version no job uses yet is changed in place (it is still a
 * draft); once any job follows it, the body becomes the next version, which turns current, and
 * the jobs keep the one they started with. Head-parameter limits go with it. Audited.
 * `id` may be any version of the procedure; the new one is numbered after the highest.
 */
export async function saveProcedureVersion(actor: Actor, id: string, body: unknown) {
  const early = procedureEditRefusal(actor, null);
  if (early) throw forbidden(early);
  if (!isUuid(id)) throw notFound("procedure");
  const [base0] = await db.select().from(procedureTemplates).where(eq(procedureTemplates.id, id));
  if (!base0) throw notFound("procedure");
  const rows = rowsOrThrow(body, true);
  if (rows.name && rows.name !== base0.name)
    throw invalid("A new version keeps the procedure's name; create a new procedure for a new name.", [
      { field: "name", message: `This procedure is "${base0.name}".` },
    ]);
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(724015, hashtext(${base0.name}))`);
    // FOR UPDATE: a job being opened on this version waits (its foreign key locks the row), so
    // "no job uses it" stays true until this transaction ends.
    const [current] = await tx
      .select()
      .from(procedureTemplates)
      .where(and(eq(procedureTemplates.name, base0.name), eq(procedureTemplates.isCurrent, true)))
      .for("update");
    const [base] = await tx.select().from(procedureTemplates).where(eq(procedureTemplates.id, id));
    const refusal = procedureEditRefusal(actor, base!);
    if (refusal) throw new AppError(409, "conflict", refusal);
    const [{ n } = { n: 0 }] = await tx
      .select({ n: count() })
      .from(jobs)
      .where(eq(jobs.templateId, current?.id ?? id));
    const meta = {
      description: rows.description ?? base!.description,
      jobKinds: rows.jobKinds,
      headModel: rows.headModel,
      ...tcpColumns(rows, base!),
    };
    if (current && current.id === id && versionPlan(n) === "replace") {
      const oldSteps = await tx.select().from(templateSteps).where(eq(templateSteps.templateId, id));
      const oldLimits = await limitsOf(tx, id);
      await tx.delete(templateSteps).where(eq(templateSteps.templateId, id));
      await insertSteps(tx, id, rows);
      await writeAllLimits(tx, id, rows, id);
      const newLimits = await limitsOf(tx, id);
      const t = await updateAudited(tx, actor, procedureTemplates, id, meta, {
        action: "procedure.draft_saved",
        entityType: "procedure_template",
        oldValues: {
          version: base!.version,
          jobKinds: base!.jobKinds,
          headModel: base!.headModel,
          ...tcpColumns({ ...rows, tcp: null }, base!),
          steps: oldSteps.map(({ id: _i, templateId: _t, ...s }) => s),
          ...oldLimits,
        },
        newValues: (row) => ({ version: row.version, ...meta, steps: rows.steps, ...newLimits }),
      });
      return { ...t, steps: rows.steps, replaced: true };
    }
    const [{ v } = { v: 0 }] = await tx
      .select({ v: max(procedureTemplates.version) })
      .from(procedureTemplates)
      .where(eq(procedureTemplates.name, base!.name));
    await tx
      .update(procedureTemplates)
      .set({ isCurrent: false })
      .where(and(eq(procedureTemplates.name, base!.name), eq(procedureTemplates.isCurrent, true)));
    const [t] = await tx
      .insert(procedureTemplates)
      .values({
        name: base!.name,
        version: (v ?? 0) + 1,
        isCurrent: true,
        ...meta,
        createdById: actor.id,
      })
      .returning();
    await insertSteps(tx, t!.id, rows);
    await writeAllLimits(tx, t!.id, rows, base!.id);
    await appendAudit(tx, actor, {
      action: "procedure.versioned",
      entity: { type: "procedure_template", id: t!.id },
      oldValues: { id: base!.id, version: base!.version },
      newValues: { version: t!.version, ...meta, steps: rows.steps, ...(await limitsOf(tx, t!.id)) },
    });
    return { ...t!, steps: rows.steps, replaced: false };
  });
}

/**
 * Retire a procedure (every version: it is no longer offered for new jobs, and jobs that follow
 * it keep it) or bring it back. Audited.
 */
export async function setProcedureRetired(actor: Actor, id: string, retired: boolean) {
  const refusal = procedureRetireRefusal(actor);
  if (refusal) throw forbidden(refusal);
  if (!isUuid(id)) throw notFound("procedure");
  return db.transaction(async (tx) => {
    const [t] = await tx.select().from(procedureTemplates).where(eq(procedureTemplates.id, id));
    if (!t) throw notFound("procedure");
    const at = retired ? new Date() : null;
    await tx.update(procedureTemplates).set({ retiredAt: at }).where(eq(procedureTemplates.name, t.name));
    await appendAudit(tx, actor, {
      action: retired ? "procedure.retired" : "procedure.restored",
      entity: { type: "procedure_template", id: t.id },
      oldValues: { retiredAt: t.retiredAt },
      newValues: { name: t.name, retiredAt: at },
    });
    return { ...t, retiredAt: at };
  });
}

/**
 * The distinct axis letters of the register's heads per model, for the builder to name a
 * procedure's rotary axes (components/procedures/builder-values.ts axisLettersFor). The caller
 * has checked that the actor may edit procedures.
 */
export async function headAxesByModel(): Promise<
  { model: string; primaryAxis: string; secondaryAxis: string }[]
> {
  const rows = await db
    .selectDistinct({
      model: heads.model,
      primaryAxis: heads.primaryAxis,
      secondaryAxis: heads.secondaryAxis,
    })
    .from(heads)
    .where(isNotNull(heads.model));
  return rows.map((r) => ({ ...r, model: r.model! }));
}
