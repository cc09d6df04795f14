import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { customers, heads, machines, sites } from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import { registerEditRefusal } from "@/lib/policy/registers";
import { forbidden, invalid } from "@/lib/errors";
import type {
  customerCreateSchema,
  headCreateSchema,
  machineCreateSchema,
  siteCreateSchema,
} from "@/lib/validations/registers";

function requireAdmin(actor: Actor) {
  const refusal = registerEditRefusal(actor, "customers");
  if (refusal) throw forbidden(refusal);
}

const audit = (actor: Actor, entityType: string, entityId: string, newValues: unknown) => ({
  actorId: actor.id,
  actorEmail: actor.email,
  action: `${entityType}.created`,
  entityType,
  entityId,
  newValues,
});

export async function createCustomer(actor: Actor, input: z.infer<typeof customerCreateSchema>) {
  requireAdmin(actor);
  const [dupe] = await db
    .select({ id: customers.id })
    .from(customers)
    .where(sql`lower(${customers.name}) = ${input.name.toLowerCase()}`);
  if (dupe)
    throw invalid("A customer with that name is already registered.", [
      { field: "name", message: "Already registered." },
    ]);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(customers)
      .values({ name: input.name, contactEmail: input.contactEmail || null })
      .returning();
    await appendAudit(tx, audit(actor, "customer", row!.id, { name: row!.name }));
    return row!;
  });
}

export async function createSite(actor: Actor, input: z.infer<typeof siteCreateSchema>) {
  requireAdmin(actor);
  const [c] = await db.select({ id: customers.id }).from(customers).where(eq(customers.id, input.customerId));
  if (!c) throw invalid("Choose a customer.", [{ field: "customerId", message: "No such customer." }]);
  const [dupe] = await db
    .select({ id: sites.id })
    .from(sites)
    .where(and(eq(sites.customerId, c.id), eq(sites.name, input.name)));
  if (dupe)
    throw invalid("That customer already has a site of that name.", [
      { field: "name", message: "Already registered." },
    ]);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(sites)
      .values({ customerId: c.id, name: input.name, address: input.address || null })
      .returning();
    await appendAudit(tx, audit(actor, "site", row!.id, { name: row!.name, customerId: c.id }));
    return row!;
  });
}

export async function createMachine(actor: Actor, input: z.infer<typeof machineCreateSchema>) {
  requireAdmin(actor);
  const [s] = await db.select({ id: sites.id }).from(sites).where(eq(sites.id, input.siteId));
  if (!s) throw invalid("Choose a site.", [{ field: "siteId", message: "No such site." }]);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(machines)
      .values({
        siteId: s.id,
        name: input.name,
        kind: input.kind,
        builder: input.builder || null,
        model: input.model || null,
        serial: input.serial || null,
        control: input.control || null,
      })
      .returning();
    await appendAudit(tx, audit(actor, "machine", row!.id, { name: row!.name, siteId: s.id }));
    return row!;
  });
}

export async function createHead(actor: Actor, input: z.infer<typeof headCreateSchema>) {
  requireAdmin(actor);
  const [dupe] = await db.select({ id: heads.id }).from(heads).where(eq(heads.serial, input.serial));
  if (dupe)
    throw invalid("A head with that serial is already registered.", [
      { field: "serial", message: "Already registered." },
    ]);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(heads)
      .values({
        serial: input.serial,
        maker: input.maker || null,
        model: input.model || null,
        primaryAxis: input.primaryAxis,
        secondaryAxis: input.secondaryAxis,
        nominalPivotLengthMm: input.nominalPivotLengthMm,
        toolAxisOffsetMm: input.toolAxisOffsetMm,
        massKg: input.massKg ?? null,
      })
      .returning();
    await appendAudit(
      tx,
      audit(actor, "head", row!.id, {
        serial: row!.serial,
        axes: `${row!.primaryAxis}/${row!.secondaryAxis}`,
        nominalPivotLengthMm: row!.nominalPivotLengthMm,
      }),
    );
    return row!;
  });
}

export async function listSitesForSelect() {
  return db
    .select({ id: sites.id, name: sites.name, customerName: customers.name })
    .from(sites)
    .innerJoin(customers, eq(customers.id, sites.customerId))
    .orderBy(customers.name, sites.name);
}
