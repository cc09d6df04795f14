// A procedure of the test's own run end to end on a new job, through the real route handlers and
// the real database: an engineer writes a procedure with a multi-point step, a yes/no check, a
// recorded torque and a reading that asks for a photo; the administrator opens a job on it for the
// demo installer (who is e-mailed through the outbox); the installer records every step; the
// readiness check asks for the photo until it is added; and the draft report, read back with
// poppler's pdftotext (an independent reader), shows each result and lists the photo.
import { eq } from "drizzle-orm";
import { PNG } from "pngjs";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as createJobRoute } from "@/app/api/jobs/route";
import { GET as jobRoute } from "@/app/api/jobs/[id]/route";
import { POST as photoRoute } from "@/app/api/jobs/[id]/photos/route";
import { GET as readinessRoute } from "@/app/api/jobs/[id]/readiness/route";
import { POST as readingsRoute } from "@/app/api/jobs/[id]/readings/route";
import { GET as draftRoute } from "@/app/api/jobs/[id]/report/draft/route";
import { POST as createProcedureRoute } from "@/app/api/procedures/route";
import { db } from "@/db";
import { heads, outbox, readings, users } from "@/db/schema";
import { getJobDetail } from "@/db/queries/jobs";
import { buildReportData } from "@/db/queries/reports";
import { pdfText } from "../pdf-tools";
import {
  BASE_JOB,
  WHO,
  instrumentIdBySerial,
  signInActor,
  stepIdsByPosition,
  type JobBase,
} from "./fixtures";
import { formPost, jsonBody, request, signInAs } from "./helpers";
import { jobBaseOf } from "./ready-job";

const p = (id: string) => ({ params: Promise.resolve({ id }) });

/** The points entered on the run-out step, mm, read with the demo digital indicator (0.001 mm). */
const POINTS = { "12": "0.004", "3": "-0.003", "6": "0.009", "9": "0.001" };
/**
 * Total indicator reading = largest − smallest reading over the turn (ASME B89.3.4 and ISO 230-1
 * define run-out this way), worked by hand from POINTS: 0.009 (at 6) − (−0.003) (at 3) = 0.012 mm.
 */
const TIR_MM = 0.012;
/** The torque recorded on the record step, N·m (not judged: the step has no limit). */
const TORQUE = "85";
/** The direct reading on the photo step, mm, inside its 0 … 0.005 mm limit. */
const PLAY_MM = "0.003";

let base: JobBase;
let installerId = "";
let templateId = "";
let jobId = "";
let reference = "";
let step: Record<number, string> = {};
let indicator = "";
let directReadingId = "";
let photoSha = "";

const postReading = async (body: Record<string, unknown>) => {
  const res = await readingsRoute(request(`/api/jobs/${jobId}/readings`, jsonBody("POST", body)), p(jobId));
  return { status: res.status, reading: (await res.json()).reading };
};

/** The photo_missing blockers GET /api/jobs/{id}/readiness lists, asked as the engineer. */
async function photoBlockers(): Promise<string[]> {
  await signInAs(WHO.engineer);
  const res = await readinessRoute(request(`/api/jobs/${jobId}/readiness`), p(jobId));
  expect(res.status).toBe(200);
  return ((await res.json()).blockers as { code: string; message: string }[])
    .filter((b) => b.code === "photo_missing")
    .map((b) => b.message);
}

beforeAll(async () => {
  base = await jobBaseOf(BASE_JOB);
  const [installer] = await db.select().from(users).where(eq(users.email, WHO.installer));
  installerId = installer!.id;
  indicator = await instrumentIdBySerial("DI-0208");
});

describe("a new procedure with a multi-point, a yes/no and a photo step, run end to end on a new job", () => {
  it("the engineer writes the procedure (POST /api/procedures → 201)", async () => {
    const [head] = await db.select({ model: heads.model }).from(heads).where(eq(heads.id, base.headId));
    await signInAs(WHO.engineer);
    const res = await createProcedureRoute(
      request(
        "/api/procedures",
        jsonBody("POST", {
          name: `Collar and drawbar check ${Date.now().toString(36)}`,
          jobKind: "installation",
          headModel: head!.model,
          steps: [
            {
              title: "Collar run-out over one turn",
              kind: "multi_point",
              unit: "mm",
              upper: 0.02,
              points: ["12", "3", "6", "9"],
              pointResult: "tir",
              limitSource: "maker_manual",
              limitSourceNote: "Head builder's installation manual (invented demo figure)",
            },
            {
              title: "Clamp witness marks line up",
              kind: "check",
              limitSource: "maker_manual",
              limitSourceNote: "Head builder's installation manual",
            },
            { title: "Drawbar clamp screw torque", kind: "record", recordUnit: "N·m" },
            {
              title: "Spindle nose axial play",
              kind: "direct",
              unit: "mm",
              lower: 0,
              upper: 0.005,
              limitSource: "maker_manual",
              limitSourceNote: "Head builder's installation manual (invented demo figure)",
              photoRequired: true,
              safety:
                "Lock out the machine before reaching into the head; follow the builder's manual and local codes.",
            },
          ],
        }),
      ),
      undefined as never,
    );
    expect(res.status).toBe(201);
    const { procedure } = await res.json();
    expect(procedure.version).toBe(1);
    expect(procedure.steps.map((s: { derivation: string }) => s.derivation)).toEqual([
      "multi_point",
      "check",
      "record",
      "direct",
    ]);
    templateId = procedure.id;
    step = await stepIdsByPosition(templateId);
  });

  it("the administrator opens a job on it for the demo installer, who is e-mailed (POST /api/jobs → 201)", async () => {
    await signInAs(WHO.admin);
    const res = await createJobRoute(
      request(
        "/api/jobs",
        jsonBody("POST", {
          customerId: base.customerId,
          machineId: base.machineId,
          headId: base.headId,
          kind: "installation",
          title: "Collar and drawbar check, end-to-end test",
          templateId,
          decisionRule: "simple",
          assignedInstallerId: installerId,
        }),
      ),
      undefined,
    );
    expect(res.status).toBe(201);
    const { job } = await res.json();
    expect(job.status).toBe("draft");
    jobId = job.id;
    reference = job.reference;
    const mails = await db.select().from(outbox).where(eq(outbox.jobId, jobId));
    expect(mails).toHaveLength(1);
    expect(mails[0]).toMatchObject({ toAddress: WHO.installer, status: "pending" });
    expect(mails[0]!.subject).toMatch(/is assigned to you$/);
    expect(mails[0]!.textBody).toContain(reference);
  });

  it("another tenant's customer is told the job does not exist (404)", async () => {
    await signInAs(WHO["customer (Tollan)"]);
    const job = await jobRoute(request(`/api/jobs/${jobId}`), p(jobId));
    expect(job.status).toBe(404);
    expect((await job.json()).error.code).toBe("not_found");
    const draft = await draftRoute(request(`/api/jobs/${jobId}/report/draft`), p(jobId));
    expect(draft.status).toBe(404);
  });

  it("the installer records the four points, stored as their TIR (largest − smallest)", async () => {
    await signInAs(WHO.installer);
    const r = await postReading({
      stepId: step[1],
      phase: "pre",
      unit: "mm",
      points: POINTS,
      instrumentId: indicator,
    });
    expect(r.status).toBe(201);
    expect(r.reading).toMatchObject({ kind: "multi_point", unit: "mm", decision: "pass" });
    expect(r.reading.inputs).toMatchObject({ highPoint: "6", lowPoint: "3" });
    const [stored] = await db.select().from(readings).where(eq(readings.id, r.reading.id));
    expect(stored!.value).toBeCloseTo(TIR_MM, 12);
    // The first reading starts the job.
    await signInAs(WHO.admin);
    expect((await (await jobRoute(request(`/api/jobs/${jobId}`), p(jobId))).json()).job.status).toBe(
      "measuring",
    );
  });

  it("the installer answers yes, records the torque and takes the direct reading", async () => {
    await signInAs(WHO.installer);
    const yes = await postReading({ stepId: step[2], phase: "pre", unit: "mm", answer: "yes" });
    expect(yes.status).toBe(201);
    expect(yes.reading).toMatchObject({ kind: "check", value: 1, textValue: "yes", decision: "pass" });
    const torque = await postReading({ stepId: step[3], phase: "pre", unit: "mm", value: TORQUE });
    expect(torque.status).toBe(201);
    expect(torque.reading).toMatchObject({ kind: "record", value: 85, unit: "N·m", decision: "no_limit" });
    const play = await postReading({
      stepId: step[4],
      phase: "pre",
      unit: "mm",
      value: PLAY_MM,
      instrumentId: indicator,
    });
    expect(play.status).toBe(201);
    expect(play.reading).toMatchObject({ value: 0.003, unit: "mm", decision: "pass" });
    directReadingId = play.reading.id;
  });

  it("readiness asks for the photo of step 4 until the installer adds one tied to its reading", async () => {
    expect(await photoBlockers()).toEqual([
      'Step 4 "Spindle nose axial play" needs a photo (the dial, the set-up or the shims); add it on the checklist.',
    ]);
    // A 64 × 48 PNG made by pngjs (an independent encoder), one flat colour.
    const png = new PNG({ width: 64, height: 48 });
    for (let i = 0; i < png.data.length; i += 4) png.data.set([0x2e, 0x6b, 0x8f, 255], i);
    const fields = { stepId: step[4]!, phase: "pre", readingId: directReadingId };
    const file = { bytes: PNG.sync.write(png), type: "image/png", name: "dial.png" };
    await signInAs(WHO.installer);
    const res = await photoRoute(formPost(`/api/jobs/${jobId}/photos`, fields, file), p(jobId));
    expect(res.status).toBe(201);
    const { photo } = await res.json();
    expect(photo).toMatchObject({ stepId: step[4], readingId: directReadingId, width: 64, height: 48 });
    expect(await photoBlockers()).toEqual([]);
    photoSha = photo.sha256;
  });

  it("the report's data shows the TIR, Yes, the torque with its unit and lists the photo", async () => {
    const engineer = await signInActor(WHO.engineer);
    const d = await getJobDetail(engineer, jobId);
    const { data } = await buildReportData(engineer, d!, {
      reportId: "draft",
      revision: 1,
      issuedAt: new Date(),
      draft: true,
    });
    const row = (title: string) => data.readings.find((r) => r.step === title);
    expect(row("Collar run-out over one turn")).toMatchObject({ pre: "0.012 mm TIR", decision: "pass" });
    expect(row("Clamp witness marks line up")).toMatchObject({ pre: "Yes", decision: "pass" });
    expect(row("Drawbar clamp screw torque")).toMatchObject({ pre: "85 N·m", decision: "recorded" });
    expect(row("Spindle nose axial play")).toMatchObject({ pre: "0.003 mm", decision: "pass" });
    expect(data.photos).toEqual([
      expect.objectContaining({
        step: "4 Spindle nose axial play",
        phase: "before adjustment",
        size: "64 × 48 px",
        sha256: photoSha,
      }),
    ]);
  });

  it("the draft PDF (GET /api/jobs/{id}/report/draft) prints the same, read back with pdftotext", async () => {
    await signInAs(WHO.engineer);
    const res = await draftRoute(request(`/api/jobs/${jobId}/report/draft`), p(jobId));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    const text = pdfText(Buffer.from(await res.arrayBuffer()), true);
    expect(text).toContain(reference);
    // No sphere-probe data, no fit: the method names the readings only.
    expect(text).toContain("Method Indicator readings against the checklist limits Decision rule");
    expect(text).not.toContain("kinematic fit from sphere-probe data");
    for (const s of ["Collar run-out over one turn", "0.012 mm TIR", "Yes", "85 N·m", "0.003 mm"])
      expect(text).toContain(s);
    expect(text).toContain("Appendix: photos kept with the record");
    expect(text).toMatch(
      /Step 4 Spindle nose axial play, before adjustment, .*, 64 × 48 px SHA-256 [0-9a-f]{64}/,
    );
    expect(text).toContain(`SHA-256 ${photoSha}`);
  }, 60_000);
});
