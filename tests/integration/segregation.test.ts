// Segregation of duties against the real database. Readings are recorded by the people who take
// them, never from the office (ISO/IEC 17025:2017 §7.5.1: records identify who performed each
// activity; §7.8.2.1 o: the report identifies who authorized it), and the person who signed the
// work as performed does not also approve its parameters or issue its report (21 CFR 11.50: each
// signature's meaning is its signer's) unless the company setting ALLOW_SAME_SIGNER allows it
// (off here, the default).
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, onTestFinished } from "vitest";
import { db } from "@/db";
import { approveAnalysis, runHeadFit } from "@/db/queries/analyses";
import { recordReading } from "@/db/queries/readings";
import { issueReport } from "@/db/queries/reports";
import { signJobWork } from "@/db/queries/signatures";
import { getActor } from "@/db/queries/users";
import { jobs, readings, signatures, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { env } from "@/lib/env";
import {
  actorsBeforeAll,
  BASE_JOB,
  DEMO_PASSWORD as PW,
  firstStepOf,
  insertTestJob,
  type JobBase,
  instrumentIdBySerial,
  refusalOf,
  uploadDemoProbe,
  approveConfirmed,
} from "./fixtures";
import { jobBaseOf } from "./ready-job";

const as = actorsBeforeAll();
let base: JobBase;
let stepId: string;
let instrumentId: string;

const newJob = (installerId: string) =>
  insertTestJob({
    tag: "SOD",
    title: "Segregation test job",
    kind: "installation",
    status: "measuring",
    template: true,
    base,
    assignedInstallerId: installerId,
  });

beforeAll(async () => {
  base = await jobBaseOf(BASE_JOB);
  stepId = await firstStepOf(base.templateId);
  instrumentId = await instrumentIdBySerial();
});

describe("who records readings", () => {
  it("the office (administrator) is refused (403, with the reason) and nothing is stored", async () => {
    const jobId = await newJob(as.installer!.id);
    const e = await refusalOf(
      recordReading(as.admin!, jobId, { stepId, phase: "pre", value: 0.0004, unit: "in", instrumentId }),
    );
    expect(e?.status).toBe(403);
    expect(e?.message).toMatch(/never from the office/);
    expect(await db.select().from(readings).where(eq(readings.jobId, jobId))).toEqual([]);
  });

  it("the assigned installer and an application engineer record, each reading names who took it", async () => {
    const jobId = await newJob(as.installer!.id);
    const a = await recordReading(as.installer!, jobId, {
      stepId,
      phase: "pre",
      value: 0.0004,
      unit: "in",
      instrumentId,
    });
    const b = await recordReading(as.engineer!, jobId, {
      stepId,
      phase: "post",
      value: 0.0002,
      unit: "in",
      instrumentId,
    });
    const rows = await db.select().from(readings).where(eq(readings.jobId, jobId));
    expect(rows.find((r) => r.id === a.id)?.recordedById).toBe(as.installer!.id);
    expect(rows.find((r) => r.id === b.id)?.recordedById).toBe(as.engineer!.id);
  });
});

describe("one person does not sign both 'performed' and an approval", () => {
  it("is the default (ALLOW_SAME_SIGNER off)", () => {
    expect(env.ALLOW_SAME_SIGNER).toBe(false);
  });

  it("an engineer who signed the work as performed may not approve its parameters or issue its report", async () => {
    // A person who did the work as installer and now holds the engineer's role (an administrator
    // changed it): they signed "performed" on this job.
    const [u] = await db
      .insert(users)
      .values({
        email: `sod-${Date.now().toString(36)}@halvard.example`,
        name: "Sam Dual",
        role: "installer",
        passwordHash: await hashPassword(PW),
      })
      .returning();
    // Other files count the company's active engineers (review notifications): leave none behind.
    onTestFinished(async () => {
      await db.update(users).set({ disabled: true }).where(eq(users.id, u!.id));
    });
    const jobId = await newJob(u!.id);
    const asInstaller = (await getActor(u!.id))!;
    const { analysis } = await runHeadFit(
      as.engineer!,
      await uploadDemoProbe(jobId, { email: asInstaller.email }),
    );
    await signJobWork(asInstaller, { jobId, meaning: "performed", password: PW });
    await db.update(jobs).set({ status: "in_review" }).where(eq(jobs.id, jobId));
    await db.update(users).set({ role: "engineer" }).where(eq(users.id, u!.id));
    const asEngineer = (await getActor(u!.id))!;
    expect(asEngineer.role).toBe("engineer");

    const e = await refusalOf(approveAnalysis(asEngineer, analysis.id, PW));
    expect(e?.status).toBe(403);
    expect(e?.message).toMatch(/signed this work as performed/);
    const [still] = await db.select({ status: jobs.status }).from(jobs).where(eq(jobs.id, jobId));
    expect(still!.status).toBe("in_review");
    expect(
      await db
        .select()
        .from(signatures)
        .where(and(eq(signatures.jobId, jobId), eq(signatures.meaning, "parameters_approved"))),
    ).toEqual([]);

    // Another engineer approves; the one who performed the work still may not issue the report.
    await approveConfirmed(as.engineer!, analysis.id, PW);
    const issue = await refusalOf(issueReport(asEngineer, { jobId, password: PW }));
    expect(issue?.status).toBe(403);
    expect(issue?.message).toMatch(/signed this work as performed/);
  });
});
