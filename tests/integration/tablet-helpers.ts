// A job of the test's own on a seeded job's customer, machine, head and procedure, with the demo
// installer assigned, so tests that record on it never disturb the seeded jobs.
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { jobs, templateSteps, users } from "@/db/schema";
import { jobIdByReference } from "./helpers";

export async function jobLike(
  reference: string,
  status: "measuring" | "issued",
  prefix: string,
): Promise<{ id: string; templateId: string; steps: Record<number, string> }> {
  const [base] = await db
    .select()
    .from(jobs)
    .where(eq(jobs.id, await jobIdByReference(reference)));
  const [installer] = await db.select().from(users).where(eq(users.email, "installer@halvard.example"));
  const [row] = await db
    .insert(jobs)
    .values({
      reference: `${prefix}-${status}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 6)}`,
      title: `${prefix} test job`,
      kind: base!.kind,
      status,
      customerId: base!.customerId,
      machineId: base!.machineId,
      headId: base!.headId,
      assignedInstallerId: installer!.id,
      templateId: base!.templateId,
    })
    .returning();
  const steps: Record<number, string> = {};
  for (const s of await db
    .select()
    .from(templateSteps)
    .where(eq(templateSteps.templateId, base!.templateId!)))
    steps[s.position] = s.id;
  return { id: row!.id, templateId: base!.templateId!, steps };
}
