import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db";
import { insertJobRecord } from "@/db/queries/audit";
import { lockJob, refuseLockedReadings } from "@/db/queries/locks";
import { getJobDetail, visibleJob } from "@/db/queries/jobs";
import { environmentRecords, users, type EnvironmentRecord } from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import { AppError, invalid } from "@/lib/errors";
import type { EnvironmentCreateInput } from "@/lib/validations/environment";

function environmentJson(r: EnvironmentRecord & { recordedByName?: string | null }) {
  return {
    id: r.id,
    phase: r.phase,
    airTempC: r.airTempC,
    machineTempC: r.machineTempC,
    note: r.note,
    takenAt: r.takenAt.toISOString(),
    recordedBy: r.recordedByName ?? null,
    clientId: r.clientId,
  };
}
export type EnvironmentJson = ReturnType<typeof environmentJson>;

/** The job's temperature records, newest first (anyone who sees the job). */
export async function listEnvironment(actor: Actor, jobId: string): Promise<EnvironmentJson[] | null> {
  const d = await getJobDetail(actor, jobId);
  if (!d) return null;
  const rows = await db
    .select({ r: environmentRecords, name: users.name })
    .from(environmentRecords)
    .leftJoin(users, eq(users.id, environmentRecords.recordedById))
    .where(eq(environmentRecords.jobId, d.job.id))
    .orderBy(desc(environmentRecords.takenAt));
  return rows.map((x) => environmentJson({ ...x.r, recordedByName: x.name }));
}

/**
 * Records the air and machine temperature at the machine: by those who record readings, while
 * readings are open (403 otherwise); a repeated clientId answers with the stored record; audited.
 */
export async function recordEnvironment(actor: Actor, jobId: string, input: EnvironmentCreateInput) {
  const d = await visibleJob(actor, jobId);
  const takenAt = input.takenAt ?? new Date();
  if (takenAt.getTime() > Date.now() + 5 * 60_000)
    throw invalid("The time is in the future.", [{ field: "takenAt", message: "in the future" }]);
  return db.transaction(async (tx) => {
    const locked = await lockJob(tx, d.job.id);
    if (input.clientId) {
      const [again] = await tx
        .select()
        .from(environmentRecords)
        .where(and(eq(environmentRecords.jobId, d.job.id), eq(environmentRecords.clientId, input.clientId)));
      if (again) {
        if (again.recordedById !== actor.id)
          throw new AppError(409, "conflict", "Another record on this job already carries that clientId.");
        return { record: environmentJson({ ...again, recordedByName: actor.name }), replay: true };
      }
    }
    refuseLockedReadings(actor, locked);
    const row = await insertJobRecord(
      tx,
      actor,
      environmentRecords,
      {
        jobId: d.job.id,
        phase: input.phase,
        airTempC: input.airTempC ?? null,
        machineTempC: input.machineTempC ?? null,
        note: input.note ?? null,
        takenAt,
        recordedById: actor.id,
        clientId: input.clientId ?? null,
      },
      {
        action: "environment.recorded",
        entityType: "environment_record",
        newValues: (r) => ({
          phase: r.phase,
          airTempC: r.airTempC,
          machineTempC: r.machineTempC,
          note: r.note,
          takenAt: r.takenAt.toISOString(),
          clientId: r.clientId,
        }),
      },
    );
    return { record: environmentJson({ ...row, recordedByName: actor.name }), replay: false };
  });
}
