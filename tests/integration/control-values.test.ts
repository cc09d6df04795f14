// The control loop against the real database: GET/PUT /api/jobs/{id}/control-values for every role
// and both tenants (expected answers written by hand from the product's rules: engineers record,
// other staff read, a customer reads the values in the report only and never another tenant's
// job), then one job from as found through approval, as left with a difference flagged, and issue,
// after which the values are fixed.
import { and, desc, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as getRoute, PUT as putRoute } from "@/app/api/jobs/[id]/control-values/route";
import { db } from "@/db";
import { runHeadFit } from "@/db/queries/analyses";
import {
  actorsBeforeAll,
  insertTestJob,
  measureSignAndApprove,
  signPerformedAndInspected,
  uploadDemoProbe,
} from "./fixtures";
import { changeJobStatus, createJobFromTemplate } from "@/db/queries/job-status";
import { getReportContent, issueReport } from "@/db/queries/reports";
import { jobStateSha256 } from "@/db/queries/signatures";
import { canonicalJson } from "@/lib/canonical-json";
import { sha256Hex } from "@/lib/report/signing";
import { demoSphereProbeCsv } from "@/db/seed-analyses";
import { auditEvents, controlValueRecords, instruments, jobs, procedureTemplates } from "@/db/schema";
import { recordBudgetInputs } from "@/db/queries/budget";
import { demoTcpCheckCsv } from "@/db/seed-control";
import { getReadiness } from "@/db/queries/readiness";
import { jobTcpChecks } from "@/db/queries/control-values";
import { upload } from "./dataset-helpers";
import { jobIdByReference, jsonBody, request, signInAs } from "./helpers";
import { carryOpenResults, jobBaseOf, measureEveryStep } from "./ready-job";

const PW = "trammel-demo";
const p = (id: string) => ({ params: Promise.resolve({ id }) });
const get = (id: string) => getRoute(request(`/api/jobs/${id}/control-values`), p(id));
const put = (id: string, body: unknown) =>
  putRoute(request(`/api/jobs/${id}/control-values`, jsonBody("PUT", body)), p(id));
const asFoundBody = {
  stage: "as_found",
  unitSystem: "metric",
  values: { pivot_length_mm: "152.4000", secondary_zero_deg: 0.001 },
};

// Marlow Creek: a job of our own (measuring), so writes here touch no seeded job; Tollan: the
// seeded TR-2026-0048, read only. The installer is assigned to both.
const CELLS: Record<
  string,
  { email: string | null; getMarlow: number; getTollan: number; putMarlow: number; putTollan: number }
> = {
  anonymous: { email: null, getMarlow: 401, getTollan: 401, putMarlow: 401, putTollan: 401 },
  admin: { email: "admin@halvard.example", getMarlow: 200, getTollan: 200, putMarlow: 403, putTollan: 403 },
  installer: {
    email: "installer@halvard.example",
    getMarlow: 200,
    getTollan: 200,
    putMarlow: 403,
    putTollan: 403,
  },
  inspector: {
    email: "inspector@halvard.example",
    getMarlow: 200,
    getTollan: 200,
    putMarlow: 403,
    putTollan: 403,
  },
  engineer: {
    email: "engineer@halvard.example",
    getMarlow: 200,
    getTollan: 200,
    putMarlow: 200,
    // Not sent: it would write to a seeded job (the engineer's write is checked on Marlow).
    putTollan: 0,
  },
  "customer (Marlow Creek)": {
    email: "buyer@marlowcreek.example",
    getMarlow: 403,
    getTollan: 404,
    putMarlow: 403,
    putTollan: 404,
  },
  "customer (Tollan)": {
    email: "buyer@tollan.example",
    getMarlow: 404,
    getTollan: 403,
    putMarlow: 404,
    putTollan: 403,
  },
};

const as = actorsBeforeAll([
  "admin@halvard.example",
  "installer@halvard.example",
  "inspector@halvard.example",
  "engineer@halvard.example",
]);
const ids = { marlow: "", tollan: "", flow: "", analysis: "" };

async function newJob(title: string) {
  const base = await jobBaseOf("TR-2026-0052");
  const job = await createJobFromTemplate(as.admin!, {
    templateId: base.templateId,
    machineId: base.machineId,
    headId: base.headId,
    kind: "after_crash",
    title,
    assignedInstallerId: as.installer!.id,
    decisionRule: "simple",
  });
  await changeJobStatus(as.installer!, job.id, "measuring");
  return job.id;
}

beforeAll(async () => {
  ids.marlow = await newJob("Control values access job");
  ids.tollan = await jobIdByReference("TR-2026-0048");
}, 30_000);

describe("control values access matrix", () => {
  for (const [who, c] of Object.entries(CELLS)) {
    describe(who, () => {
      it(`GET on a Marlow Creek job answers ${c.getMarlow}, on a Tollan job ${c.getTollan}`, async () => {
        await signInAs(c.email);
        const m = await get(ids.marlow);
        expect(m.status).toBe(c.getMarlow);
        const t = await get(ids.tollan);
        expect(t.status).toBe(c.getTollan);
        if (c.getTollan === 404)
          expect(await t.json()).toEqual({ error: { code: "not_found", message: "No such job." } });
        if (c.getMarlow === 200) {
          const body = await m.json();
          expect(body.rows).toHaveLength(10);
          expect(body.units).toEqual({ length: "mm", angle: "deg" });
        }
      });

      it(`PUT as-found values answers ${c.putMarlow} (Marlow Creek) and ${c.putTollan || "—"} (Tollan)`, async () => {
        await signInAs(c.email);
        const before = await db
          .select({ id: controlValueRecords.id })
          .from(controlValueRecords)
          .where(eq(controlValueRecords.jobId, ids.marlow));
        const m = await put(ids.marlow, asFoundBody);
        expect(m.status).toBe(c.putMarlow);
        const after = await db
          .select({ id: controlValueRecords.id })
          .from(controlValueRecords)
          .where(eq(controlValueRecords.jobId, ids.marlow));
        expect(after.length - before.length).toBe(c.putMarlow === 200 ? 1 : 0);
        if (c.putTollan) expect((await put(ids.tollan, asFoundBody)).status).toBe(c.putTollan);
      });
    });
  }

  it("refuses bad input with the field named, and stores nothing", async () => {
    await signInAs("engineer@halvard.example");
    const unknown = await put(ids.marlow, { ...asFoundBody, values: { pivot: 1 } });
    expect(unknown.status).toBe(422);
    expect(JSON.stringify((await unknown.json()).error.issues)).toContain("pivot");
    const huge = await put(ids.marlow, { ...asFoundBody, values: { pivot_length_mm: 1e9 } });
    expect(huge.status).toBe(422);
    expect((await huge.json()).error.issues[0].field).toBe("values.pivot_length_mm");
    const word = await put(ids.marlow, { ...asFoundBody, values: { secondary_zero_deg: "ninety" } });
    expect(word.status).toBe(422);
    const none = await put(ids.marlow, { ...asFoundBody, values: {} });
    expect(none.status).toBe(422);
  });

  it("refuses as-left values before a fit is approved (409)", async () => {
    await signInAs("engineer@halvard.example");
    const res = await put(ids.marlow, { ...asFoundBody, stage: "as_left" });
    expect(res.status).toBe(409);
    expect((await res.json()).error.message).toMatch(/approved/);
  });
});

describe("one job through the control loop", () => {
  it("records as found, computes values to enter after approval, flags as left, and fixes them at issue", async () => {
    ids.flow = await newJob("Control loop flow job");
    await signInAs("engineer@halvard.example");
    // As found on an inch control: 6 in pivot (152.4 mm exactly, NIST SP 811).
    const found = await put(ids.flow, {
      stage: "as_found",
      unitSystem: "inch",
      values: { pivot_length_mm: 6, primary_zero_deg: 0, secondary_zero_deg: 0 },
    });
    expect(found.status).toBe(200);
    const f = await found.json();
    expect(f.unitSystem).toBe("inch");
    expect(f.rows.find((r: { key: string }) => r.key === "pivot_length_mm").asFound).toBeCloseTo(152.4, 10);
    expect(f.rows.every((r: { toEnter: number | null }) => r.toEnter === null)).toBe(true);

    const probe = await uploadDemoProbe(ids.flow, { phase: "post" });
    const { analysis } = await runHeadFit(as.engineer!, probe);
    ids.analysis = analysis.id;
    await measureEveryStep(as.installer!, ids.flow, "pre");
    await measureSignAndApprove(as, ids.flow, analysis.id, "post");

    // Values to enter = as found + the approved fit's correction, in the control's units.
    await signInAs("inspector@halvard.example");
    const loop = await (await get(ids.flow)).json();
    const pivotError = analysis.result.fit.parameters.find(
      (x: { key: string }) => x.key === "pivot_length_error_um",
    )!.value;
    const pivot = loop.rows.find((r: { key: string }) => r.key === "pivot_length_mm");
    expect(pivot.toEnter).toBeCloseTo(152.4 + pivotError / 1000, 10);
    expect(pivot.toEnterText).toMatch(/ in \(\d+\.\d{4} mm\)$/);
    expect(loop.approved.analysisId).toBe(analysis.id);

    // As left: the pivot as computed, the zeros left off by 0.01° (flagged).
    const stateBeforeAsLeft = await jobStateSha256(ids.flow);
    await signInAs("engineer@halvard.example");
    const zero = loop.rows.find((r: { key: string }) => r.key === "secondary_zero_deg");
    const left = await put(ids.flow, {
      stage: "as_left",
      unitSystem: "inch",
      values: {
        pivot_length_mm: Number((pivot.toEnter / 25.4).toFixed(5)),
        primary_zero_deg: loop.rows.find((r: { key: string }) => r.key === "primary_zero_deg").toEnter,
        secondary_zero_deg: zero.toEnter + 0.01,
      },
    });
    expect(left.status).toBe(200);
    const l = await left.json();
    expect(l.flagged).toEqual([
      { key: "secondary_zero_deg", flag: "differs", difference: expect.closeTo(0.01, 9) },
    ]);
    expect(l.asLeft.analysisId).toBe(analysis.id);
    // Entered after approval, the as-left values leave the earlier "performed" and "inspected"
    // signatures standing (db/queries/signatures.jobStateSha256 says why); the report vouches for them.
    expect(await jobStateSha256(ids.flow)).toBe(stateBeforeAsLeft);
    expect((await getReadiness(as.engineer!, ids.flow))!.blockers.map((b) => b.code)).not.toContain(
      "signature_stale",
    );
    const [ev] = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.jobId, ids.flow), eq(auditEvents.action, "control_values.as_left_recorded")))
      .orderBy(desc(auditEvents.id));
    expect(ev?.entityId).toBe(l.asLeft.id);
    expect(ev?.actorId).toBe(as.engineer!.id);

    // A record is never changed in place: the database refuses it.
    const refused = await db
      .update(controlValueRecords)
      .set({ note: "x" })
      .where(eq(controlValueRecords.id, l.asLeft.id))
      .then(
        () => "no error",
        (e: Error & { cause?: Error }) => e.cause?.message ?? e.message,
      );
    expect(refused).toMatch(/immutable/);

    // The budget's Type B inputs from the register (DTI-0112 as probe and as presetter, ΔT 1 K).
    const [dti] = await db.select().from(instruments).where(eq(instruments.serial, "DTI-0112"));
    await expect(
      recordBudgetInputs(as.inspector!, { analysisId: analysis.id, probeInstrumentId: dti!.id }),
    ).rejects.toMatchObject({ status: 403 });
    await recordBudgetInputs(as.engineer!, {
      analysisId: analysis.id,
      probeInstrumentId: dti!.id,
      presetterInstrumentId: dti!.id,
      deltaTK: 1,
    });

    await carryOpenResults(as.engineer!, ids.flow, "Carried for this test of the control loop.");
    const { reportId } = await issueReport(as.engineer!, { jobId: ids.flow, password: PW });
    // The issued report prints the loop with the flag (its content is what was signed).
    const content = await getReportContent(as.engineer!, reportId);
    expect(content?.controlValues?.flagged).toBe(1);
    expect(content?.controlValues?.rows.map((r) => r.setting)).toEqual([
      "Pivot length (tilt axis to gauge point)",
      "Primary axis zero offset",
      "Tilt axis zero offset",
    ]);
    expect(content?.controlValues?.rows[2]!.check).toMatch(/^Differs from the value to enter/);
    // The report's content hash covers the as-left values: it is the hash of the content that
    // prints them (checked here by recomputing it over that content).
    const { contentSha256, ...rest } = content!;
    expect(sha256Hex(canonicalJson(rest))).toBe(contentSha256);
    const asLeftCell = rest.controlValues!.rows[2]!.asLeft;
    expect(asLeftCell).toMatch(/\d/);
    expect(canonicalJson(rest)).toContain(JSON.stringify(asLeftCell));
    // The budget printed with it: the pivot row carries the presetter and the temperature band.
    const uUm = (dti!.standardUncertainty * 1000).toFixed(3);
    const pivotBudget = content?.budget?.rows.find((r) => r.parameter.includes("Pivot length"));
    expect(pivotBudget?.components.map((c) => c.name)).toEqual([
      "fit (Type A)",
      "probe",
      "tool-length presetter",
      "temperature (ΔT·α·L, rectangular)",
    ]);
    expect(pivotBudget?.components[2]!.u).toBe(uUm);
    expect(content?.budget?.inputs).toContain("±1 K");
    await expect(
      recordBudgetInputs(as.engineer!, { analysisId: analysis.id, deltaTK: 2 }),
    ).rejects.toMatchObject({ status: 409 });
    const fixed = await put(ids.flow, { ...asFoundBody, stage: "as_found" });
    expect(fixed.status).toBe(409);
    expect((await fixed.json()).error.message).toMatch(/issued/);
    const after = await (await get(ids.flow)).json();
    expect(after.asLeft.id).toBe(l.asLeft.id);
  }, 120_000);
});

describe("a procedure that asks for a tool-centre-point check", () => {
  it("blocks issue until a TCP check is stored, takes it after approval, and reports it", async () => {
    // A procedure version of our own (no steps) that requires the check, limits 15 µm / 10 µm.
    const [t] = await db
      .insert(procedureTemplates)
      .values({
        name: `TCP check procedure ${Date.now().toString(36)}`,
        version: 1,
        tcpCheckRequired: true,
        tcpRangeLimitUm: 15,
        tcpDeviationLimitUm: 10,
        tcpLimitSource: "maker_manual",
        tcpLimitSourceNote: "Head data sheet, TCP figures",
      })
      .returning();
    const jobId = await insertTestJob({
      tag: "TCP",
      title: "TCP check job",
      kind: "after_crash",
      status: "approved",
      template: true,
      base: { ...(await jobBaseOf("TR-2026-0052")), templateId: t!.id },
    });
    await signPerformedAndInspected(as, jobId);
    const before = await getReadiness(as.engineer!, jobId);
    expect(before!.blockers.map((b) => b.code)).toEqual(["tcp_check_missing"]);
    const refused = await issueReport(as.engineer!, { jobId, password: PW }).then(
      () => "issued",
      (e: { status?: number; code?: string }) => `${e.status} ${e.code}`,
    );
    expect(refused).toBe("409 not_ready");

    // After approval the job takes a TCP check, and nothing else.
    await signInAs("installer@halvard.example");
    const uploadAfter = (kind: string, csv: string, name: string) =>
      upload(jobId, Buffer.from(csv), { kind, phase: "post", units: "mm" }, name);
    expect((await uploadAfter("sphere_probe", demoSphereProbeCsv(), "late-probe.csv")).status).toBe(409);
    const up = await uploadAfter("tcp_check", demoTcpCheckCsv(), "tcp-after.csv");
    expect(up.status).toBe(201);
    // The new data makes the work signatures stale: performed and inspected are signed again.
    expect((await getReadiness(as.engineer!, jobId))!.blockers.map((b) => b.code)).toEqual([
      "signature_stale",
      "signature_stale",
    ]);
    await signPerformedAndInspected(as, jobId);
    expect((await getReadiness(as.engineer!, jobId))!.ready).toBe(true);
    const { reportId } = await issueReport(as.engineer!, { jobId, password: PW });
    const content = await getReportContent(as.engineer!, reportId);
    expect(content?.controlValues?.tcpCheck?.decision).toBe("pass");
    expect(content?.controlValues?.tcpCheck?.rows).toHaveLength(4);
    expect(content?.controlValues?.tcpCheck?.file).toBe("tcp-after.csv");
    // Each judged figure says the rule and where the procedure's limit comes from.
    expect(content?.controlValues?.tcpCheck?.rows.map((r) => r.basis)).toEqual(
      Array(4).fill("Rule: simple; limit: Maker's manual: Head data sheet, TCP figures"),
    );
  }, 60_000);

  it("refuses a TCP check with every row at one pose, naming what is missing", async () => {
    await signInAs("installer@halvard.example");
    const res = await upload(
      ids.marlow,
      Buffer.from("primary_deg,secondary_deg,x,y,z\n0,0,1,2,3\n0,0,1,2,3.001\n"),
      { kind: "tcp_check", phase: "post", units: "mm" },
      "one-pose.csv",
    );
    expect(res.status).toBe(422);
    expect(JSON.stringify(await res.json())).toMatch(/pose/);
  });
});

describe("the demo (invented data)", () => {
  it("TR-2026-0059 carries as found, an approved fit, values to enter, as left and a passing TCP check", async () => {
    const jobId = await jobIdByReference("TR-2026-0059");
    await signInAs("inspector@halvard.example");
    const body = await (await get(jobId)).json();
    expect(body.asFound).not.toBeNull();
    expect(body.approved).not.toBeNull();
    expect(body.asLeft.analysisId).toBe(body.approved.analysisId);
    expect(body.rows.filter((r: { toEnter: number | null }) => r.toEnter !== null)).toHaveLength(7);
    expect(body.flagged).toEqual([]);
    const { latestBudgetInputs } = await import("@/db/queries/budget");
    expect((await latestBudgetInputs(body.approved.analysisId))?.inputs).toMatchObject({
      uProbeUm: 0.5,
      uSphereUm: 0.2,
      uToolUm: 2,
      deltaTK: 1,
    });
    const [job] = await db.select({ templateId: jobs.templateId }).from(jobs).where(eq(jobs.id, jobId));
    const tcp = await jobTcpChecks(jobId, job!.templateId);
    expect(tcp.limits).toEqual({ required: true, rangeLimitUm: 15, deviationLimitUm: 10 });
    expect(tcp.checks.map((c) => [c.view.poses, c.view.decision])).toEqual([[60, "pass"]]);
    expect((await getReadiness(as.engineer!, jobId))!.blockers.map((b) => b.code)).not.toContain(
      "tcp_check_missing",
    );
  });
});
