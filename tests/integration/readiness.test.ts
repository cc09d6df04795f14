// The gates before issue against the real database: issueReport refuses (409, every blocker named)
// while the readiness check (lib/report/readiness.ts) finds anything open, one blocker kind at a
// time; a reading changed or a dataset added after a signature makes it stale; deviations are the
// engineer's, with a justification, and audited. ISO/IEC 17025:2017 §7.8.1.1 (results reported
// accurately and unambiguously), §7.8.2.1 b/e/p (method, item and deviations identified),
// §7.8.4.1 with §6.4/§6.5 (calibrated equipment, traceability) and §7.8.6 (statement of
// conformity) are the clauses these gates protect.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { approveAnalysis, nonConformingParameters, runHeadFit } from "@/db/queries/analyses";
import { getReadiness, getReadinessView, recordDeviation } from "@/db/queries/readiness";
import { recordReading } from "@/db/queries/readings";
import { issueReport } from "@/db/queries/reports";
import { signJobWork } from "@/db/queries/signatures";
import { auditEvents, deviations, instruments, jobs, readings, reports } from "@/db/schema";
import { AppError } from "@/lib/errors";
import type { BlockerCode } from "@/lib/report/readiness";
import type { ReportData } from "@/lib/report/types";
import { pdfText } from "../pdf-tools";
import { upload } from "./dataset-helpers";
import {
  actorsBeforeAll,
  BASE_JOB,
  DEMO_PASSWORD as PW,
  firstStepOf,
  insertTestJob,
  type JobBase,
  signPerformedAndInspected,
  uploadDemoProbe,
} from "./fixtures";
import { signInAs } from "./helpers";
import { carryOpenResults, jobBaseOf, measureEveryStep, procedureSteps } from "./ready-job";

const as = actorsBeforeAll();
let base: JobBase;

const newJob = (status: "measuring" | "approved" = "measuring") =>
  insertTestJob({
    tag: "RDY",
    title: "Readiness test job",
    kind: "installation",
    status,
    template: true,
    base,
    assignedInstallerId: as.installer!.id,
  });

const setStatus = (jobId: string, status: "measuring" | "in_review" | "approved") =>
  db.update(jobs).set({ status }).where(eq(jobs.id, jobId));

/** Tries to issue as the engineer; returns the refusal's blocker codes (throws if it was issued). */
async function refusedCodes(jobId: string): Promise<BlockerCode[]> {
  try {
    await issueReport(as.engineer!, { jobId, password: PW });
  } catch (e) {
    if (!(e instanceof AppError)) throw e;
    expect(e.status).toBe(409);
    expect(e.code).toBe("not_ready");
    return (e.issues ?? []).map((i) => i.field as BlockerCode);
  }
  throw new Error("the report was issued");
}

beforeAll(async () => {
  base = await jobBaseOf(BASE_JOB);
});

describe("issue is refused while any blocker stands", () => {
  let jobId = "";
  let step1 = "";
  let analysisId = "";

  it("a job with nothing recorded: steps, the procedure's sphere-probe data, the fit and both signatures", async () => {
    jobId = await newJob("approved");
    const codes = await refusedCodes(jobId);
    expect(new Set(codes)).toEqual(
      new Set<BlockerCode>(["step_not_measured", "dataset_missing", "fit_not_approved", "signature_missing"]),
    );
    expect(codes.filter((c) => c === "step_not_measured")).toHaveLength(6);
    expect(codes.filter((c) => c === "signature_missing")).toHaveLength(2);
    expect(await db.select().from(reports).where(eq(reports.jobId, jobId))).toHaveLength(0);
  });

  it("data uploaded but not fitted is not evaluated; a FAIL reading blocks until it is carried", async () => {
    await setStatus(jobId, "measuring");
    await measureEveryStep(as.installer!, jobId);
    step1 = await firstStepOf(base.templateId);
    const [current] = await db
      .select({ id: readings.id })
      .from(readings)
      .where(and(eq(readings.jobId, jobId), eq(readings.stepId, step1)));
    const [inst] = await db.select().from(instruments).where(eq(instruments.serial, "DTI-0112"));
    // A correction of step 1 that fails its limit (0.5 mm against 0.0005 in).
    await recordReading(as.installer!, jobId, {
      stepId: step1,
      phase: "pre",
      value: 0.5,
      unit: "mm",
      instrumentId: inst!.id,
      supersedesId: current!.id,
    });
    const datasetId = await uploadDemoProbe(jobId);
    await setStatus(jobId, "approved");
    const codes = await refusedCodes(jobId);
    expect(codes).toContain("dataset_not_evaluated");
    expect(codes).toContain("result_not_conforming");
    expect(codes).not.toContain("step_not_measured");
    expect(codes).not.toContain("dataset_missing");
    await setStatus(jobId, "measuring");
    ({
      analysis: { id: analysisId },
    } = await runHeadFit(as.engineer!, datasetId));
    await setStatus(jobId, "approved");
    const after = await refusedCodes(jobId);
    expect(after).not.toContain("dataset_not_evaluated");
    expect(after).toContain("fit_not_approved");
  });

  it("a reading changed after 'performed' makes that signature stale, and signing again clears it", async () => {
    await setStatus(jobId, "measuring");
    await signJobWork(as.installer!, { jobId, meaning: "performed", password: PW });
    let codes = await refusedCodesAt(jobId);
    expect(codes).not.toContain("signature_stale");
    expect(codes.filter((c) => c === "signature_missing")).toHaveLength(1);
    // The installer corrects a reading: the record the signature covered is no longer the record.
    const [inst] = await db.select().from(instruments).where(eq(instruments.serial, "DTI-0112"));
    const [latest] = (await db.select().from(readings).where(eq(readings.jobId, jobId))).filter(
      (r) => r.stepId !== step1 && !r.supersededById,
    );
    await recordReading(as.installer!, jobId, {
      stepId: latest!.stepId,
      phase: "pre",
      value: latest!.enteredValue,
      unit: latest!.enteredUnit as "mm",
      ...(latest!.inputs ? { travel: 101.6, travelUnit: "mm" as const } : {}),
      instrumentId: inst!.id,
      supersedesId: latest!.id,
    });
    codes = await refusedCodesAt(jobId);
    expect(codes).toContain("signature_stale");
    const view = await getReadinessView(as.engineer!, jobId);
    expect(view!.staleSignatureIds).toHaveLength(1);
    expect(view!.readiness.blockers.find((b) => b.code === "signature_stale")!.href).toBe(
      `/jobs/${jobId}/report#sign`,
    );
    await signJobWork(as.installer!, { jobId, meaning: "performed", password: PW });
    expect(await refusedCodesAt(jobId)).not.toContain("signature_stale");
  });

  it("a dataset uploaded after 'inspected' makes that signature stale", async () => {
    await signJobWork(as.inspector!, { jobId, meaning: "inspected", password: PW });
    expect(await refusedCodesAt(jobId)).not.toContain("signature_missing");
    await setStatus(jobId, "in_review");
    await signInAs("inspector@halvard.example");
    const up = await upload(
      jobId,
      Buffer.from(
        "feature,characteristic,nominal,measured,lower_tol,upper_tol\nBore A,diameter,20,20.001,-0.005,0.005\n",
      ),
      { kind: "test_part", phase: "pre", uncertainty_mm: "0.001" },
      "part.csv",
    );
    expect(up.status).toBe(201);
    const codes = await refusedCodesAt(jobId);
    // Both signatures covered a record without the test part.
    expect(codes.filter((c) => c === "signature_stale")).toHaveLength(2);
    await signPerformedAndInspected(as, jobId);
    expect(await refusedCodesAt(jobId)).not.toContain("signature_stale");
  });

  it("deviations are the engineer's, need a justification, and clear the FAIL; then the report issues", async () => {
    // The approval names the parameters that do not conform and refuses until each is confirmed.
    const open = await nonConformingParameters(as.engineer!, analysisId);
    expect(open.length).toBeGreaterThan(0);
    const unconfirmed = await approveAnalysis(as.engineer!, analysisId, PW).then(
      () => null,
      (e: AppError) => e,
    );
    expect(unconfirmed?.status).toBe(422);
    expect(unconfirmed?.issues?.[0]?.field).toBe("acknowledged");
    expect(unconfirmed?.issues?.[0]?.message).toContain(open[0]!.key);
    await approveAnalysis(
      as.engineer!,
      analysisId,
      PW,
      open.map((p) => p.key),
    );
    const view = await getReadinessView(as.engineer!, jobId);
    const step = view!.nonConforming.find((r) => r.subject === `step:${step1}`)!;
    expect(step.decision).toBe("fail");
    await expect(
      recordDeviation(as.inspector!, { jobId, subject: step.subject, justification: "Looks fine to me." }),
    ).rejects.toMatchObject({ status: 403 });
    await expect(
      recordDeviation(as.engineer!, { jobId, subject: step.subject, justification: "ok" }),
    ).rejects.toMatchObject({ status: 422 });
    await expect(
      recordDeviation(as.engineer!, {
        jobId,
        subject: "step:not-a-result",
        justification: "A long enough reason.",
      }),
    ).rejects.toMatchObject({ status: 404 });
    await carryOpenResults(
      as.engineer!,
      jobId,
      "Collar face run-out accepted by the customer's written concession for this test.",
    );
    const [dev] = await db.select().from(deviations).where(eq(deviations.subject, step.subject));
    expect(dev).toMatchObject({ approvedByName: as.engineer!.name, decision: "fail" });
    const [audit] = await db.select().from(auditEvents).where(eq(auditEvents.entityId, dev!.id));
    expect(audit!.action).toBe("deviation.recorded");
    // A deviation is part of the record: the database refuses to change it.
    await expect(
      db.update(deviations).set({ justification: "edited" }).where(eq(deviations.id, dev!.id)),
    ).rejects.toThrow();
    expect(await getReadiness(as.engineer!, jobId)).toEqual({ ready: true, blockers: [] });
    const { reportId, revision } = await issueReport(as.engineer!, { jobId, password: PW });
    expect(revision).toBe(1);
    // ISO/IEC 17025:2017 §7.8.6.1 and §7.8.2.1 p: the issued PDF opens with the statement of
    // conformity and lists the deviation with its justification and approver (read by pdftotext).
    const [r] = await db.select().from(reports).where(eq(reports.id, reportId));
    expect((r!.content as ReportData).conformity?.verdict).toBe("conforms_with_deviations");
    const text = pdfText(r!.pdf, true);
    expect(text).toContain("Statement of conformity Conforms with the listed deviations accepted");
    expect(text).toMatch(
      /Deviation: Step 1: .+ \(FAIL\) is carried into this report\. Justification: Collar face run-out/,
    );
    expect(text).toContain(`Approved by ${as.engineer!.name}`);
  });
});

/** Readiness codes without trying to issue (the job may not be in the approved status). */
async function refusedCodesAt(jobId: string): Promise<BlockerCode[]> {
  return (await getReadiness(as.engineer!, jobId))!.blockers.map((b) => b.code);
}

describe("readings kept before the check existed", () => {
  it("a reading with no instrument, or taken after the instrument fell due, blocks issue", async () => {
    const jobId = await newJob("approved");
    const steps = await procedureSteps(base.templateId);
    const [late] = await db.select().from(instruments).where(eq(instruments.serial, "DTI-0417"));
    // Written straight to the table, as an import of old records would: the app refuses both.
    await db.insert(readings).values([
      { jobId, stepId: steps[0]!.id, phase: "pre", value: 0.001, enteredValue: 0.001, enteredUnit: "mm" },
      {
        jobId,
        stepId: steps[1]!.id,
        phase: "pre",
        value: 2,
        enteredValue: 2,
        enteredUnit: "mm",
        instrumentId: late!.id,
        // the day after its calibration fell due
        takenAt: new Date(Date.parse(`${late!.calibrationDueOn}T12:00:00Z`) + 86_400_000),
      },
    ]);
    const codes = await refusedCodes(jobId);
    expect(codes).toContain("reading_without_instrument");
    expect(codes).toContain("instrument_out_of_calibration");
  });
});
