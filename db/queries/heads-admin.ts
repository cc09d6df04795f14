import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { appendAudit } from "@/db/queries/audit";
import { auditEvents, customers, heads, machines, sites } from "@/db/schema";
import { canReadRegister, type Actor } from "@/lib/auth/roles";
import { forbidden, invalid, notFound } from "@/lib/errors";

/** One head with where it is mounted now and its mounting history (from the audit trail). */
export async function getHeadWithHistory(actor: Actor, headId: string) {
  if (!canReadRegister(actor.role, "heads")) throw forbidden("The heads register is kept by the service company.");
  if (!/^[0-9a-f-]{36}$/i.test(headId)) return null;
  const [row] = await db
    .select({ head: heads, machineName: machines.name, siteName: sites.name, customerName: customers.name })
    .from(heads)
    .leftJoin(machines, eq(machines.id, heads.machineId))
    .leftJoin(sites, eq(sites.id, machines.siteId))
    .leftJoin(customers, eq(customers.id, sites.customerId))
    .where(eq(heads.id, headId));
  if (!row) return null;
  const history = await db.select().from(auditEvents).where(and(eq(auditEvents.entityType, "head"), eq(auditEvents.entityId, headId))).orderBy(asc(auditEvents.id));
  return { ...row, history };
}

/** Mounts the head on a machine (or takes it off with null); audited so the history can be read back. */
export async function mountHead(actor: Actor, headId: string, machineId: string | null) {
  if (actor.role !== "admin") throw forbidden("Heads are moved in the register by the administrator.");
  const [h] = await db.select().from(heads).where(eq(heads.id, headId));
  if (!h) throw notFound("head");
  let label = "not mounted";
  if (machineId) {
    const [m] = await db.select({ name: machines.name, site: sites.name, customer: customers.name }).from(machines).innerJoin(sites, eq(sites.id, machines.siteId)).innerJoin(customers, eq(customers.id, sites.customerId)).where(eq(machines.id, machineId));
    if (!m) throw invalid("Choose a host machine.", [{ field: "machineId", message: "No such machine." }]);
    label = `${m.name} (${m.customer}, ${m.site})`;
  }
  if (h.machineId === machineId) return { changed: false };
  const [old] = h.machineId ? await db.select({ name: machines.name }).from(machines).where(eq(machines.id, h.machineId)) : [];
  await db.transaction(async (tx) => {
    await tx.update(heads).set({ machineId }).where(eq(heads.id, headId));
    await appendAudit(tx, { actorId: actor.id, actorEmail: actor.email, action: machineId ? "head.mounted" : "head.removed", entityType: "head", entityId: headId, oldValues: { machineId: h.machineId, machine: old?.name ?? null }, newValues: { machineId, machine: label } });
  });
  return { changed: true };
}
