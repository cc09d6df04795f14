// Checklist readings, the comparison, status moves, the outbox worker and the invitation flow
// against the real database. Each test that changes a job's state uses a job of its own.
import { once } from "node:events";
import type { AddressInfo } from "node:net";
import { and, eq, inArray, sql } from "drizzle-orm";
import { simpleParser, type ParsedMail } from "mailparser";
import nodemailer from "nodemailer";
import { SMTPServer } from "smtp-server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as comparisonRoute } from "@/app/api/jobs/[id]/comparison/route";
import { GET as comparisonCsvRoute } from "@/app/api/jobs/[id]/comparison/csv/route";
import { GET as readingsGet } from "@/app/api/jobs/[id]/readings/route";
import { db } from "@/db";
import { changeJobStatus } from "@/db/queries/job-status";
import { getActor } from "@/db/queries/users";
import { inviteUser, setPasswordWithToken, tokenHash, updateUser } from "@/db/queries/users-admin";
import { auditEvents, jobs, outbox, readings, userTokens, users } from "@/db/schema";
import { verifyPassword } from "@/lib/auth/password";
import { processOutbox } from "@/lib/mail/worker";
import {
  actorsBeforeAll,
  BASE_JOB,
  insertTestJob,
  refusalOf,
  instrumentIdsBySerial,
  postReading,
  stepIdsByPosition,
  auditEventsOf,
} from "./fixtures";
import { request, signInAs } from "./helpers";
import { jobBaseOf } from "./ready-job";

let jobId: string;
const step: Record<number, string> = {};
const inst: Record<string, string> = {};
const as = actorsBeforeAll();

/** A reading in inches on step 1 with the seed's dial indicator, unless `over` says otherwise. */
const reading = (over: Record<string, unknown>) => ({
  stepId: step[1],
  unit: "in",
  instrumentId: inst["DTI-0112"],
  ...over,
});

const post = (body: Record<string, unknown>, id = jobId) => postReading(id, body);

beforeAll(async () => {
  const base = await jobBaseOf(BASE_JOB);
  jobId = await insertTestJob({
    tag: "CHK",
    title: "Checklist test job",
    status: "draft",
    template: true,
    base,
    assignedInstallerId: as.installer!.id,
  });
  Object.assign(step, await stepIdsByPosition(base.templateId));
  Object.assign(inst, await instrumentIdsBySerial());
});

describe("recording readings", () => {
  it("stores the canonical value (mm) with what was entered (in), and the first reading starts measuring", async () => {
    await signInAs("installer@halvard.example");
    const { status, json } = await post(reading({ phase: "pre", value: "0.0009", note: "before shimming" }));
    expect(status).toBe(201);
    // 0.0009 in × 25.4 mm/in = 0.02286 mm (NIST SP 811: 1 in = 25.4 mm exactly)
    expect(json.reading.value).toBeCloseTo(0.02286, 12);
    expect(json.reading).toMatchObject({
      unit: "mm",
      entered: { value: 0.0009, unit: "in" },
      decision: "fail",
      phase: "pre",
    });
    const [j] = await db.select({ status: jobs.status }).from(jobs).where(eq(jobs.id, jobId));
    expect(j!.status).toBe("measuring");
    const audit = await auditEventsOf({ jobId }, "reading.recorded");
    expect(audit).toHaveLength(1);
  });

  it("the tilt step turns reading over travel into arc seconds with geometry/ (0.0005 in over 10 in = 10.31″)", async () => {
    await signInAs("installer@halvard.example");
    const { status, json } = await post(
      reading({ stepId: step[5], phase: "pre", value: 0.0005, travel: 10, travelUnit: "in" }),
    );
    expect(status).toBe(201);
    expect(json.reading.unit).toBe("arcsec");
    expect(json.reading.value).toBeCloseTo(10.31, 2);
    expect(json.reading.decision).toBe("fail"); // the demo limit is ±10″
  });

  it("refuses an instrument past its calibration due date, with the reason, and stores nothing", async () => {
    await signInAs("installer@halvard.example");
    const before = await db.select().from(readings).where(eq(readings.jobId, jobId));
    const { status, json } = await post(
      reading({ phase: "post", value: 0.0003, instrumentId: inst["DTI-0417"] }),
    );
    expect(status).toBe(422);
    expect(json.error.message).toMatch(/DTI-0417 was due for calibration on 2026-09-30/);
    expect(json.error.issues[0].field).toBe("instrumentId");
    expect(await db.select().from(readings).where(eq(readings.jobId, jobId))).toHaveLength(before.length);
  });

  it("refuses an instrument of the wrong kind and bad input, naming the field", async () => {
    await signInAs("installer@halvard.example");
    const wrong = await post(reading({ phase: "post", value: 0.0003, instrumentId: inst["EL-0007"] }));
    expect(wrong.status).toBe(422);
    expect(wrong.json.error.message).toMatch(/EL-0007 measures angles/);
    const bad = await post(reading({ phase: "later", value: "abc" }));
    expect(bad.status).toBe(422);
    expect(bad.json.error.issues.map((i: { field: string }) => i.field).sort()).toEqual(["phase", "value"]);
    const notOurs = await post(
      reading({ stepId: "00000000-0000-4000-8000-000000000000", phase: "pre", value: 1 }),
    );
    expect(notOurs.status).toBe(422);
    expect(notOurs.json.error.issues[0].field).toBe("stepId");
  });

  it("a correction supersedes the old reading and keeps it; the old one cannot be corrected twice", async () => {
    await signInAs("installer@halvard.example");
    const first = await post(reading({ phase: "post", value: 0.0006 }));
    const fix = await post(
      reading({
        phase: "post",
        value: 0.0003,
        note: "misread the dial",
        supersedesId: first.json.reading.id,
      }),
    );
    expect(fix.status).toBe(201);
    const [old] = await db.select().from(readings).where(eq(readings.id, first.json.reading.id));
    expect(old!.value).toBeCloseTo(0.01524, 12);
    expect(old!.supersededById).toBe(fix.json.reading.id);
    const again = await post(reading({ phase: "post", value: 0.0002, supersedesId: first.json.reading.id }));
    expect(again.status).toBe(409);
    const list = await readingsGet(request("/x"), { params: Promise.resolve({ id: jobId }) });
    const body = await list.json();
    expect(body.readings.find((r: { id: string }) => r.id === first.json.reading.id).supersededById).toBe(
      fix.json.reading.id,
    );
    const audit = await auditEventsOf({ entityId: fix.json.reading.id }, "reading.corrected");
    expect(audit).toHaveLength(1);
  });

  it("the comparison shows pre, post, change and status per step, skipping the superseded reading", async () => {
    await signInAs("buyer@marlowcreek.example");
    const res = await comparisonRoute(request("/x"), { params: Promise.resolve({ id: jobId }) });
    expect(res.status).toBe(200);
    const c = await res.json();
    const s1 = c.steps.find((s: { position: number }) => s.position === 1);
    expect(s1.pre.value).toBeCloseTo(0.02286, 12);
    expect(s1.post.value).toBeCloseTo(0.00762, 12);
    expect(s1.change).toBeCloseTo(-0.01524, 12);
    expect(s1).toMatchObject({
      unit: "mm",
      status: "pass",
      limitSource: "common_practice",
      pre: { decision: "fail" },
      post: { decision: "pass" },
    });
    expect(c.steps.find((s: { position: number }) => s.position === 3).status).toBe("not_measured");
    const csv = await (
      await comparisonCsvRoute(request("/x"), { params: Promise.resolve({ id: jobId }) })
    ).text();
    expect(csv.split("\r\n")[0]).toMatch(/^step,title,quantity,unit,lower_limit,upper_limit/);
    expect(csv).toContain("Mount the adapter collar and prove its face");
  });
});

describe("status moves", () => {
  it("an installer cannot approve; submitting for review notifies engineers and inspectors and locks the readings", async () => {
    const e = await refusalOf(changeJobStatus(as.installer!, jobId, "approved"));
    expect(e.status).toBe(403);
    await changeJobStatus(as.installer!, jobId, "in_review");
    const mails = await db.select().from(outbox).where(eq(outbox.jobId, jobId));
    expect(mails.map((m) => m.toAddress).sort()).toEqual([
      "engineer@halvard.example",
      "inspector@halvard.example",
    ]);
    expect(mails[0]!.textBody).toContain(`/jobs/${jobId}/compare`);
    await signInAs("installer@halvard.example");
    const locked = await post(
      reading({ stepId: step[2], phase: "pre", value: 0.09, instrumentId: inst["FG-0031"] }),
    );
    expect(locked.status).toBe(403);
    expect(locked.json.error.message).toMatch(/in review; its readings are locked/);
    // Issue goes through the signed report, not a bare status change.
    await changeJobStatus(as.engineer!, jobId, "approved");
    expect((await refusalOf(changeJobStatus(as.engineer!, jobId, "issued"))).status).toBe(403);
  });
});

describe("outbox worker", () => {
  let server: SMTPServer;
  let port: number;
  const inbox: ParsedMail[] = [];

  beforeAll(async () => {
    server = new SMTPServer({
      authOptional: true,
      disabledCommands: ["STARTTLS"],
      logger: false,
      onData(s, _x, cb) {
        simpleParser(s).then((m) => {
          inbox.push(m);
          cb();
        }, cb);
      },
    });
    server.listen(0, "127.0.0.1");
    await once(server.server, "listening");
    port = (server.server.address() as AddressInfo).port;
  });
  afterAll(async () => {
    await new Promise<void>((r) => server.close(() => r()));
  });

  it("two concurrent workers claim disjoint rows: every due message is delivered exactly once", async () => {
    const tag = Date.now().toString(36);
    await db.insert(outbox).values(
      Array.from({ length: 12 }, (_, i) => ({
        dedupeKey: `test:${tag}:${i}`,
        toAddress: `person${i}@halvard.example`,
        subject: `Test ${tag} ${i}`,
        textBody: `Message ${i}`,
      })),
    );
    const due = await db
      .select({ id: outbox.id })
      .from(outbox)
      .where(and(eq(outbox.status, "pending"), sql`${outbox.nextAttemptAt} <= now()`));
    const transport = () =>
      nodemailer.createTransport({ host: "127.0.0.1", port, secure: false, ignoreTLS: true });
    const [a, b] = await Promise.all([
      processOutbox({ transport: transport(), limit: 50 }),
      processOutbox({ transport: transport(), limit: 50 }),
    ]);
    expect(a.claimed + b.claimed).toBe(due.length);
    expect(a.failed + b.failed).toBe(0);
    const ids = inbox.map((m) => m.headers.get("x-trammel-outbox-id"));
    expect(new Set(ids).size).toBe(ids.length);
    expect(ids.length).toBe(due.length);
    expect(inbox.filter((m) => m.subject?.startsWith(`Test ${tag}`))).toHaveLength(12);
    const rows = await db
      .select()
      .from(outbox)
      .where(
        inArray(
          outbox.id,
          due.map((d) => d.id),
        ),
      );
    expect(rows.every((r) => r.status === "sent" && r.attempts === 1 && r.sentAt)).toBe(true);
    // A second run finds nothing left to send.
    expect((await processOutbox({ transport: transport() })).claimed).toBe(0);
  });

  it("a failed send is kept pending with the error and retried later (exponential backoff)", async () => {
    const key = `test-fail:${Date.now().toString(36)}`;
    await db
      .insert(outbox)
      .values({ dedupeKey: key, toAddress: "nobody@halvard.example", subject: "Will fail", textBody: "x" });
    const broken = nodemailer.createTransport({
      host: "127.0.0.1",
      port: 1,
      secure: false,
      connectionTimeout: 2000,
    });
    const r = await processOutbox({ transport: broken });
    expect(r.failed).toBeGreaterThanOrEqual(1);
    const [row] = await db.select().from(outbox).where(eq(outbox.dedupeKey, key));
    expect(row).toMatchObject({ status: "pending", attempts: 1 });
    expect(row!.lastError).toBeTruthy();
    expect(row!.nextAttemptAt.getTime()).toBeGreaterThan(Date.now() + 20_000);
  });
});

describe("invitation and set-password", () => {
  it("invites by e-mail with a one-time link; only the token's SHA-256 is stored; the link sets the password once", async () => {
    const email = `new.${Date.now().toString(36)}@halvard.example`;
    const { userId, token } = await inviteUser(as.admin!, {
      email,
      name: "New Installer",
      role: "installer",
    });
    const [t] = await db.select().from(userTokens).where(eq(userTokens.userId, userId));
    expect(t!.tokenHash).toBe(tokenHash(token));
    expect(t!.tokenHash).not.toContain(token);
    const [mail] = await db
      .select()
      .from(outbox)
      .where(eq(outbox.dedupeKey, `invite:${userId}`));
    expect(mail!.textBody).toContain(`/set-password?token=${token}`);
    await setPasswordWithToken(token, "a-long-new-password");
    const [u] = await db.select().from(users).where(eq(users.id, userId));
    expect(await verifyPassword("a-long-new-password", u!.passwordHash)).toBe(true);
    expect((await refusalOf(setPasswordWithToken(token, "another-password"))).status).toBe(410);
    expect((await refusalOf(setPasswordWithToken("x".repeat(43), "another-password"))).status).toBe(410);
  });

  it("only an administrator invites; disabling and a role change end open sessions", async () => {
    expect(
      (
        await refusalOf(
          inviteUser(as.engineer!, { email: "x@halvard.example", name: "X", role: "installer" }),
        )
      ).status,
    ).toBe(403);
    const { userId } = await inviteUser(as.admin!, {
      email: `role.${Date.now().toString(36)}@halvard.example`,
      name: "Role Change",
      role: "installer",
    });
    const signedIn = Date.now() - 1000;
    expect(await getActor(userId, signedIn)).not.toBeNull();
    await updateUser(as.admin!, { userId, role: "inspector" });
    expect(await getActor(userId, signedIn)).toBeNull();
    expect((await getActor(userId, Date.now() + 1000))!.role).toBe("inspector");
    await updateUser(as.admin!, { userId, disabled: true });
    expect(await getActor(userId, Date.now() + 1000)).toBeNull();
    expect((await refusalOf(updateUser(as.admin!, { userId: as.admin!.id, disabled: true }))).status).toBe(
      403,
    );
  });
});

describe("registers and jobs from a procedure", () => {
  it("only an administrator registers an instrument; values are stored in mm", async () => {
    const { createInstrument } = await import("@/db/queries/instruments");
    const input = {
      kind: "Dial test indicator",
      serial: `T-${Date.now().toString(36)}`,
      quantityKind: "length" as const,
      resolution: 0.0001,
      standardUncertainty: 0.00005,
      unit: "in" as const,
      calibrationDueOn: "2027-12-31",
    };
    expect((await refusalOf(createInstrument(as.engineer!, input))).status).toBe(403);
    const row = await createInstrument(as.admin!, input);
    expect(row.resolution).toBeCloseTo(0.00254, 12);
    expect((await refusalOf(createInstrument(as.admin!, input))).issues?.[0]?.field).toBe("serial");
  });

  it("a job opened from a procedure gets the next reference, the version and a draft status; an installer cannot open one", async () => {
    const { createJobFromTemplate } = await import("@/db/queries/job-status");
    const [base] = await db.select().from(jobs).where(eq(jobs.id, jobId));
    const input = {
      templateId: base!.templateId!,
      machineId: base!.machineId,
      headId: base!.headId,
      kind: "after_crash" as const,
      title: "Check after a tool crash",
      assignedInstallerId: as.installer!.id,
      decisionRule: "simple" as const,
    };
    expect((await refusalOf(createJobFromTemplate(as.installer!, input))).status).toBe(403);
    expect(
      (await refusalOf(createJobFromTemplate(as.admin!, { ...input, assignedInstallerId: as.engineer!.id })))
        .issues?.[0]?.field,
    ).toBe("assignedInstallerId");
    const job = await createJobFromTemplate(as.admin!, input);
    expect(job.reference).toMatch(/^TR-\d{4}-\d{4}$/);
    expect(job).toMatchObject({
      status: "draft",
      templateId: base!.templateId,
      customerId: base!.customerId,
    });
    const audit = await auditEventsOf({ entityId: job.id }, "job.created");
    expect(audit).toHaveLength(1);
    const next = await createJobFromTemplate(as.admin!, input);
    expect(Number(next.reference.slice(-4))).toBe(Number(job.reference.slice(-4)) + 1);
  });
});

describe("heads register", () => {
  it("moving a head is kept in its history; only an administrator moves it; an engineer reads it", async () => {
    const { getHeadWithHistory, mountHead } = await import("@/db/queries/heads-admin");
    const [base] = await db.select().from(jobs).where(eq(jobs.id, jobId));
    expect((await refusalOf(mountHead(as.engineer!, base!.headId, null))).status).toBe(403);
    await mountHead(as.admin!, base!.headId, null);
    await mountHead(as.admin!, base!.headId, base!.machineId);
    const h = await getHeadWithHistory(as.engineer!, base!.headId);
    expect(h!.head.machineId).toBe(base!.machineId);
    expect(h!.history.slice(-2).map((e) => e.action)).toEqual(["head.removed", "head.mounted"]);
    expect((await refusalOf(getHeadWithHistory(as.installer!, base!.headId))).status).toBe(403);
  });
});

describe("customers, sites, machines and heads", () => {
  it("an administrator adds each, audited; another role is refused; duplicates name the field", async () => {
    const r = await import("@/db/queries/registers-admin");
    const tag = Date.now().toString(36);
    expect((await refusalOf(r.createCustomer(as.engineer!, { name: `Cust ${tag}` }))).status).toBe(403);
    const c = await r.createCustomer(as.admin!, { name: `Cust ${tag}`, contactEmail: "" });
    expect((await refusalOf(r.createCustomer(as.admin!, { name: `cust ${tag}` }))).issues?.[0]?.field).toBe(
      "name",
    );
    const s = await r.createSite(as.admin!, { customerId: c.id, name: "Plant 9" });
    const m = await r.createMachine(as.admin!, { siteId: s.id, name: "Mill M-1", kind: "bridge mill" });
    const h = await r.createHead(as.admin!, {
      serial: `TH-${tag}`,
      primaryAxis: "C",
      secondaryAxis: "B",
      nominalPivotLengthMm: 127,
      toolAxisOffsetMm: 0,
    });
    expect(
      (
        await refusalOf(
          r.createHead(as.admin!, {
            serial: `TH-${tag}`,
            primaryAxis: "C",
            secondaryAxis: "B",
            nominalPivotLengthMm: 127,
            toolAxisOffsetMm: 0,
          }),
        )
      ).issues?.[0]?.field,
    ).toBe("serial");
    for (const [type, id] of [
      ["customer", c.id],
      ["site", s.id],
      ["machine", m.id],
      ["head", h.id],
    ] as const) {
      const ev = await db
        .select()
        .from(auditEvents)
        .where(and(eq(auditEvents.entityType, type), eq(auditEvents.entityId, id)));
      expect(ev.map((e) => e.action)).toEqual([`${type}.created`]);
    }
  });
});
