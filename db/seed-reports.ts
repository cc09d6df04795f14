/**
 * Demo data: the issued acceptance report of the invented installation job TR-2026-0041, signed
 * as performed and inspected, then approved and issued through the same code path as the app.
 */
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { getReadinessView, recordDeviation } from "@/db/queries/readiness";
import { issueReport } from "@/db/queries/reports";
import { signJobWork } from "@/db/queries/signatures";
import { datasets, jobs, reports, signatures } from "@/db/schema";
import { demoActor, fitAndApprove } from "@/db/seed-helpers";

/** Invented for the demo scenario: the customer's written concession for the one result outside its limit. */
const DEMO_DEVIATION_JUSTIFICATION =
  "Outside the demo limit; the customer's quality engineer accepted it in writing (concession C-0041-1, invented demo) because the compensation table absorbs it.";

export async function seedReports(password: string): Promise<void> {
  const [job] = await db.select().from(jobs).where(eq(jobs.reference, "TR-2026-0041"));
  if (!job) return;
  const existing = await db.select({ id: reports.id }).from(reports).where(eq(reports.jobId, job.id));
  if (existing.length > 0) return;
  const installer = await demoActor("installer@halvard.example");
  const inspector = await demoActor("inspector@halvard.example");
  const engineer = await demoActor("engineer@halvard.example");
  // The job walks the real flow: measuring while the work is signed, approved, then issued.
  await db.update(jobs).set({ status: "measuring" }).where(eq(jobs.id, job.id));
  for (const [actor, meaning] of [
    [installer, "performed"],
    [inspector, "inspected"],
  ] as const) {
    const done = await db
      .select({ id: signatures.id })
      .from(signatures)
      .where(and(eq(signatures.jobId, job.id), eq(signatures.meaning, meaning)));
    if (done.length === 0) await signJobWork(actor, { jobId: job.id, meaning, password });
  }
  // The engineer fits the job's sphere-probe data (if the seed has some) and approves the result,
  // which moves the job from review to approved; otherwise the job is approved directly.
  await db.update(jobs).set({ status: "in_review" }).where(eq(jobs.id, job.id));
  const [probe] = await db
    .select({ id: datasets.id })
    .from(datasets)
    .where(and(eq(datasets.jobId, job.id), eq(datasets.kind, "sphere_probe"), eq(datasets.status, "stored")));
  if (probe) {
    await fitAndApprove(engineer, probe.id, password);
  } else {
    await db.update(jobs).set({ status: "approved" }).where(eq(jobs.id, job.id));
  }
  // Any result that does not conform is carried as a deviation the engineer justifies in writing
  // (invented demo wording), so the issued report passes the same readiness check as the app's.
  const view = await getReadinessView(engineer, job.id);
  for (const r of view?.nonConforming.filter((x) => !x.deviation) ?? [])
    await recordDeviation(engineer, {
      jobId: job.id,
      subject: r.subject,
      justification: DEMO_DEVIATION_JUSTIFICATION,
    });
  await issueReport(engineer, { jobId: job.id, password });
}
