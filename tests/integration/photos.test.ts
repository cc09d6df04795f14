// Photos of a step against the real database and storage: content checked by the image's bytes
// (a renamed text file is refused), re-encoded with its size measured, a repeated send stored
// once, linked to its reading, and who may fetch it — per role and tenant, written by hand.
import { eq } from "drizzle-orm";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as listRoute, POST as uploadRoute } from "@/app/api/jobs/[id]/photos/route";
import { GET as imageRoute } from "@/app/api/photos/[id]/route";
import { GET as thumbRoute } from "@/app/api/photos/[id]/thumb/route";
import { GET as readinessRoute } from "@/app/api/jobs/[id]/readiness/route";
import { db } from "@/db";
import { auditEvents, jobs, photos, templateSteps } from "@/db/schema";
import { postReading, refusalOf, WHO, type Who } from "./fixtures";
import { formPost, jobIdByReference, request, signInAs } from "./helpers";
import { jobLike } from "./tablet-helpers";
import { getReadiness } from "@/db/queries/readiness";
import { jobStateSha256, preIssueSignatures, signJobWork } from "@/db/queries/signatures";
import { getActor } from "@/db/queries/users";

let jobId: string; // measuring, Marlow Creek, the demo installer assigned
let issuedJobId: string; // TR-2026-0041, issued, Marlow Creek
let stepId: string;
let issuedStepId: string;
let png: Buffer;

const p = (id: string) => ({ params: Promise.resolve({ id }) });

function photoRequest(id: string, file: Buffer | null, fields: Record<string, string>, type = "image/png") {
  return formPost(`/api/jobs/${id}/photos`, fields, file && { bytes: file, type, name: "photo.png" });
}
const upload = (id: string, file: Buffer | null, fields: Record<string, string>, type?: string) =>
  uploadRoute(photoRequest(id, file, fields, type), p(id));

async function newJob(templateRef: string, status: "measuring" | "issued") {
  const job = await jobLike(templateRef, status, "TR-PHO");
  return { id: job.id, stepId: job.steps[1]! };
}

beforeAll(async () => {
  ({ id: jobId, stepId } = await newJob("TR-2026-0057", "measuring"));
  issuedJobId = await jobIdByReference("TR-2026-0041");
  // A 640 × 480 PNG made by sharp (an independent encoder of the test's own input).
  png = await sharp({
    create: { width: 640, height: 480, channels: 3, background: { r: 200, g: 60, b: 20 } },
  })
    .png()
    .toBuffer();
  const [s] = await db
    .select()
    .from(templateSteps)
    .where(
      eq(
        templateSteps.templateId,
        (await db.select().from(jobs).where(eq(jobs.id, issuedJobId)))[0]!.templateId!,
      ),
    );
  issuedStepId = s!.id;
});

describe("adding a photo", () => {
  it("stores a re-encoded JPEG with its size, audited, and a thumbnail no larger than 320 px", async () => {
    await signInAs("installer@halvard.example");
    const res = await upload(jobId, png, { stepId, phase: "pre" });
    expect(res.status).toBe(201);
    const { photo } = await res.json();
    expect(photo).toMatchObject({
      width: 640,
      height: 480,
      stepId,
      phase: "pre",
      uploadedBy: expect.any(String),
    });
    const img = await imageRoute(request(photo.url), p(photo.id));
    expect(img.headers.get("content-type")).toBe("image/jpeg");
    const bytes = Buffer.from(await img.arrayBuffer());
    // JPEG files start with the SOI marker FF D8 FF (ISO/IEC 10918-1).
    expect([...bytes.subarray(0, 3)]).toEqual([0xff, 0xd8, 0xff]);
    const thumb = Buffer.from(await (await thumbRoute(request(photo.thumbUrl), p(photo.id))).arrayBuffer());
    const tm = await sharp(thumb).metadata();
    expect(tm.format).toBe("jpeg");
    expect(Math.max(tm.width!, tm.height!)).toBe(320);
    const audit = await db.select().from(auditEvents).where(eq(auditEvents.entityId, photo.id));
    expect(audit.map((a) => a.action)).toEqual(["photo.added"]);
  });

  it("refuses a text file sent as image/png, by its content (415), and stores nothing", async () => {
    await signInAs("installer@halvard.example");
    const before = await db.select().from(photos).where(eq(photos.jobId, jobId));
    const res = await upload(jobId, Buffer.from("x,y\n1,2\n"), { stepId, phase: "pre" }, "image/png");
    expect(res.status).toBe(415);
    expect((await res.json()).error.issues[0].field).toBe("file");
    // The PNG signature with garbage after it is not a photo either.
    const cut = await upload(jobId, png.subarray(0, 40), { stepId, phase: "pre" });
    expect(cut.status).toBe(415);
    expect(await db.select().from(photos).where(eq(photos.jobId, jobId))).toHaveLength(before.length);
  });

  it("a repeated clientId stores the photo once; a photo names its reading by the reading's clientId", async () => {
    await signInAs("installer@halvard.example");
    const readingClientId = crypto.randomUUID();
    const [check] = await db.select().from(templateSteps).where(eq(templateSteps.id, stepId));
    expect(check!.derivation).toBe("check");
    const r = await postReading(jobId, {
      stepId,
      phase: "pre",
      unit: "mm",
      answer: "yes",
      clientId: readingClientId,
    });
    expect(r.status).toBe(201);
    const readingId = r.json.reading.id;
    const clientId = crypto.randomUUID();
    const first = await upload(jobId, png, { stepId, phase: "pre", clientId, readingClientId });
    const again = await upload(jobId, png, { stepId, phase: "pre", clientId, readingClientId });
    expect([first.status, again.status]).toEqual([201, 200]);
    const a = (await first.json()).photo;
    expect((await again.json()).photo.id).toBe(a.id);
    expect(a.readingId).toBe(readingId);
    expect(await db.select().from(photos).where(eq(photos.clientId, clientId))).toHaveLength(1);
  });

  it("names the field that is wrong (422)", async () => {
    await signInAs("installer@halvard.example");
    const noStep = await upload(jobId, png, { phase: "pre" });
    expect(noStep.status).toBe(422);
    expect((await noStep.json()).error.issues[0].field).toBe("stepId");
    const badPhase = await upload(jobId, png, { stepId, phase: "during" });
    expect((await badPhase.json()).error.issues[0].field).toBe("phase");
    const otherStep = await upload(jobId, png, { stepId: issuedStepId, phase: "pre" });
    expect(otherStep.status).toBe(422);
    const noFile = await upload(jobId, null, { stepId, phase: "pre" });
    expect((await noFile.json()).error.issues[0].field).toBe("file");
    const wrongReading = await upload(jobId, png, { stepId, phase: "pre", readingId: crypto.randomUUID() });
    expect((await wrongReading.json()).error.issues[0].field).toBe("readingId");
  });
});

describe("a step that asks for a photo", () => {
  it("blocks the report until the step has a photo", async () => {
    await signInAs("installer@halvard.example");
    const [collar] = await db
      .select()
      .from(templateSteps)
      .where(
        eq(
          templateSteps.templateId,
          (await db.select().from(jobs).where(eq(jobs.id, jobId)))[0]!.templateId!,
        ),
      );
    const steps = await db
      .select()
      .from(templateSteps)
      .where(eq(templateSteps.templateId, collar!.templateId));
    const needs = steps.filter((s) => s.photoRequired).sort((a, b) => a.position - b.position);
    expect(needs.map((s) => s.position)).toEqual([2, 4]);
    const blockers = async () => {
      await signInAs("engineer@halvard.example");
      const res = await readinessRoute(request(`/api/jobs/${jobId}/readiness`), p(jobId));
      return ((await res.json()).blockers as { code: string; message: string }[])
        .filter((b) => b.code === "photo_missing")
        .map((b) => b.message.slice(0, 7));
    };
    expect(await blockers()).toEqual(["Step 2 ", "Step 4 "]);
    await signInAs("installer@halvard.example");
    expect((await upload(jobId, png, { stepId: needs[0]!.id, phase: "pre" })).status).toBe(201);
    expect(await blockers()).toEqual(["Step 4 "]);
  });
});

/**
 * Who may add and see photos. Adding follows the readings (the assigned installer or an engineer,
 * while the job is measuring); seeing follows the job, and a customer sees its own job's photos
 * only once the report is issued. Another tenant's photo is indistinguishable from a missing one.
 */
describe("photo access matrix", () => {
  /** Per role: [POST a photo, GET a photo of the measuring job, GET a photo of the issued job]. */
  const CELLS: Record<Who, [number, number, number]> = {
    anonymous: [401, 401, 401],
    admin: [403, 200, 200],
    installer: [201, 200, 200],
    inspector: [403, 200, 200],
    engineer: [201, 200, 200],
    "customer (Marlow Creek)": [403, 403, 200],
    "customer (Tollan)": [404, 404, 404],
  };
  let measuringPhoto: string;
  let issuedPhoto: string;

  beforeAll(async () => {
    await signInAs("installer@halvard.example");
    measuringPhoto = (await (await upload(jobId, png, { stepId, phase: "post" })).json()).photo.id;
    // A photo on the issued job, added the way the tablet did while it was measuring.
    const issued = await newJob("TR-2026-0041", "measuring");
    issuedPhoto = (await (await upload(issued.id, png, { stepId: issued.stepId, phase: "pre" })).json()).photo
      .id;
    await db.update(jobs).set({ status: "issued" }).where(eq(jobs.id, issued.id));
  });

  for (const who of Object.keys(WHO) as Who[]) {
    const [add, seeMeasuring, seeIssued] = CELLS[who];
    it(`${who}: POST photo ${add}, GET measuring ${seeMeasuring}, GET issued ${seeIssued}`, async () => {
      await signInAs(WHO[who]);
      const added = await upload(jobId, png, { stepId, phase: "post" });
      expect(added.status).toBe(add);
      for (const [id, want] of [
        [measuringPhoto, seeMeasuring],
        [issuedPhoto, seeIssued],
      ] as const) {
        const img = await imageRoute(request(`/api/photos/${id}`), p(id));
        const th = await thumbRoute(request(`/api/photos/${id}/thumb`), p(id));
        expect([img.status, th.status]).toEqual([want, want]);
        if (want === 404)
          expect(await img.json()).toEqual({ error: { code: "not_found", message: "No such photo." } });
      }
      const list = await listRoute(request(`/api/jobs/${jobId}/photos`), p(jobId));
      const expectList = seeMeasuring === 403 ? 200 : seeMeasuring;
      expect(list.status).toBe(expectList);
      if (expectList === 200) {
        const n = ((await list.json()).photos as unknown[]).length;
        // A customer gets an empty list before issue; staff see the photos.
        if (who.startsWith("customer")) expect(n).toBe(0);
        else expect(n).toBeGreaterThan(0);
      }
    });
  }
});

describe("photos and the work signatures", () => {
  it("a photo added after 'performed' and 'inspected' makes both stale: they vouch for the photos too", async () => {
    const job = await newJob("TR-2026-0057", "measuring");
    const installer = (await getActor((await signInAs("installer@halvard.example"))!))!;
    const inspector = (await getActor((await signInAs("inspector@halvard.example"))!))!;
    await signJobWork(installer, { jobId: job.id, meaning: "performed", password: "trammel-demo" });
    await signJobWork(inspector, { jobId: job.id, meaning: "inspected", password: "trammel-demo" });
    const codes = async () => (await getReadiness(inspector, job.id))!.blockers.map((b) => b.code);
    expect(await codes()).not.toContain("signature_stale");
    // Signing the same state again is refused, naming the meaning; nothing more is stored.
    const again = await refusalOf(
      signJobWork(installer, { jobId: job.id, meaning: "performed", password: "trammel-demo" }),
    );
    expect([again.status, again.message]).toEqual([
      422,
      "You have already signed this job as work performed.",
    ]);
    expect(await preIssueSignatures(job.id)).toHaveLength(2);
    const before = await jobStateSha256(job.id);

    await signInAs("installer@halvard.example");
    expect((await upload(job.id, png, { stepId: job.stepId, phase: "pre" })).status).toBe(201);
    const after = await jobStateSha256(job.id);
    expect(after).not.toBe(before);
    expect((await codes()).filter((c) => c === "signature_stale")).toHaveLength(2);

    // Signed again, the signatures cover the photo; the same photo sent again (same bytes, new id)
    // is a new record and makes them stale once more.
    await signJobWork(installer, { jobId: job.id, meaning: "performed", password: "trammel-demo" });
    await signJobWork(inspector, { jobId: job.id, meaning: "inspected", password: "trammel-demo" });
    expect(await codes()).not.toContain("signature_stale");
    await signInAs("installer@halvard.example");
    expect((await upload(job.id, png, { stepId: job.stepId, phase: "pre" })).status).toBe(201);
    expect((await codes()).filter((c) => c === "signature_stale")).toHaveLength(2);
  }, 60_000);
});
