// The office's jobs API (POST /api/jobs, PATCH /api/jobs/{id}, GET /api/jobs?queue=) × every role
// and both tenants, against the real database. Expected answers are written out by hand from the
// product's rules (the office — administrator or engineer — opens, schedules, assigns, holds and
// cancels jobs; nobody else; another tenant's job is "not found"), not computed from lib/policy.
// Schedules are checked against the IANA time zone database's offsets (Europe/Berlin is UTC+2 in
// summer time, UTC+1 in winter; America/Chicago is UTC−6 in winter).
import { and, eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it, onTestFinished } from "vitest";
import { GET as listRoute, POST as createRoute } from "@/app/api/jobs/route";
import { GET as jobRoute, PATCH as patchRoute } from "@/app/api/jobs/[id]/route";
import { POST as readingRoute } from "@/app/api/jobs/[id]/readings/route";
import { db } from "@/db";
import { newJobChoices } from "@/db/queries/job-office";
import { auditEvents, heads, jobs, machines, outbox, procedureTemplates, sites, users } from "@/db/schema";
import { WHO, auditEventsOf, refusalOf, signInActor } from "./fixtures";
import { jobIdByReference, issueFields, jsonBody, request, signInAs } from "./helpers";

/** POST /api/jobs: the office opens jobs (201); everyone else is refused (401 anonymous, 403 others). */
const CREATE: Record<string, number> = {
  anonymous: 401,
  admin: 201,
  installer: 403,
  inspector: 403,
  engineer: 201,
  "customer (Marlow Creek)": 403,
  "customer (Tollan)": 403,
};
/**
 * PATCH /api/jobs/{id} on a draft of Marlow Creek: the office edits (200); the installer assigned
 * to it and Marlow Creek's own customer see the job but may not change it (403); the inspector sees
 * every job but keeps no record (403); Tollan's customer may not know it exists (404).
 */
const EDIT: Record<string, number> = {
  anonymous: 401,
  admin: 200,
  installer: 403,
  inspector: 403,
  engineer: 200,
  "customer (Marlow Creek)": 403,
  "customer (Tollan)": 404,
};

const p = (id: string) => ({ params: Promise.resolve({ id }) });
const create = (body: unknown) => createRoute(request("/api/jobs", jsonBody("POST", body)), undefined);
const patch = (id: string, body: unknown) =>
  patchRoute(request(`/api/jobs/${id}`, jsonBody("PATCH", body)), p(id));
const getJob = async (id: string) => (await (await jobRoute(request(`/api/jobs/${id}`), p(id))).json()).job;

const ids = { installer: "", second: "", machine: "", head: "", template: "", marlow: "" };
let base: Record<string, unknown> = {};

beforeAll(async () => {
  const seededJob = await jobIdByReference("TR-2026-0052");
  const [j] = await db.select().from(jobs).where(eq(jobs.id, seededJob));
  const [installer] = await db.select().from(users).where(eq(users.email, "installer@halvard.example"));
  ids.installer = installer!.id;
  // A second installer, for reassignment.
  const [second] = await db
    .insert(users)
    .values({
      email: `second-installer-${Date.now()}@halvard.example`,
      name: "Sofie Lind",
      role: "installer",
    })
    .returning();
  ids.second = second!.id;
  // A machine and head of the seeded Marlow Creek job; a current procedure that fits any kind and model.
  ids.machine = j!.machineId;
  ids.head = j!.headId;
  ids.marlow = j!.customerId;
  const [t] = await db
    .select({ id: procedureTemplates.id })
    .from(procedureTemplates)
    .where(
      and(
        eq(procedureTemplates.isCurrent, true),
        sql`${procedureTemplates.retiredAt} is null`,
        sql`${procedureTemplates.headModel} is null`,
        sql`(${procedureTemplates.jobKinds} is null or 'installation' = any(${procedureTemplates.jobKinds}))`,
      ),
    )
    .limit(1);
  ids.template = t!.id;
  base = {
    machineId: ids.machine,
    headId: ids.head,
    kind: "installation",
    title: "Head installation, office test",
    templateId: ids.template,
    decisionRule: "simple",
  };
});

async function newDraft(extra: Record<string, unknown> = {}): Promise<string> {
  await signInAs("admin@halvard.example");
  const res = await create({ ...base, ...extra });
  expect(res.status).toBe(201);
  return (await res.json()).job.id;
}

describe("POST /api/jobs", () => {
  for (const [who, email] of Object.entries(WHO))
    it(`${who} → ${CREATE[who]}`, async () => {
      await signInAs(email);
      const res = await create({ ...base, title: `Opened by ${who}` });
      expect(res.status).toBe(CREATE[who]);
      if (res.status === 201) {
        const { job } = await res.json();
        expect(job.reference).toMatch(/^TR-\d{4}-\d{4}$/);
        expect(job.status).toBe("draft");
        const events = await db.select().from(auditEvents).where(eq(auditEvents.entityId, job.id));
        expect(events.map((e) => e.action)).toEqual(["job.created"]);
      }
    });

  it("stores the schedule as the UTC instant of the wall-clock time in the named zone (IANA tzdata)", async () => {
    const id = await newDraft({
      orderReference: "PO-77812",
      customerContactName: "Dana Reyes",
      customerContactEmail: "dana.reyes@marlowcreek.example",
      scheduledDate: "2027-07-14",
      scheduledTime: "07:30",
      timeZone: "Europe/Berlin",
    });
    const job = await getJob(id);
    // Berlin keeps CEST (UTC+2) in July: 07:30 local is 05:30 UTC.
    expect(new Date(job.scheduledFor).toISOString()).toBe("2027-07-14T05:30:00.000Z");
    expect(job).toMatchObject({
      timeZone: "Europe/Berlin",
      orderReference: "PO-77812",
      customerContact: { name: "Dana Reyes", email: "dana.reyes@marlowcreek.example" },
    });
  });

  it("422 names the field: a missing title, a bad zone, a time skipped by the clocks, a half schedule", async () => {
    await signInAs("admin@halvard.example");
    const cases: [Record<string, unknown>, string][] = [
      [{ title: "" }, "title"],
      [{ scheduledDate: "2027-01-10", scheduledTime: "08:00", timeZone: "Mars/Olympus" }, "timeZone"],
      // Europe/Berlin goes from 02:00 to 03:00 on 2027-03-28 (last Sunday of March): 02:30 never happens.
      [{ scheduledDate: "2027-03-28", scheduledTime: "02:30", timeZone: "Europe/Berlin" }, "scheduledTime"],
      [{ scheduledDate: "2027-01-10" }, "scheduledTime"],
      [{ customerContactEmail: "not-an-address" }, "customerContactEmail"],
      [{ machineId: "not-a-uuid" }, "machineId"],
    ];
    for (const [extra, field] of cases) {
      const res = await create({ ...base, ...extra });
      expect(res.status, JSON.stringify(extra)).toBe(422);
      const body = await res.json();
      expect(body.error.issues.map((i: { field: string }) => i.field)).toContain(field);
    }
  });

  it("refuses a head mounted on another machine, a retired procedure and a non-installer (422 naming the field)", async () => {
    await signInAs("admin@halvard.example");
    const [other] = await db
      .select({ id: machines.id })
      .from(machines)
      .where(sql`${machines.id} <> ${ids.machine}`)
      .limit(1);
    const [mounted] = await db
      .select({ machineId: heads.machineId })
      .from(heads)
      .where(eq(heads.id, ids.head));
    if (mounted?.machineId) {
      const res = await create({ ...base, machineId: other!.id });
      expect(res.status).toBe(422);
      expect((await res.json()).error.issues[0].field).toBe("headId");
    }
    const [old] = await db
      .select({ id: procedureTemplates.id })
      .from(procedureTemplates)
      .where(eq(procedureTemplates.isCurrent, false))
      .limit(1);
    if (old) {
      const res = await create({ ...base, templateId: old.id });
      expect(res.status).toBe(422);
      expect((await res.json()).error.issues[0].field).toBe("templateId");
    }
    const [engineer] = await db.select().from(users).where(eq(users.email, "engineer@halvard.example"));
    const res = await create({ ...base, assignedInstallerId: engineer!.id });
    expect(res.status).toBe(422);
    expect((await res.json()).error.issues[0].field).toBe("assignedInstallerId");
  });

  it("another tenant's customer id with this machine is refused (the machine is not theirs)", async () => {
    await signInAs("admin@halvard.example");
    const [tollanJob] = await db
      .select()
      .from(jobs)
      .where(eq(jobs.id, await jobIdByReference("TR-2026-0048")));
    const res = await create({ ...base, customerId: tollanJob!.customerId });
    expect(res.status).toBe(422);
    expect((await res.json()).error.issues[0].field).toBe("machineId");
  });
});

describe("New job's choices", () => {
  it("offer the office every machine in use and none that is retired; nobody else gets them", async () => {
    const [site] = await db.select({ id: sites.id }).from(sites).limit(1);
    const tag = Date.now().toString(36);
    const made = await db
      .insert(machines)
      .values([
        { siteId: site!.id, name: `Choices in use ${tag}` },
        { siteId: site!.id, name: `Choices retired ${tag}`, retiredAt: new Date() },
      ])
      .returning({ id: machines.id, retiredAt: machines.retiredAt });
    onTestFinished(async () => {
      await db.delete(machines).where(sql`${machines.id} in ${made.map((m) => m.id)}`);
    });
    const [inUse, retired] = made;
    const offered = (await newJobChoices(await signInActor("engineer@halvard.example"))).machines.map(
      (m) => m.id,
    );
    expect(offered).toContain(inUse!.id);
    expect(offered).not.toContain(retired!.id);
    expect((await refusalOf(newJobChoices(await signInActor("installer@halvard.example")))).status).toBe(403);
  });
});

describe("PATCH /api/jobs/{id}: record fields per role and tenant", () => {
  let id = "";
  beforeAll(async () => {
    id = await newDraft({ assignedInstallerId: null });
    // The installer must see it to be refused with 403 rather than 404.
    await db.update(jobs).set({ assignedInstallerId: ids.installer }).where(eq(jobs.id, id));
  });
  for (const [who, email] of Object.entries(WHO))
    it(`${who} → ${EDIT[who]}`, async () => {
      await signInAs(email);
      const res = await patch(id, { orderReference: `PO-${who.length}` });
      expect(res.status).toBe(EDIT[who]);
      const [row] = await db.select().from(jobs).where(eq(jobs.id, id));
      if (res.status === 200) expect(row!.orderReference).toBe(`PO-${who.length}`);
      else expect(row!.orderReference).not.toBe(`PO-${who.length}`);
    });

  it("edits each record field, audits old and new values, and clears a field with an empty string", async () => {
    await signInAs("engineer@halvard.example");
    const res = await patch(id, {
      title: "Re-titled",
      notes: "Gate code 4411; crane booked",
      conditionAsFound: "Head mounted, covers on, no visible damage",
      nextRecheckOn: "2028-01-31",
      scheduledDate: "2027-01-12",
      scheduledTime: "06:45",
      timeZone: "America/Chicago",
    });
    expect(res.status).toBe(200);
    const { job } = await res.json();
    // Chicago keeps CST (UTC−6) in January: 06:45 local is 12:45 UTC.
    expect(new Date(job.scheduledFor).toISOString()).toBe("2027-01-12T12:45:00.000Z");
    expect(job).toMatchObject({
      title: "Re-titled",
      notes: "Gate code 4411; crane booked",
      conditionAsFound: "Head mounted, covers on, no visible damage",
      nextRecheckOn: "2028-01-31",
    });
    const [ev] = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entityId, id), eq(auditEvents.action, "job.updated")))
      .orderBy(sql`${auditEvents.id} desc`)
      .limit(1);
    expect(ev!.newValues).toMatchObject({ title: "Re-titled", timeZone: "America/Chicago" });
    expect((ev!.oldValues as Record<string, unknown>).title).toBe("Head installation, office test");
    const cleared = await (
      await patch(id, { notes: "", scheduledDate: "", scheduledTime: "", timeZone: "" })
    ).json();
    expect(cleared.job).toMatchObject({ notes: null, scheduledFor: null, timeZone: null });
  });

  it("an unknown field or a half schedule is 422 naming the field; nothing changes", async () => {
    await signInAs("admin@halvard.example");
    const before = await getJob(id);
    const unknown = await patch(id, { status: "issued" });
    expect(unknown.status).toBe(422);
    const half = await patch(id, { scheduledDate: "2027-02-02", timeZone: "Europe/Berlin" });
    expect(half.status).toBe(422);
    expect(await issueFields(half)).toEqual(["scheduledTime"]);
    expect(await getJob(id)).toEqual(before);
  });
});

describe("assignment e-mails through the outbox", () => {
  it("assigning on opening mails the installer; reassigning mails the new one and tells the old one", async () => {
    const id = await newDraft({
      assignedInstallerId: ids.installer,
      scheduledDate: "2027-07-14",
      scheduledTime: "07:30",
      timeZone: "Europe/Berlin",
    });
    const mails = async () => db.select().from(outbox).where(eq(outbox.jobId, id)).orderBy(outbox.createdAt);
    const first = await mails();
    expect(first).toHaveLength(1);
    expect(first[0]!.toAddress).toBe("installer@halvard.example");
    expect(first[0]!.subject).toMatch(/is assigned to you$/);
    expect(first[0]!.textBody).toContain("2027-07-14 07:30 GMT+2 (Europe/Berlin)");

    await signInAs("admin@halvard.example");
    const res = await patch(id, { assignedInstallerId: ids.second });
    expect(res.status).toBe(200);
    const after = await mails();
    expect(after).toHaveLength(3);
    const [second] = await db.select().from(users).where(eq(users.id, ids.second));
    const toNew = after.find((m) => m.toAddress === second!.email);
    const toOld = after.slice(1).find((m) => m.toAddress === "installer@halvard.example");
    expect(toNew?.subject).toMatch(/is assigned to you$/);
    expect(toOld?.subject).toMatch(/is no longer assigned to you$/);
    expect(toOld?.textBody).toContain("assigned it to Sofie Lind");
    const ev = await auditEventsOf({ entityId: id }, "job.assigned");
    expect(ev).toHaveLength(1);
    expect(ev[0]!.oldValues).toEqual({ assignedInstallerId: ids.installer });
    expect(ev[0]!.newValues).toEqual({ assignedInstallerId: ids.second });

    // The same installer again changes nothing and sends nothing.
    expect((await patch(id, { assignedInstallerId: ids.second })).status).toBe(200);
    expect(await mails()).toHaveLength(3);
  });
});

describe("hold, release and cancel", () => {
  /** A draft assigned to the demo installer, set straight to measuring in the table. */
  async function newMeasuringJob(): Promise<string> {
    const id = await newDraft({ assignedInstallerId: ids.installer });
    await db.update(jobs).set({ status: "measuring" }).where(eq(jobs.id, id));
    return id;
  }

  /** PATCHes the job as whoever is signed in, checks it answered 200 and returns the job it sent. */
  async function patched(id: string, body: Record<string, unknown>) {
    const res = await patch(id, body);
    expect(res.status, JSON.stringify(body)).toBe(200);
    return (await res.json()).job;
  }

  it("hold remembers the status it left and release restores it; both audited", async () => {
    const id = await newMeasuringJob();
    await signInAs("admin@halvard.example");
    expect(await patched(id, { action: "hold", reason: "Crane out of service" })).toMatchObject({
      status: "on_hold",
      heldFromStatus: "measuring",
      holdReason: "Crane out of service",
    });
    // Held twice is refused; the installer cannot record readings meanwhile.
    expect((await patch(id, { action: "hold" })).status).toBe(403);
    await signInAs("installer@halvard.example");
    expect((await patch(id, { action: "release" })).status).toBe(403);
    await signInAs("engineer@halvard.example");
    expect(await patched(id, { action: "release" })).toMatchObject({
      status: "measuring",
      heldFromStatus: null,
    });
    const events = await db
      .select({
        action: auditEvents.action,
        oldValues: auditEvents.oldValues,
        newValues: auditEvents.newValues,
      })
      .from(auditEvents)
      .where(eq(auditEvents.entityId, id))
      .orderBy(auditEvents.id);
    expect(events.slice(-2)).toEqual([
      {
        action: "job.held",
        oldValues: { status: "measuring" },
        newValues: { status: "on_hold", reason: "Crane out of service" },
      },
      { action: "job.released", oldValues: { status: "on_hold" }, newValues: { status: "measuring" } },
    ]);
  });

  it("cancel needs a reason; a cancelled job stays readable and refuses every write, readings included", async () => {
    const id = await newMeasuringJob();
    await signInAs("admin@halvard.example");
    const noReason = await patch(id, { action: "cancel" });
    expect(noReason.status).toBe(422);
    expect((await noReason.json()).error.issues[0].field).toBe("reason");
    await signInAs("installer@halvard.example");
    expect((await patch(id, { action: "cancel", reason: "Customer postponed" })).status).toBe(403);
    await signInAs("admin@halvard.example");
    expect(
      await patched(id, { action: "cancel", reason: "Customer postponed the machine move" }),
    ).toMatchObject({
      status: "cancelled",
      cancelReason: "Customer postponed the machine move",
    });
    // Still readable by the office, the installer and the customer it belongs to.
    for (const email of ["admin@halvard.example", "installer@halvard.example", "buyer@marlowcreek.example"]) {
      await signInAs(email);
      expect((await jobRoute(request(`/api/jobs/${id}`), p(id))).status).toBe(200);
    }
    // Every office write is refused.
    await signInAs("admin@halvard.example");
    for (const body of [
      { title: "Revived" },
      { assignedInstallerId: ids.second },
      { action: "hold" },
      { action: "release" },
      { action: "cancel", reason: "Cancel it again" },
    ]) {
      const res = await patch(id, body);
      expect(res.status, JSON.stringify(body)).toBe(403);
    }
    // The assigned installer cannot record a reading on it.
    await signInAs("installer@halvard.example");
    const [step] = (
      await db.execute<{ id: string }>(
        sql`select s.id from template_steps s join jobs j on j.template_id = s.template_id where j.id = ${id} limit 1`,
      )
    ).rows;
    const [instrument] = (await db.execute<{ id: string }>(sql`select id from instruments limit 1`)).rows;
    const reading = await readingRoute(
      request(
        `/api/jobs/${id}/readings`,
        jsonBody("POST", {
          stepId: step!.id,
          phase: "pre",
          value: 0.01,
          unit: "mm",
          instrumentId: instrument!.id,
        }),
      ),
      p(id),
    );
    expect(reading.status).toBe(403);
    expect((await reading.json()).error.message).toMatch(/cancelled/);
    const [row] = await db.select().from(jobs).where(eq(jobs.id, id));
    expect(row).toMatchObject({ status: "cancelled", title: "Head installation, office test" });
  });

  it("a cancelled job refuses a saved 3D view too (nothing stored)", async () => {
    const { saveAnalysisView } = await import("@/db/queries/analysis-views");
    const { getActor } = await import("@/db/queries/users");
    const [a] = (
      await db.execute<{ id: string; job_id: string; status: string }>(
        sql`select a.id, a.job_id, j.status from analyses a join jobs j on j.id = a.job_id limit 1`,
      )
    ).rows;
    const engineer = (await getActor((await signInAs("engineer@halvard.example"))!))!;
    const count = async () =>
      (
        await db.execute<{ n: number }>(
          sql`select count(*)::int as n from analysis_views where job_id = ${a!.job_id}`,
        )
      ).rows[0]!.n;
    const before = await count();
    await db.execute(sql`update jobs set status = 'cancelled' where id = ${a!.job_id}`);
    try {
      await expect(
        saveAnalysisView(engineer, a!.id, {
          png: Buffer.alloc(10),
          factor: 1,
          overlayAnalysisId: null,
          caption: null,
        }),
      ).rejects.toMatchObject({ status: 403 });
      expect(await count()).toBe(before);
    } finally {
      await db.execute(sql`update jobs set status = ${a!.status}::job_status where id = ${a!.job_id}`);
    }
  });

  it("an issued job cannot be cancelled or put on hold (its report is amended instead)", async () => {
    await signInAs("admin@halvard.example");
    const issued = (
      await db.execute<{ id: string }>(sql`select id from jobs where status = 'issued' limit 1`)
    ).rows[0];
    if (!issued) return expect(issued).toBeDefined();
    expect((await patch(issued.id, { action: "cancel", reason: "No longer needed" })).status).toBe(403);
    expect((await patch(issued.id, { action: "hold" })).status).toBe(403);
    expect((await patch(issued.id, { title: "Changed after issue" })).status).toBe(403);
  });
});

describe("GET /api/jobs: the role queues and paging", () => {
  it("the installer's 'to measure' holds the draft and measuring jobs assigned to them, with its count", async () => {
    const id = await newDraft({ assignedInstallerId: ids.installer });
    await signInAs("installer@halvard.example");
    const res = await listRoute(request("/api/jobs?queue=to_measure&pageSize=500"), undefined);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.jobs.map((j: { id: string }) => j.id)).toContain(id);
    for (const j of body.jobs) expect(["draft", "measuring"]).toContain(j.status);
    expect(body.queues).toEqual([{ queue: "to_measure", label: "To measure", count: body.total }]);
  });

  it("the administrator's 'to schedule' holds unassigned or unscheduled drafts only", async () => {
    const unassigned = await newDraft();
    const ready = await newDraft({
      assignedInstallerId: ids.installer,
      scheduledDate: "2027-05-03",
      scheduledTime: "08:00",
      timeZone: "Europe/Berlin",
    });
    const res = await listRoute(request("/api/jobs?queue=to_schedule&pageSize=500"), undefined);
    const ids_ = (await res.json()).jobs.map((j: { id: string }) => j.id);
    expect(ids_).toContain(unassigned);
    expect(ids_).not.toContain(ready);
  });

  it("a queue of another role is empty; customers see 'to accept' only for their company; paging cuts the list", async () => {
    await signInAs("admin@halvard.example");
    const other = await (await listRoute(request("/api/jobs?queue=to_accept"), undefined)).json();
    expect(other.jobs).toEqual([]);
    await signInAs("buyer@tollan.example");
    const tollan = await (await listRoute(request("/api/jobs?queue=to_accept"), undefined)).json();
    for (const j of tollan.jobs) expect(j.customerName).toBe("Tollan Mold Works");
    await signInAs("admin@halvard.example");
    const page1 = await (await listRoute(request("/api/jobs?pageSize=5&page=1"), undefined)).json();
    const page2 = await (await listRoute(request("/api/jobs?pageSize=5&page=2"), undefined)).json();
    expect(page1.jobs).toHaveLength(5);
    expect(page1.total).toBeGreaterThan(5);
    expect(page2.jobs[0].id).not.toBe(page1.jobs[0].id);
    const bad = await listRoute(request("/api/jobs?queue=to_dance"), undefined);
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.issues[0].field).toBe("queue");
  });
});
