// Every kind of checklist step posted through POST /api/jobs/{id}/readings against the real
// database: what is stored per kind, the 422 that names the point or field, and the instrument's
// range. The job follows the seeded after-collision procedure (one step of each kind).
import { eq } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it } from "vitest";
import { GET as readingsGet } from "@/app/api/jobs/[id]/readings/route";
import { db } from "@/db";
import { instruments, readings } from "@/db/schema";
import { postReading, auditEventsOf } from "./fixtures";
import { request, signInAs } from "./helpers";
import { jobLike } from "./tablet-helpers";

let jobId: string;
const step: Record<number, string> = {};
let dti: string;
let narrow: string;

const post = (body: Record<string, unknown>) => postReading(jobId, body);

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

/** Posts a reading that must be stored (201) and returns it. */
async function recorded(body: Record<string, unknown>) {
  const r = await post(body);
  expect(r.status).toBe(201);
  return r.json.reading;
}

/** Posts a reading that must be refused as unprocessable (422) and returns the error. */
async function refused(body: Record<string, unknown>) {
  const r = await post(body);
  expect(r.status).toBe(422);
  return r.json.error;
}

describe("each kind of step", () => {
  beforeEach(async () => {
    await signInAs("installer@halvard.example");
  });

  it("stores a yes/no check as 1/0 with the word, judged pass for yes and fail for no", async () => {
    expect(await recorded({ stepId: step[1], phase: "pre", answer: "yes", unit: "mm" })).toMatchObject({
      kind: "check",
      value: 1,
      textValue: "yes",
      unit: null,
      decision: "pass",
      instrument: null,
    });
    const no = await post({ stepId: step[1], phase: "post", answer: "no", unit: "mm" });
    expect(no.json.reading).toMatchObject({ value: 0, textValue: "no", decision: "fail" });
    await refused({ stepId: step[1], phase: "pre", answer: "perhaps", unit: "mm" });
    const none = await refused({ stepId: step[1], phase: "pre", unit: "mm" });
    expect(none.issues).toEqual(expect.arrayContaining([expect.objectContaining({ field: "answer" })]));
  });

  it("derives a multi-point TIR from the points (largest − smallest, ASME B89.3.4) and keeps every point", async () => {
    const reading = await recorded({
      stepId: step[2],
      phase: "pre",
      unit: "in",
      points: { "12": "0", "3": "0.0002", "6": "0.0004", "9": "-0.0001" },
      instrumentId: dti,
    });
    // 0.0005 in × 25.4 = 0.0127 mm (NIST SP 811); the limit is 0.0005 in, so it passes at the limit.
    expect(reading.value).toBeCloseTo(0.0127, 12);
    expect(reading).toMatchObject({
      kind: "multi_point",
      unit: "mm",
      decision: "pass",
      entered: { unit: "in" },
    });
    expect(reading.inputs).toMatchObject({
      points: { "12": 0, "3": 0.0002, "6": 0.0004, "9": -0.0001 },
      highPoint: "6",
      lowPoint: "9",
    });
    const [stored] = await db.select().from(readings).where(eq(readings.id, reading.id));
    expect(stored!.enteredValue).toBeCloseTo(0.0005, 12);
    const audit = await auditEventsOf({ entityId: reading.id }, "reading.recorded");
    expect(audit[0]!.newValues).toMatchObject({ inputs: { points: { "6": 0.0004 } } });
  });

  it("answers 422 naming the point that is missing or not a number, and stores nothing", async () => {
    const before = await db.select().from(readings).where(eq(readings.jobId, jobId));
    const error = await refused({
      stepId: step[2],
      phase: "post",
      unit: "mm",
      points: { "12": "0", "3": "x", "6": "0.01" },
      instrumentId: dti,
    });
    expect(error.message).toBe("The reading at 3 is not a number.");
    expect(error.issues).toEqual([
      { field: "points.3", message: "The reading at 3 is not a number." },
      { field: "points.9", message: "Enter the reading at 9." },
    ]);
    const noInst = await refused({
      stepId: step[2],
      phase: "post",
      unit: "mm",
      points: { "12": 0, "3": 0, "6": 0, "9": 0 },
    });
    expect(noInst.issues[0].field).toBe("instrumentId");
    expect(await db.select().from(readings).where(eq(readings.jobId, jobId))).toHaveLength(before.length);
  });

  it("refuses a point outside the instrument's range, naming it", async () => {
    const error = await refused({
      stepId: step[2],
      phase: "post",
      unit: "mm",
      points: { "12": 0, "3": 0.02, "6": 0.08, "9": 0 },
      instrumentId: narrow,
    });
    expect(error.issues[0]).toMatchObject({ field: "points.6" });
    expect(error.message).toMatch(/at 6 is outside the instrument's range/);
    await recorded({
      stepId: step[2],
      phase: "post",
      unit: "mm",
      points: { "12": 0, "3": 0.02, "6": 0.04, "9": 0 },
      instrumentId: narrow,
    });
  });

  it("keeps a record value in the step's unit with where it applies, not judged", async () => {
    expect(
      await recorded({
        stepId: step[4],
        phase: "post",
        unit: "mm",
        value: "0.05",
        text: "two shims at 3 o'clock",
      }),
    ).toMatchObject({
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
    const empty = await refused({ stepId: step[3], phase: "post", unit: "mm", value: "" });
    expect(empty.issues[0]).toEqual({ field: "value", message: "Enter the value in N·m." });
  });

  it("stores a note as its text, and refuses an empty one", async () => {
    expect(
      await recorded({ stepId: step[6], phase: "pre", unit: "mm", text: "Collar face dented at 9 o'clock." }),
    ).toMatchObject({
      kind: "note",
      value: 0,
      textValue: "Collar face dented at 9 o'clock.",
      decision: "no_limit",
    });
    const empty = await refused({ stepId: step[6], phase: "pre", unit: "mm", text: "   " });
    expect(empty.issues[0].field).toBe("text");
  });

  it("lists every kind back with its kind and text", async () => {
    const res = await readingsGet(request(`/api/jobs/${jobId}/readings`), {
      params: Promise.resolve({ id: jobId }),
    });
    const kinds = new Set(((await res.json()).readings as { kind: string }[]).map((r) => r.kind));
    expect([...kinds].sort()).toEqual(["check", "multi_point", "note", "record"]);
  });
});
