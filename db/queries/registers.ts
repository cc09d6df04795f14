import "server-only";
import { asc, eq, isNull, sql, type AnyColumn } from "drizzle-orm";
import type { SelectedFields } from "drizzle-orm/pg-core";
import type { SelectResultFields } from "drizzle-orm/query-builders/select.types";
import { db } from "@/db";
import { personColumns } from "@/db/queries/users";
import { customers, heads, machines, sites, users } from "@/db/schema";
import { type Actor, type Role } from "@/lib/domain/roles";
import { registerReadRefusal, type Register } from "@/lib/policy/registers";
import { forbidden } from "@/lib/errors";

/** A register whose rows are retired rather than deleted. */
type RetiringRegister = typeof customers | typeof sites | typeof machines | typeof heads;

/**
 * The given columns of a register's rows in use (retired ones left out: they take no new work),
 * sorted by `order`. No access check: for callers that checked the actor.
 */
export async function rowsInUse<S extends SelectedFields>(
  table: RetiringRegister,
  columns: S,
  order: AnyColumn,
): Promise<SelectResultFields<S>[]> {
  const t = table as typeof customers;
  const rows = await db.select(columns).from(t).where(isNull(t.retiredAt)).orderBy(asc(order));
  return rows as SelectResultFields<S>[];
}

/**
 * Machines with the names of the site they stand at and its customer, plus the given columns; the
 * caller filters and sorts.
 */
export function selectMachinesWithPlace<S extends SelectedFields>(columns: S) {
  return db
    .select({ ...columns, siteName: sites.name, customerName: customers.name })
    .from(machines)
    .innerJoin(sites, eq(sites.id, machines.siteId))
    .innerJoin(customers, eq(customers.id, sites.customerId))
    .$dynamic();
}

function check(actor: Actor, register: Register) {
  if (registerReadRefusal(actor, register)) throw forbidden("Registers are kept by the administrator.");
}

export async function listCustomersWithSites(actor: Actor) {
  check(actor, "customers");
  return db
    .select({
      id: customers.id,
      name: customers.name,
      contactEmail: customers.contactEmail,
      retiredAt: customers.retiredAt,
      sites: sql<
        string[]
      >`coalesce(array_agg(${sites.name} order by ${sites.name}) filter (where ${sites.id} is not null), '{}')`,
    })
    .from(customers)
    .leftJoin(sites, eq(sites.customerId, customers.id))
    .groupBy(customers.id)
    .orderBy(asc(customers.name));
}

export async function listMachines(actor: Actor) {
  check(actor, "machines");
  return selectMachinesWithPlace({
    id: machines.id,
    name: machines.name,
    kind: machines.kind,
    builder: machines.builder,
    model: machines.model,
    serial: machines.serial,
    retiredAt: machines.retiredAt,
  }).orderBy(asc(customers.name), asc(machines.name));
}

export async function listHeads(actor: Actor) {
  check(actor, "heads");
  return db
    .select({
      id: heads.id,
      serial: heads.serial,
      maker: heads.maker,
      model: heads.model,
      primaryAxis: heads.primaryAxis,
      secondaryAxis: heads.secondaryAxis,
      nominalPivotLengthMm: heads.nominalPivotLengthMm,
      massKg: heads.massKg,
      retiredAt: heads.retiredAt,
      machineName: machines.name,
    })
    .from(heads)
    .leftJoin(machines, eq(machines.id, heads.machineId))
    .orderBy(asc(heads.serial));
}

export async function listSites(actor: Actor) {
  check(actor, "customers");
  return db
    .select({
      id: sites.id,
      name: sites.name,
      address: sites.address,
      retiredAt: sites.retiredAt,
      customerId: sites.customerId,
      customerName: customers.name,
    })
    .from(sites)
    .innerJoin(customers, eq(customers.id, sites.customerId))
    .orderBy(asc(customers.name), asc(sites.name));
}

/** The people register, optionally one role only (the office's pickers ask for installers). */
export async function listPeople(actor: Actor, role?: Role) {
  check(actor, "people");
  return db
    .select({ ...personColumns, customerName: customers.name })
    .from(users)
    .leftJoin(customers, eq(customers.id, users.customerId))
    .where(role ? eq(users.role, role) : undefined)
    .orderBy(asc(users.role), asc(users.name));
}
