// Sending readings from the tablet's queue: a repeated send of one clientId stores one reading,
// readings of one step from two devices are kept in device-time order with the later current,
// a correction can name the reading it replaces by its clientId, and a refusal is a 4xx that
// says why. Each test works on a job of its own, against the real database.
import { randomUUID } from "node:crypto";
import { asc, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { jobs, readings, users } from "@/db/schema";
import {
  BASE_JOB,
  insertTestJob,
  type JobBase,
  instrumentIdsBySerial,
  postReading,
  stepIdsByPosition,
  auditEventsOf,
} from "./fixtures";
import { signInAs } from "./helpers";
import { jobBaseOf } from "./ready-job";

const step: Record<number, string> = {};
const inst: Record<string, string> = {};
let installerId: string;
let base: JobBase;

const newJob = (status: "draft" | "measuring" | "in_review" = "measuring") =>
  insertTestJob({
    tag: "SYNC",
    title: "Sync test job",
    status,
    template: true,
    base,
    assignedInstallerId: installerId,
  });

const post = postReading;

const reading = (over: Record<string, unknown> = {}) => ({
  stepId: step[1],
  phase: "pre",
  value: "0.0004",
  unit: "in",
  instrumentId: inst["DTI-0112"],
  clientId: randomUUID(),
  deviceTime: new Date(Date.now() - 60_000).toISOString(),
  ...over,
});

async function stored(jobId: string) {
  return db.select().from(readings).where(eq(readings.jobId, jobId)).orderBy(asc(readings.deviceTime));
}

beforeAll(async () => {
  base = await jobBaseOf(BASE_JOB);
  const [u] = await db.select().from(users).where(eq(users.email, "installer@halvard.example"));
  installerId = u!.id;
  Object.assign(step, await stepIdsByPosition(base.templateId));
  Object.assign(inst, await instrumentIdsBySerial());
  await signInAs("installer@halvard.example");
});

describe("idempotent sync by clientId", () => {
  it("stores a clientId posted twice once: 201 then 200 with the same stored reading", async () => {
    const jobId = await newJob();
    const body = reading();
    const first = await post(jobId, body);
    expect(first.status).toBe(201);
    expect(first.json.reading.clientId).toBe(body.clientId);
    expect(first.json.reading).not.toHaveProperty("replay");
    const second = await post(jobId, body);
    expect(second.status).toBe(200);
    expect(second.json.reading.id).toBe(first.json.reading.id);
    const rows = await stored(jobId);
    expect(rows).toHaveLength(1);
    const audits = await auditEventsOf({ jobId }, "reading.recorded");
    expect(audits).toHaveLength(1);
  });

  it("answers 200 with the stored reading even after the job has left measuring (a late retry)", async () => {
    const jobId = await newJob();
    const body = reading();
    const first = await post(jobId, body);
    expect(first.status).toBe(201);
    await db.update(jobs).set({ status: "in_review" }).where(eq(jobs.id, jobId));
    const again = await post(jobId, body);
    expect(again.status).toBe(200);
    expect(again.json.reading.id).toBe(first.json.reading.id);
  });

  it("refuses a clientId reused for a different step with 409, storing nothing", async () => {
    const jobId = await newJob();
    const body = reading();
    expect((await post(jobId, body)).status).toBe(201);
    const clash = await post(jobId, { ...body, stepId: step[2], value: "0.002" });
    expect(clash.status).toBe(409);
    expect(clash.json.error.message).toMatch(/clientId/);
    expect(await stored(jobId)).toHaveLength(1);
  });

  it("serves concurrent sends of one clientId with one stored reading", async () => {
    const jobId = await newJob();
    const body = reading();
    const results = await Promise.all([post(jobId, body), post(jobId, body), post(jobId, body)]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 200, 201]);
    expect(new Set(results.map((r) => r.json.reading.id)).size).toBe(1);
    expect(await stored(jobId)).toHaveLength(1);
  });
});

describe("two devices, one step", () => {
  it("keeps both readings; the later device time is current whichever arrives first", async () => {
    const jobId = await newJob();
    const t0 = Date.now() - 10 * 60_000;
    // Device B measured later but sends first (it had signal); device A's earlier reading arrives after.
    const b = await post(
      jobId,
      reading({ value: "0.0003", deviceTime: new Date(t0 + 120_000).toISOString() }),
    );
    const a = await post(jobId, reading({ value: "0.0006", deviceTime: new Date(t0).toISOString() }));
    expect([a.status, b.status]).toEqual([201, 201]);
    const rows = await stored(jobId);
    expect(rows.map((r) => r.id)).toEqual([a.json.reading.id, b.json.reading.id]);
    expect(rows[0]!.supersededById).toBe(b.json.reading.id);
    expect(rows[1]!.supersededById).toBeNull();
    expect(a.json.reading.supersededById).toBe(b.json.reading.id);
  });

  it("a later device time arriving last supersedes the earlier current reading", async () => {
    const jobId = await newJob();
    const t0 = Date.now() - 10 * 60_000;
    const a = await post(jobId, reading({ value: "0.0006", deviceTime: new Date(t0).toISOString() }));
    const b = await post(
      jobId,
      reading({ value: "0.0003", deviceTime: new Date(t0 + 60_000).toISOString() }),
    );
    const rows = await stored(jobId);
    expect(rows.map((r) => [r.id, r.supersededById])).toEqual([
      [a.json.reading.id, b.json.reading.id],
      [b.json.reading.id, null],
    ]);
    // The other phase is untouched by the supersession.
    const post_ = await post(jobId, reading({ phase: "post", deviceTime: new Date(t0).toISOString() }));
    expect(post_.json.reading.supersededById).toBeNull();
  });

  it("a correction names a reading that was itself queued by its clientId", async () => {
    const jobId = await newJob();
    const original = reading({ value: "0.0009" });
    await post(jobId, original);
    const fix = await post(
      jobId,
      reading({ value: "0.0004", note: "misread the dial", supersedesClientId: original.clientId }),
    );
    expect(fix.status).toBe(201);
    const rows = await stored(jobId);
    const old = rows.find((r) => r.clientId === original.clientId)!;
    expect(old.supersededById).toBe(fix.json.reading.id);
    const audit = await auditEventsOf({ jobId }, "reading.corrected");
    expect(audit).toHaveLength(1);
  });
});

describe("refusals on sync say why", () => {
  it("refuses a past-due instrument with 422 naming its due date, storing nothing", async () => {
    const jobId = await newJob();
    const r = await post(jobId, reading({ instrumentId: inst["DTI-0417"] }));
    expect(r.status).toBe(422);
    expect(r.json.error.message).toMatch(/DTI-0417 was due for calibration on 2026-09-30/);
    expect(await stored(jobId)).toHaveLength(0);
  });

  it("refuses a reading for a job no longer measuring with 403 naming its status", async () => {
    const jobId = await newJob("in_review");
    const r = await post(jobId, reading());
    expect(r.status).toBe(403);
    expect(r.json.error.message).toMatch(/in review.*locked/i);
    expect(await stored(jobId)).toHaveLength(0);
  });

  it("refuses a device clock far ahead of the server's with 422", async () => {
    const jobId = await newJob();
    const r = await post(jobId, reading({ deviceTime: new Date(Date.now() + 3_600_000).toISOString() }));
    expect(r.status).toBe(422);
    expect(r.json.error.message).toMatch(/clock/);
  });

  it("refuses a clientId that is not a UUID with 422", async () => {
    const jobId = await newJob();
    const r = await post(jobId, reading({ clientId: "not-a-uuid" }));
    expect(r.status).toBe(422);
  });
});
