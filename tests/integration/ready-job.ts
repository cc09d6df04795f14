// Helpers that bring a test job to the state the readiness check (lib/report/readiness.ts) asks
// for before issue, through the same query functions the app uses: every checklist step measured
// with a registered instrument in calibration, and each FAIL or undecided result carried as a
// deviation with a written justification.
import { and, asc, eq, isNull } from "drizzle-orm";
import { db } from "@/db";
import { getReadinessView, recordDeviation } from "@/db/queries/readiness";
import { recordReading } from "@/db/queries/readings";
import { instruments, jobs, readings, templateSteps } from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import { jobIdByReference } from "./helpers";

/** The steps of a procedure version, in their order. */
export function procedureSteps(templateId: string) {
  return db
    .select()
    .from(templateSteps)
    .where(eq(templateSteps.templateId, templateId))
    .orderBy(asc(templateSteps.position));
}

/** Records a conforming reading (the middle of the step's limits) for every step of the job's procedure. */
export async function measureEveryStep(installer: Actor, jobId: string, phase: "pre" | "post" = "pre") {
  const [job] = await db.select({ templateId: jobs.templateId }).from(jobs).where(eq(jobs.id, jobId));
  if (!job?.templateId) return;
  const steps = await procedureSteps(job.templateId);
  const [inst] = await db.select().from(instruments).where(eq(instruments.serial, "DTI-0112"));
  // A step already measured in this phase keeps its reading (recording again would supersede it).
  const measured = new Set(
    (
      await db
        .select({ stepId: readings.stepId })
        .from(readings)
        .where(and(eq(readings.jobId, jobId), eq(readings.phase, phase), isNull(readings.supersededById)))
    ).map((r) => r.stepId),
  );
  for (const s of steps.filter((x) => !measured.has(x.id))) {
    const angleOverTravel = s.derivation === "angle_over_distance";
    const lo = s.lowerLimit ?? 0;
    const hi = s.upperLimit ?? lo;
    await recordReading(installer, jobId, {
      stepId: s.id,
      phase,
      // An angle over a travel: no change in reading over the travel is 0″, inside any limit around 0.
      value: angleOverTravel ? 0 : (lo + hi) / 2,
      unit: "mm",
      ...(angleOverTravel ? { travel: s.distanceMm ?? 100, travelUnit: "mm" as const } : {}),
      instrumentId: inst!.id,
    });
  }
}

/** The engineer carries every open FAIL or undecided result as a deviation; returns what was carried. */
export async function carryOpenResults(engineer: Actor, jobId: string, justification: string) {
  const view = await getReadinessView(engineer, jobId);
  const open = view!.nonConforming.filter((r) => !r.deviation);
  for (const r of open) await recordDeviation(engineer, { jobId, subject: r.subject, justification });
  return open;
}

/** The customer, machine, head and procedure of a seeded job, to create test jobs of one's own on. */
export async function jobBaseOf(reference: string) {
  const [t] = await db
    .select()
    .from(jobs)
    .where(eq(jobs.id, await jobIdByReference(reference)));
  return {
    customerId: t!.customerId,
    machineId: t!.machineId,
    headId: t!.headId,
    templateId: t!.templateId!,
  };
}
