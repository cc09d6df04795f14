// Segregation of duties against the real database. Readings are recorded by the people who take
// them, never from the office (ISO/IEC 17025:2017 §7.5.1: records identify who performed each
// activity; §7.8.2.1 o: the report identifies who authorized it), and the person who signed the
// work as performed does not also approve its parameters or issue its report (21 CFR 11.50: each
// signature's meaning is its signer's) unless the company setting ALLOW_SAME_SIGNER allows it
// (off here, the default).
import { and, asc, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { approveAnalysis, nonConformingParameters, runHeadFit } from "@/db/queries/analyses";
import { recordReading } from "@/db/queries/readings";
import { issueReport } from "@/db/queries/reports";
import { signJobWork } from "@/db/queries/signatures";
import { getActor } from "@/db/queries/users";
import { demoSphereProbeCsv } from "@/db/seed-analyses";
import { instruments, jobs, readings, signatures, templateSteps, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import type { Actor } from "@/lib/domain/roles";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { upload } from "./dataset-helpers";
import { signInAs } from "./helpers";
import { jobBaseOf } from "./ready-job";

const PW = "trammel-demo";
const as: Record<string, Actor> = {};
let base: { customerId: string; machineId: string; headId: string; templateId: string };
let stepId: string;
let instrumentId: string;

async function newJob(installerId: string): Promise<string> {
  const [row] = await db
    .insert(jobs)
    .values({
      reference: `TR-SOD-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`,
      title: "Segregation test job",
      kind: "installation",
      status: "measuring",
      ...base,
      assignedInstallerId: installerId,
    })
    .returning();
  return row!.id;
}

const refusal = (p: Promise<unknown>) =>
  p.then(
    () => null,
    (e: AppError) => e,
  );

beforeAll(async () => {
  for (const e of ["installer", "inspector", "engineer", "admin"])
    as[e] = (await getActor((await signInAs(`${e}@halvard.example`))!))!;
  base = await jobBaseOf("TR-2026-0052");
  const [step] = await db
    .select()
    .from(templateSteps)
    .where(eq(templateSteps.templateId, base.templateId))
    .orderBy(asc(templateSteps.position))
    .limit(1);
  stepId = step!.id;
  const [inst] = await db.select().from(instruments).where(eq(instruments.serial, "DTI-0112"));
  instrumentId = inst!.id;
});

describe("who records readings", () => {
  it("the office (administrator) is refused (403, with the reason) and nothing is stored", async () => {
    const jobId = await newJob(as.installer!.id);
    const e = await refusal(
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
    const jobId = await newJob(u!.id);
    const asInstaller = (await getActor(u!.id))!;
    await signInAs(asInstaller.email);
    const up = await upload(
      jobId,
      Buffer.from(demoSphereProbeCsv()),
      { kind: "sphere_probe", phase: "pre", units: "mm" },
      "probe.csv",
    );
    expect(up.status).toBe(201);
    const { analysis } = await runHeadFit(as.engineer!, ((await up.json()) as { id: string }).id);
    await signJobWork(asInstaller, { jobId, meaning: "performed", password: PW });
    await db.update(jobs).set({ status: "in_review" }).where(eq(jobs.id, jobId));
    await db.update(users).set({ role: "engineer" }).where(eq(users.id, u!.id));
    const asEngineer = (await getActor(u!.id))!;
    expect(asEngineer.role).toBe("engineer");

    const e = await refusal(approveAnalysis(asEngineer, analysis.id, PW));
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
    await approveAnalysis(
      as.engineer!,
      analysis.id,
      PW,
      (await nonConformingParameters(as.engineer!, analysis.id)).map((p) => p.key),
    );
    const issue = await refusal(issueReport(asEngineer, { jobId, password: PW }));
    expect(issue?.status).toBe(403);
    expect(issue?.message).toMatch(/signed this work as performed/);
  });
});
