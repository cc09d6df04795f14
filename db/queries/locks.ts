import "server-only";
import { and, eq, type SQL } from "drizzle-orm";
import type { NodePgDatabase } from "drizzle-orm/node-postgres";
import { db } from "@/db";
import { jobs, users } from "@/db/schema";
import type * as schema from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import { forbidden } from "@/lib/errors";
import { readingsRefusal } from "@/lib/policy/readings";

type Executor = NodePgDatabase<typeof schema>;

/**
 * Locks the job's row until the transaction ends (SELECT … FOR UPDATE), so a status move or a
 * write that depends on the status cannot slip in between, and returns the job's status and
 * assigned installer as they are now (undefined when the job is gone).
 */
export async function lockJob(tx: Executor, jobId: string) {
  const [locked] = await tx
    .select({ status: jobs.status, assignedInstallerId: jobs.assignedInstallerId })
    .from(jobs)
    .where(eq(jobs.id, jobId))
    .for("update");
  return locked;
}

/**
 * Refuses (403) a reading, photo or environment record on a job locked by `lockJob` when the job
 * is gone or the readings policy says no for it as it is now.
 */
export function refuseLockedReadings(actor: Actor, locked: Awaited<ReturnType<typeof lockJob>>) {
  const refusal = locked ? readingsRefusal(actor, locked) : "gone";
  if (refusal) throw forbidden(refusal);
}

/** The users matching `where` whose accounts are not disabled: id, e-mail and name, to notify them. */
export function activeUsers(where: SQL | undefined) {
  return db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(and(where, eq(users.disabled, false)));
}
