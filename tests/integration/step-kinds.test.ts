// Every kind of checklist step posted through POST /api/jobs/{id}/readings against the real
// database: what is stored per kind, the 422 that names the point or field, and the instrument's
// range. The job follows the seeded after-collision procedure (one step of each kind).
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as readingsPost, GET as readingsGet } from "@/app/api/jobs/[id]/readings/route";
import { db } from "@/db";
import { auditEvents, instruments, readings } from "@/db/schema";
import { request, signInAs } from "./helpers";
import { jobLike } from "./tablet-helpers";

let jobId: string;
const step: Record<number, string> = {};
let dti: string;
let narrow: string;

async function post(body: Record<string, unknown>) {
  const res = await readingsPost(
    request(`/api/jobs/${jobId}/readings`, {
      method: "POST",
      body: JSON.stringify(body),
      headers: { "content-type": "application/json" },
    }),
    { params: Promise.resolve({ id: jobId }) },
  );
  return { status: res.status, json: await res.json() };
}

beforeAll(async () => {
  const job = await jobLike("TR-2026-0057", "measuring", "TR-KND");
  jobId = job.id;
  Object.assign(step, job.steps);
  dti = (await db.select().from(instruments).where(eq(instruments.serial, "DTI-0112")))[0]!.id;
  // An indicator of our own with a narrow range (±0.05 mm), so the range refusal is shown.
  const [n] = await db
    .insert(instruments)
    .values({
      kind: "Dial test indicator",
      serial: `DTI-RNG-${Date.now().toString(36)}`,
      quantityKind: "length",
      resolution: 0.001,
      standardUncertainty: 0.001,
      calibrationDueOn: "2099-01-01",
      rangeMin: -0.05,
      rangeMax: 0.05,
    })
    .returning();
  narrow = n!.id;
});

describe("each kind of step", () => {
  it("stores a yes/no check as 1/0 with the word, judged pass for yes and fail for no", async () => {
    await signInAs("installer@halvard.example");
    const yes = await post({ stepId: step[1], phase: "pre", answer: "yes", unit: "mm" });
    expect(yes.status).toBe(201);
    expect(yes.json.reading).toMatchObject({
      kind: "check",
      value: 1,
      textValue: "yes",
      unit: null,
      decision: "pass",
      instrument: null,
    });
    const no = await post({ stepId: step[1], phase: "post", answer: "no", unit: "mm" });
    expect(no.json.reading).toMatchObject({ value: 0, textValue: "no", decision: "fail" });
    const bad = await post({ stepId: step[1], phase: "pre", answer: "perhaps", unit: "mm" });
    expect(bad.status).toBe(422);
    const none = await post({ stepId: step[1], phase: "pre", unit: "mm" });
    expect(none.status).toBe(422);
    expect(none.json.error.issues).toEqual(
      expect.arrayContaining([expect.objectContaining({ field: "answer" })]),
    );
  });

  it("derives a multi-point TIR from the points (largest − smallest, ASME B89.3.4) and keeps every point", async () => {
    await signInAs("installer@halvard.example");
    const r = await post({
      stepId: step[2],
      phase: "pre",
      unit: "in",
      points: { "12": "0", "3": "0.0002", "6": "0.0004", "9": "-0.0001" },
      instrumentId: dti,
    });
    expect(r.status).toBe(201);
    // 0.0005 in × 25.4 = 0.0127 mm (NIST SP 811); the limit is 0.0005 in, so it passes at the limit.
    expect(r.json.reading.value).toBeCloseTo(0.0127, 12);
    expect(r.json.reading).toMatchObject({
      kind: "multi_point",
      unit: "mm",
      decision: "pass",
      entered: { unit: "in" },
    });
    expect(r.json.reading.inputs).toMatchObject({
      points: { "12": 0, "3": 0.0002, "6": 0.0004, "9": -0.0001 },
      highPoint: "6",
      lowPoint: "9",
    });
    const [stored] = await db.select().from(readings).where(eq(readings.id, r.json.reading.id));
    expect(stored!.enteredValue).toBeCloseTo(0.0005, 12);
    const audit = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entityId, r.json.reading.id), eq(auditEvents.action, "reading.recorded")));
    expect(audit[0]!.newValues).toMatchObject({ inputs: { points: { "6": 0.0004 } } });
  });

  it("answers 422 naming the point that is missing or not a number, and stores nothing", async () => {
    await signInAs("installer@halvard.example");
    const before = await db.select().from(readings).where(eq(readings.jobId, jobId));
    const r = await post({
      stepId: step[2],
      phase: "post",
      unit: "mm",
      points: { "12": "0", "3": "x", "6": "0.01" },
      instrumentId: dti,
    });
    expect(r.status).toBe(422);
    expect(r.json.error.message).toBe("The reading at 3 is not a number.");
    expect(r.json.error.issues).toEqual([
      { field: "points.3", message: "The reading at 3 is not a number." },
      { field: "points.9", message: "Enter the reading at 9." },
    ]);
    const noInst = await post({
      stepId: step[2],
      phase: "post",
      unit: "mm",
      points: { "12": 0, "3": 0, "6": 0, "9": 0 },
    });
    expect(noInst.status).toBe(422);
    expect(noInst.json.error.issues[0].field).toBe("instrumentId");
    expect(await db.select().from(readings).where(eq(readings.jobId, jobId))).toHaveLength(before.length);
  });

  it("refuses a point outside the instrument's range, naming it", async () => {
    await signInAs("installer@halvard.example");
    const r = await post({
      stepId: step[2],
      phase: "post",
      unit: "mm",
      points: { "12": 0, "3": 0.02, "6": 0.08, "9": 0 },
      instrumentId: narrow,
    });
    expect(r.status).toBe(422);
    expect(r.json.error.issues[0]).toMatchObject({ field: "points.6" });
    expect(r.json.error.message).toMatch(/at 6 is outside the instrument's range/);
    const ok = await post({
      stepId: step[2],
      phase: "post",
      unit: "mm",
      points: { "12": 0, "3": 0.02, "6": 0.04, "9": 0 },
      instrumentId: narrow,
    });
    expect(ok.status).toBe(201);
  });

  it("keeps a record value in the step's unit with where it applies, not judged", async () => {
    await signInAs("installer@halvard.example");
    const r = await post({
      stepId: step[4],
      phase: "post",
      unit: "mm",
      value: "0.05",
      text: "two shims at 3 o'clock",
    });
    expect(r.status).toBe(201);
    expect(r.json.reading).toMatchObject({
      kind: "record",
      value: 0.05,
      unit: "mm",
      textValue: "two shims at 3 o'clock",
      decision: "no_limit",
    });
    const torque = await post({ stepId: step[3], phase: "post", unit: "mm", value: "85" });
    expect(torque.json.reading).toMatchObject({
      value: 85,
      unit: "N·m",
      entered: { value: 85, unit: "N·m" },
    });
    const empty = await post({ stepId: step[3], phase: "post", unit: "mm", value: "" });
    expect(empty.status).toBe(422);
    expect(empty.json.error.issues[0]).toEqual({ field: "value", message: "Enter the value in N·m." });
  });

  it("stores a note as its text, and refuses an empty one", async () => {
    await signInAs("installer@halvard.example");
    const r = await post({
      stepId: step[6],
      phase: "pre",
      unit: "mm",
      text: "Collar face dented at 9 o'clock.",
    });
    expect(r.status).toBe(201);
    expect(r.json.reading).toMatchObject({
      kind: "note",
      value: 0,
      textValue: "Collar face dented at 9 o'clock.",
      decision: "no_limit",
    });
    const empty = await post({ stepId: step[6], phase: "pre", unit: "mm", text: "   " });
    expect(empty.status).toBe(422);
    expect(empty.json.error.issues[0].field).toBe("text");
  });

  it("lists every kind back with its kind and text", async () => {
    await signInAs("installer@halvard.example");
    const res = await readingsGet(request(`/api/jobs/${jobId}/readings`), {
      params: Promise.resolve({ id: jobId }),
    });
    const kinds = new Set(((await res.json()).readings as { kind: string }[]).map((r) => r.kind));
    expect([...kinds].sort()).toEqual(["check", "multi_point", "note", "record"]);
  });
});
