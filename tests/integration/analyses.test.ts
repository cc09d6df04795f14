// Head fits run on the server from stored datasets: stored with their input hash and re-used,
// approval by engineers only (and only in review), tenant isolation, and the page's numbers equal
// to geometry's own JSON (headFitToJson) of the same data. Job of its own; other tests' data untouched.
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as getRoute } from "@/app/api/analyses/[id]/route";
import { parameterRows } from "@/lib/fit-display";
import { signed } from "@/lib/numbers";
import { db } from "@/db";
import { approveAnalysis, getApprovedAnalysis, runHeadFit } from "@/db/queries/analyses";
import { getDatasetOriginal } from "@/db/queries/datasets";
import { changeJobStatus } from "@/db/queries/job-status";
import { demoSphereProbeCsv } from "@/db/seed-analyses";
import { analyses, auditEvents, jobs, signatures } from "@/db/schema";
import { fitHead, GEOMETRY_VERSION, headFitToJson, readSphereProbeCsv } from "@/geometry";
import { canonicalJson } from "@/lib/canonical-json";
import { AppError } from "@/lib/errors";
import { upload } from "./dataset-helpers";
import { actorsBeforeAll, insertTestJob, uploadDemoProbe, auditEventsOf, runFit as run } from "./fixtures";
import { request, signInAs } from "./helpers";

const p = (id: string) => ({ params: Promise.resolve({ id }) });
const read = (id: string) => getRoute(request(`/api/analyses/${id}`), p(id));

const as = actorsBeforeAll();
let jobId = "";
let datasetId = "";
let analysisId = "";

async function status(promise: Promise<unknown>): Promise<number> {
  try {
    await promise;
    return 200;
  } catch (e) {
    if (e instanceof AppError) return e.status;
    throw e;
  }
}

beforeAll(async () => {
  jobId = await insertTestJob({
    tag: "FIT",
    title: "Head fit test job",
  });
  datasetId = await uploadDemoProbe(jobId);
});

describe("running a fit", () => {
  it("stores the analysis with its input hash and re-uses it on the second POST", async () => {
    await signInAs("inspector@halvard.example");
    const first = await run(datasetId);
    expect(first.status).toBe(201);
    const a = (await first.json()).analysis;
    analysisId = a.id;
    // The hash, built here independently of db/queries: SHA-256(dataset sha ‖ "\n" ‖ canonical JSON of options and head).
    const fileSha = createHash("sha256").update(demoSphereProbeCsv()).digest("hex");
    expect(a.datasetSha256).toBe(fileSha);
    const head = { primary: "C", secondary: "A", pivotLengthMm: 152.4, toolDirection: [0, 0, -1] };
    expect(a.inputSha256).toBe(
      createHash("sha256")
        .update(fileSha)
        .update("\n")
        .update(canonicalJson({ options: { maxIterations: 50 }, head }))
        .digest("hex"),
    );
    expect(a.geometryVersion).toBe(GEOMETRY_VERSION);

    await signInAs("engineer@halvard.example");
    const second = await run(datasetId);
    expect(second.status).toBe(200);
    const b = await second.json();
    expect(b.reused).toBe(true);
    expect(b.analysis.id).toBe(analysisId);
    expect(await db.select().from(analyses).where(eq(analyses.datasetId, datasetId))).toHaveLength(1);
    const created = await auditEventsOf({ entityId: analysisId }, "analysis.created");
    expect(created).toHaveLength(1);
  });

  it("the numbers the page shows equal geometry's JSON (headFitToJson) of the same stored file", async () => {
    await signInAs("engineer@halvard.example");
    const api = (await (await read(analysisId)).json()).analysis;
    const original = await getDatasetOriginal(as.engineer!, datasetId);
    const data = readSphereProbeCsv(original!.data.toString("utf8"), { units: "mm" });
    const own = headFitToJson(
      fitHead({ primary: "C", secondary: "A", pivotLengthMm: 152.4, toolDirection: [0, 0, -1] }, data, {
        maxIterations: 50,
      }),
    );
    expect(api.fit).toEqual(JSON.parse(JSON.stringify(own)));
    const rows = parameterRows(api.fit);
    own.parameters.forEach((q, i) => {
      expect(rows[i]!.key).toBe(q.key);
      expect(rows[i]!.iso).toBe(q.iso);
      expect(rows[i]!.value).toBe(q.value);
      expect(rows[i]!.valueText).toBe(
        q.U === null ? "held at 0" : `${signed(q.value, 2)} ${q.unit === "um" ? "µm" : "″"}`,
      );
      expect(rows[i]!.UText).toBe(q.U === null ? "—" : `± ${q.U.toFixed(2)} ${q.unit === "um" ? "µm" : "″"}`);
    });
    // Per-pose residuals beside geometry's JSON, one per row of the file.
    expect(api.poses.residual_um).toHaveLength(data.rows);
  });

  it("refuses a dataset that is not sphere-probe data, naming the reason (422)", async () => {
    await signInAs("installer@halvard.example");
    const up = await upload(
      jobId,
      Buffer.from("feature,characteristic,nominal,measured,lower_tol,upper_tol\nA,d,1,1.001,-0.01,0.01\n"),
      { kind: "test_part", phase: "post" },
      "tp.csv",
    );
    expect(up.status).toBe(201);
    await signInAs("engineer@halvard.example");
    const res = await run((await up.json()).id);
    expect(res.status).toBe(422);
    expect((await res.json()).error.message).toMatch(/sphere-probe/);
  });
});

describe("approval", () => {
  it("is refused while the job is measuring, even for an engineer (409)", async () => {
    expect(await status(approveAnalysis(as.engineer!, analysisId, "trammel-demo"))).toBe(409);
  });

  it("in review: only an engineer approves; other roles 403, another tenant's customer 404", async () => {
    await changeJobStatus(as.installer!, jobId, "in_review");
    expect(await status(approveAnalysis(as.admin!, analysisId, "trammel-demo"))).toBe(403);
    expect(await status(approveAnalysis(as.inspector!, analysisId, "trammel-demo"))).toBe(403);
    expect(await status(approveAnalysis(as.installer!, analysisId, "trammel-demo"))).toBe(403);
    expect(await status(approveAnalysis(as.buyer!, analysisId, "trammel-demo"))).toBe(403);
    expect(await status(approveAnalysis(as["buyer-tollan"]!, analysisId, "trammel-demo"))).toBe(404);
    // With probe data, a bare status change cannot approve: the approval must name a fit.
    const bare = await changeJobStatus(as.engineer!, jobId, "approved").then(
      () => null,
      (e: AppError) => e,
    );
    expect(bare?.status).toBe(403);
    expect(bare?.message).toMatch(/Analysis tab/);
    const [still] = await db.select({ status: jobs.status }).from(jobs).where(eq(jobs.id, jobId));
    expect(still!.status).toBe("in_review");

    // Approval is a signature (21 CFR 11.200: the signer enters the password again; ISO/IEC
    // 17025:2017 §7.8.2.1 o, the person authorizing is identified): without the password, or with
    // a wrong one, it is refused for that field and nothing changes.
    const approvalsBefore = await db
      .select({ id: signatures.id })
      .from(signatures)
      .where(and(eq(signatures.jobId, jobId), eq(signatures.meaning, "parameters_approved")));
    for (const pw of ["", "not-the-password"]) {
      const e = await approveAnalysis(as.engineer!, analysisId, pw).then(
        () => null,
        (err: AppError) => err,
      );
      expect(e?.status).toBe(422);
      expect(e?.issues?.[0]?.field).toBe("password");
    }
    const [unchanged] = await db.select({ status: jobs.status }).from(jobs).where(eq(jobs.id, jobId));
    expect(unchanged!.status).toBe("in_review");
    expect(await getApprovedAnalysis(as.engineer!, jobId)).toBeNull();
    expect(
      await db
        .select({ id: signatures.id })
        .from(signatures)
        .where(and(eq(signatures.jobId, jobId), eq(signatures.meaning, "parameters_approved"))),
    ).toEqual(approvalsBefore);

    const r = await approveAnalysis(as.engineer!, analysisId, "trammel-demo");
    expect(r).toEqual({ status: "approved", analysisId, signatureId: expect.any(String) });
    const [sig] = await db.select().from(signatures).where(eq(signatures.id, r.signatureId));
    expect(sig).toMatchObject({ meaning: "parameters_approved", signerId: as.engineer!.id, reportId: null });
    expect((sig!.manifest as { analysis?: { id: string } }).analysis?.id).toBe(analysisId);
    const [now] = await db.select({ status: jobs.status }).from(jobs).where(eq(jobs.id, jobId));
    expect(now!.status).toBe("approved");
    const events = await db.select().from(auditEvents).where(eq(auditEvents.jobId, jobId));
    expect(events.map((e) => e.action)).toEqual(
      expect.arrayContaining([
        "analysis.created",
        "signature.parameters_approved",
        "analysis.approved",
        "job.status_changed",
      ]),
    );
    expect((await getApprovedAnalysis(as.engineer!, jobId))?.detail.analysis.id).toBe(analysisId);
  });

  it("after approval no new fit is run (409) and a second approval is refused", async () => {
    expect(await status(runHeadFit(as.engineer!, datasetId))).toBe(409);
    expect(await status(approveAnalysis(as.engineer!, analysisId, "trammel-demo"))).toBe(409);
  });

  it("another tenant's customer gets 404 for the analysis and its dataset", async () => {
    await signInAs("buyer@tollan.example");
    expect((await read(analysisId)).status).toBe(404);
    expect((await run(datasetId)).status).toBe(404);
    expect(await getApprovedAnalysis(as["buyer-tollan"]!, jobId)).toBeNull();
  });
});
