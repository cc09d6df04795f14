import "server-only";
import { and, eq, isNull, ne, sql } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { selectMachinesWithPlace } from "@/db/queries/registers";
import { customers, heads, instruments, machines, procedureTemplates, sites } from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import { isUuid } from "@/lib/domain/uuid";
import { registerEditRefusal, type Register } from "@/lib/policy/registers";
import { forbidden, invalid } from "@/lib/errors";
import type {
  customerCreateSchema,
  customerPatchSchema,
  headCreateSchema,
  headPatchSchema,
  machineCreateSchema,
  machinePatchSchema,
  siteCreateSchema,
  sitePatchSchema,
} from "@/lib/validations/registers";

function requireAdmin(actor: Actor) {
  const refusal = registerEditRefusal(actor, "customers");
  if (refusal) throw forbidden(refusal);
}

export async function createCustomer(actor: Actor, input: z.infer<typeof customerCreateSchema>) {
  requireAdmin(actor);
  const [dupe] = await db
    .select({ id: customers.id })
    .from(customers)
    .where(sql`lower(${customers.name}) = ${input.name.toLowerCase()}`);
  if (dupe) throw alreadyRegistered("A customer with that name is already registered.");
  return insertRegisterRow(
    actor,
    customers,
    "customer",
    { name: input.name, contactEmail: input.contactEmail || null },
    (row) => ({ name: row.name }),
  );
}

export async function createSite(actor: Actor, input: z.infer<typeof siteCreateSchema>) {
  requireAdmin(actor);
  const c = await activeRegisterRow(customers, input.customerId, "customerId", "customer");
  const [dupe] = await db
    .select({ id: sites.id })
    .from(sites)
    .where(and(eq(sites.customerId, c.id), eq(sites.name, input.name)));
  if (dupe) throw alreadyRegistered("That customer already has a site of that name.");
  return insertRegisterRow(
    actor,
    sites,
    "site",
    { customerId: c.id, name: input.name, address: input.address || null },
    (row) => ({ name: row.name, customerId: c.id }),
  );
}

export async function createMachine(actor: Actor, input: z.infer<typeof machineCreateSchema>) {
  requireAdmin(actor);
  const s = await activeRegisterRow(sites, input.siteId, "siteId", "site");
  return insertRegisterRow(
    actor,
    machines,
    "machine",
    {
      siteId: s.id,
      name: input.name,
      kind: input.kind,
      builder: input.builder || null,
      model: input.model || null,
      serial: input.serial || null,
      control: input.control || null,
    },
    (row) => ({ name: row.name, siteId: s.id }),
  );
}

export async function createHead(actor: Actor, input: z.infer<typeof headCreateSchema>) {
  requireAdmin(actor);
  // The serial's unique constraint refuses a second head, as it does when a serial is changed.
  return uniqueAs("serial", "A head with that serial is already registered.", () =>
    insertRegisterRow(
      actor,
      heads,
      "head",
      {
        serial: input.serial,
        maker: input.maker || null,
        model: input.model || null,
        primaryAxis: input.primaryAxis,
        secondaryAxis: input.secondaryAxis,
        nominalPivotLengthMm: input.nominalPivotLengthMm,
        toolAxisOffsetMm: input.toolAxisOffsetMm,
        massKg: input.massKg ?? null,
      },
      (row) => ({
        serial: row.serial,
        axes: `${row.primaryAxis}/${row.secondaryAxis}`,
        nominalPivotLengthMm: row.nominalPivotLengthMm,
      }),
    ),
  );
}

/** Sites that take new work (neither the site nor its customer retired), for pickers. */
export async function listSitesForSelect() {
  return db
    .select({ id: sites.id, name: sites.name, customerName: customers.name })
    .from(sites)
    .innerJoin(customers, eq(customers.id, sites.customerId))
    .where(and(isNull(sites.retiredAt), isNull(customers.retiredAt)))
    .orderBy(customers.name, sites.name);
}

/** Refuses (403) an actor who may not change this register; call before reading a request body. */
export function assertRegisterEdit(actor: Actor, register: Register) {
  const refusal = registerEditRefusal(actor, register);
  if (refusal) throw forbidden(refusal);
}

type RegisterTable = typeof customers | typeof sites | typeof machines | typeof heads | typeof instruments;

/**
 * Adds one register row and audits it as `<entity>.created` with what `describe` picks of it, in
 * one transaction. The caller has checked the actor and the input.
 */
export async function insertRegisterRow<T extends RegisterTable>(
  actor: Actor,
  table: T,
  entityType: string,
  values: T["$inferInsert"],
  describe: (row: T["$inferSelect"]) => unknown,
): Promise<T["$inferSelect"]> {
  const t = table as typeof customers;
  return db.transaction(async (tx) => {
    const [row] = (await tx
      .insert(t)
      .values(values as typeof customers.$inferInsert)
      .returning()) as T["$inferSelect"][];
    await appendAudit(tx, actor, {
      action: `${entityType}.created`,
      entity: { type: entityType, id: row!.id },
      newValues: describe(row!),
    });
    return row!;
  });
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * Changes one register or procedure row by id and appends the event that announces the change,
 * in the caller's transaction so that both commit together: the row is the event's entity, and
 * `newValues` is given the row as changed. Returns that row.
 */
export async function updateAudited<T extends RegisterTable | typeof procedureTemplates>(
  tx: Tx,
  actor: Actor,
  table: T,
  id: string,
  set: Partial<T["$inferInsert"]>,
  event: {
    action: string;
    entityType: string;
    oldValues: unknown;
    newValues: (row: T["$inferSelect"]) => unknown;
  },
): Promise<T["$inferSelect"]> {
  const t = table as typeof customers;
  const [row] = (await tx
    .update(t)
    .set(set as Partial<typeof customers.$inferInsert>)
    .where(eq(t.id, id))
    .returning()) as T["$inferSelect"][];
  await appendAudit(tx, actor, {
    action: event.action,
    entity: { type: event.entityType, id },
    oldValues: event.oldValues,
    newValues: event.newValues(row!),
  });
  return row!;
}

/**
 * Applies a correction to one register row and audits what changed, in one transaction: the old
 * and new values of the changed fields only, as `<entity>.updated` — or `<entity>.retired` /
 * `<entity>.restored` when the only change is `retired` (retired_at stamped now, or cleared; an
 * instrument's `retired` flag follows). Returns null when there is no such row (the route answers
 * 404), the row unchanged when nothing differs.
 */
export async function updateRegisterRow<T extends RegisterTable>(
  actor: Actor,
  register: Register,
  table: T,
  entityType: string,
  id: string,
  set: Partial<T["$inferInsert"]>,
  retired?: boolean,
): Promise<T["$inferSelect"] | null> {
  assertRegisterEdit(actor, register);
  if (!isUuid(id)) return null;
  const t = table as typeof customers;
  return db.transaction(async (tx) => {
    const [before] = (await tx.select().from(t).where(eq(t.id, id)).for("update")) as Record<
      string,
      unknown
    >[];
    if (!before) return null;
    const changed: [string, unknown][] = Object.entries(set).filter(
      ([k, v]) => v !== undefined && JSON.stringify(before[k] ?? null) !== JSON.stringify(v),
    );
    const retiring = retired !== undefined && (before.retiredAt != null) !== retired;
    if (retiring) {
      changed.push(["retiredAt", retired ? new Date() : null]);
      if (table === instruments) changed.push(["retired", retired]);
    }
    if (changed.length === 0) return before as T["$inferSelect"];
    const next = Object.fromEntries(changed);
    const onlyRetirement = retiring && changed.every(([k]) => k === "retiredAt" || k === "retired");
    return updateAudited(tx, actor, table, id, next as Partial<T["$inferInsert"]>, {
      action: `${entityType}.${onlyRetirement ? (retired ? "retired" : "restored") : "updated"}`,
      entityType,
      oldValues: Object.fromEntries(changed.map(([k]) => [k, before[k] ?? null])),
      newValues: () => next,
    });
  });
}

/**
 * The row a form chose (by id, in `field`) for new work, once it is known to exist and not to be
 * retired: refuses (422, naming the field) a missing one, and a retired one, which takes no new work.
 */
function refuseUnusable<R extends { retiredAt: Date | null }>(
  row: R | undefined,
  field: string,
  what: string,
  noun = what,
): R {
  if (!row) throw invalid(`Choose a ${what}.`, [{ field, message: `No such ${noun}.` }]);
  if (row.retiredAt)
    throw invalid(`The ${what} is retired; bring it back in the register first.`, [
      { field, message: `This ${what} is retired.` },
    ]);
  return row;
}

/** A customer, site or head a form chose for new work (see refuseUnusable): its id and retirement. */
export async function activeRegisterRow(
  table: typeof customers | typeof sites | typeof heads,
  id: string,
  field: string,
  what: string,
) {
  const t = table as typeof customers;
  const [row] = await db.select({ id: t.id, retiredAt: t.retiredAt }).from(t).where(eq(t.id, id));
  return refuseUnusable(row, field, what);
}

/** The host machine a form chose for new work (see refuseUnusable), with its site and customer. */
export async function activeHostMachine(machineId: string) {
  const [m] = await selectMachinesWithPlace({
    id: machines.id,
    customerId: sites.customerId,
    retiredAt: machines.retiredAt,
    machineName: machines.name,
  }).where(eq(machines.id, machineId));
  return refuseUnusable(m, "machineId", "host machine", "machine");
}

/** The 422 for a register entry that would repeat one already there, naming the field. */
function alreadyRegistered(message: string, field = "name") {
  return invalid(message, [{ field, message: "Already registered." }]);
}

/** Turns a PostgreSQL unique violation on `column` into a 422 naming the field; rethrows anything else. */
export async function uniqueAs<R>(field: string, message: string, work: () => Promise<R>): Promise<R> {
  try {
    return await work();
  } catch (err) {
    let e: unknown = err;
    while (e instanceof Error && (e as { code?: string }).code !== "23505" && e.cause) e = e.cause;
    if ((e as { code?: string })?.code === "23505") throw alreadyRegistered(message, field);
    throw err;
  }
}

const blankToNull = (v: string | undefined) => (v === undefined ? undefined : v.trim() || null);

export function updateCustomer(actor: Actor, id: string, input: z.infer<typeof customerPatchSchema>) {
  return uniqueAs("name", "A customer with that name is already registered.", () =>
    updateRegisterRow(
      actor,
      "customers",
      customers,
      "customer",
      id,
      {
        name: input.name,
        contactEmail: blankToNull(input.contactEmail),
      },
      input.retired,
    ),
  );
}

export async function updateSite(actor: Actor, id: string, input: z.infer<typeof sitePatchSchema>) {
  assertRegisterEdit(actor, "customers");
  if (input.name !== undefined && isUuid(id)) {
    const [own] = await db.select({ customerId: sites.customerId }).from(sites).where(eq(sites.id, id));
    const [dupe] = own
      ? await db
          .select({ id: sites.id })
          .from(sites)
          .where(and(eq(sites.customerId, own.customerId), eq(sites.name, input.name), ne(sites.id, id)))
      : [];
    if (dupe) throw alreadyRegistered("That customer already has a site of that name.");
  }
  return updateRegisterRow(
    actor,
    "customers",
    sites,
    "site",
    id,
    {
      name: input.name,
      address: blankToNull(input.address),
    },
    input.retired,
  );
}

export function updateMachine(actor: Actor, id: string, input: z.infer<typeof machinePatchSchema>) {
  return updateRegisterRow(
    actor,
    "machines",
    machines,
    "machine",
    id,
    {
      name: input.name,
      kind: input.kind,
      builder: blankToNull(input.builder),
      model: blankToNull(input.model),
      serial: blankToNull(input.serial),
      control: blankToNull(input.control),
    },
    input.retired,
  );
}

export function updateHead(actor: Actor, id: string, input: z.infer<typeof headPatchSchema>) {
  return uniqueAs("serial", "A head with that serial is already registered.", () =>
    updateRegisterRow(
      actor,
      "heads",
      heads,
      "head",
      id,
      {
        serial: input.serial,
        maker: blankToNull(input.maker),
        model: blankToNull(input.model),
        nominalPivotLengthMm: input.nominalPivotLengthMm,
        toolAxisOffsetMm: input.toolAxisOffsetMm,
        massKg: input.massKg,
      },
      input.retired,
    ),
  );
}
