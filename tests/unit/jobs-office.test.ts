// The office's job rules as pure functions: zoned schedules, the form/body schemas, the role
// queues of the jobs board, and who may edit, assign, hold, release or cancel. Expected values are
// written by hand; time zone offsets are those of the IANA time zone database (tzdata): Europe/Berlin
// CET UTC+1 / CEST UTC+2 from the last Sunday of March 01:00 UTC to the last Sunday of October
// 01:00 UTC (EU Directive 2000/84/EC); America/New_York EST UTC−5; Asia/Kolkata IST UTC+5:30, no DST.
import { describe, expect, it } from "vitest";
import { isTimeZone, utcToZoned, zonedToUtc } from "@/lib/domain/schedule";
import {
  conditionHolds,
  inQueue,
  JOB_QUEUES,
  queueCondition,
  queueCounts,
  queuesFor,
  type QueueRow,
} from "@/lib/policy/job-queues";
import { JOB_STATUSES } from "@/lib/domain/jobs";
import { ROLES } from "@/lib/domain/roles";
import {
  jobAssignRefusal,
  jobCancelRefusal,
  jobHoldRefusal,
  jobRecordEditRefusal,
  jobReleaseRefusal,
  procedureApplies,
} from "@/lib/policy/jobs";
import {
  jobBoardQuerySchema,
  jobMoveSchema,
  jobOpenSchema,
  jobRecordSchema,
  scheduleOf,
} from "@/lib/validations/jobs";
import type { Actor } from "@/lib/domain/roles";
import type { JobStatus } from "@/lib/domain/jobs";

const actor = (role: Actor["role"], id = `${role}-1`, customerId: string | null = null) =>
  ({ id, role, customerId, email: `${id}@x.example`, name: id }) as unknown as Actor;

describe("zoned schedule (IANA tzdata offsets)", () => {
  it.each([
    ["2026-07-01", "09:00", "Europe/Berlin", "2026-07-01T07:00:00.000Z"], // CEST, UTC+2
    ["2026-01-15", "09:00", "Europe/Berlin", "2026-01-15T08:00:00.000Z"], // CET, UTC+1
    ["2026-01-15", "08:00", "America/New_York", "2026-01-15T13:00:00.000Z"], // EST, UTC−5
    ["2026-06-01", "12:00", "Asia/Kolkata", "2026-06-01T06:30:00.000Z"], // IST, UTC+5:30
    ["2026-06-01", "12:00", "UTC", "2026-06-01T12:00:00.000Z"],
    // 2026-10-25 Berlin: 03:00 CEST becomes 02:00 CET, 02:30 happens twice; the first is 00:30 UTC.
    ["2026-10-25", "02:30", "Europe/Berlin", "2026-10-25T00:30:00.000Z"],
  ])("%s %s in %s is %s", (date, time, zone, iso) => {
    expect(zonedToUtc(date, time, zone)?.toISOString()).toBe(iso);
  });

  it("a time skipped when the clocks go forward, an impossible date or an unknown zone is null", () => {
    // 2026-03-29 Berlin: 02:00 CET jumps to 03:00 CEST.
    expect(zonedToUtc("2026-03-29", "02:30", "Europe/Berlin")).toBeNull();
    expect(zonedToUtc("2026-02-30", "08:00", "Europe/Berlin")).toBeNull();
    expect(zonedToUtc("2026-02-10", "24:00", "Europe/Berlin")).toBeNull();
    expect(zonedToUtc("2026-02-10", "08:00", "Mars/Olympus")).toBeNull();
    expect(isTimeZone("Europe/Berlin")).toBe(true);
    expect(isTimeZone("Europe/Atlantis")).toBe(false);
  });

  it("utcToZoned reads an instant back as the wall clock of the zone", () => {
    expect(utcToZoned(new Date("2026-07-01T07:00:00Z"), "Europe/Berlin")).toEqual({
      date: "2026-07-01",
      time: "09:00",
    });
    expect(utcToZoned(new Date("2026-12-31T23:30:00Z"), "Asia/Kolkata")).toEqual({
      date: "2027-01-01",
      time: "05:00",
    });
  });
});

const uuid = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, "0")}`;
const open = {
  machineId: uuid(1),
  headId: uuid(2),
  kind: "installation",
  title: "Head installation",
  templateId: uuid(3),
  decisionRule: "simple",
};
const fieldsOf = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) =>
  (r.error?.issues ?? []).map((i) => i.path.join("."));

describe("job schemas", () => {
  it("a new job needs machine, head, kind, title, procedure and rule; form blanks become null", () => {
    const ok = jobOpenSchema.parse({ ...open, orderReference: " ", assignedInstallerId: "", notes: "" });
    expect(ok).toMatchObject({ orderReference: null, assignedInstallerId: null, notes: null });
    expect(fieldsOf(jobOpenSchema.safeParse({}))).toEqual(
      expect.arrayContaining(["machineId", "headId", "kind", "title", "templateId", "decisionRule"]),
    );
  });

  it("the schedule's three fields go together and must exist in the zone", () => {
    const base = { ...open, scheduledDate: "2027-03-28" };
    expect(fieldsOf(jobOpenSchema.safeParse(base)).sort()).toEqual(["scheduledTime", "timeZone"]);
    expect(
      fieldsOf(jobOpenSchema.safeParse({ ...base, scheduledTime: "02:30", timeZone: "Europe/Berlin" })),
    ).toEqual(["scheduledTime"]);
    const good = jobOpenSchema.parse({ ...base, scheduledTime: "03:30", timeZone: "Europe/Berlin" });
    // 03:30 CEST (UTC+2) on the day the clocks go forward.
    expect(scheduleOf(good)?.scheduledFor?.toISOString()).toBe("2027-03-28T01:30:00.000Z");
  });

  it("a zone alone (the form fills in the browser's) is no schedule: the job opens unscheduled", () => {
    const v = jobOpenSchema.parse({
      ...open,
      scheduledDate: "",
      scheduledTime: "",
      timeZone: "Europe/Berlin",
    });
    expect(scheduleOf(v)).toEqual({ scheduledFor: null, timeZone: null });
    expect(scheduleOf(jobRecordSchema.parse({ timeZone: "Europe/Berlin" }))).toBeUndefined();
  });

  it("an edit leaves absent fields unchanged, clears blank ones and refuses unknown ones", () => {
    expect(scheduleOf(jobRecordSchema.parse({ title: "New title" }))).toBeUndefined();
    expect(scheduleOf(jobRecordSchema.parse({ scheduledDate: "", scheduledTime: "", timeZone: "" }))).toEqual(
      {
        scheduledFor: null,
        timeZone: null,
      },
    );
    expect(fieldsOf(jobRecordSchema.safeParse({ status: "issued" }))).toEqual([""]);
    expect(fieldsOf(jobRecordSchema.safeParse({ nextRecheckOn: "31.01.2028" }))).toEqual(["nextRecheckOn"]);
    expect(fieldsOf(jobRecordSchema.safeParse({ customerContactEmail: "nobody" }))).toEqual([
      "customerContactEmail",
    ]);
  });

  it("cancel needs a reason of at least 5 characters; hold may give one; release takes none", () => {
    expect(fieldsOf(jobMoveSchema.safeParse({ action: "cancel" }))).toEqual(["reason"]);
    expect(fieldsOf(jobMoveSchema.safeParse({ action: "cancel", reason: "no" }))).toEqual(["reason"]);
    expect(jobMoveSchema.parse({ action: "hold" })).toEqual({ action: "hold" });
    expect(jobMoveSchema.safeParse({ action: "release", reason: "x" }).success).toBe(false);
    expect(jobMoveSchema.safeParse({ action: "delete" }).success).toBe(false);
  });

  it("the board's query: a queue of the list, a page of at least 1", () => {
    expect(jobBoardQuerySchema.parse({ queue: "to_measure", page: "2", pageSize: "25" })).toEqual({
      queue: "to_measure",
      page: 2,
      pageSize: 25,
    });
    expect(jobBoardQuerySchema.safeParse({ page: "0" }).success).toBe(false);
    expect(jobBoardQuerySchema.safeParse({ queue: "to_dance" }).success).toBe(false);
  });
});

const row = (status: JobStatus, o: Partial<QueueRow> = {}): QueueRow => ({
  status,
  assignedInstallerId: null,
  scheduledFor: null,
  customerId: "c-1",
  ...o,
});

describe("role queues", () => {
  it("each role is shown its own queues", () => {
    expect(queuesFor("admin")).toEqual(["to_schedule"]);
    expect(queuesFor("installer")).toEqual(["to_measure"]);
    expect(queuesFor("inspector")).toEqual(["to_inspect"]);
    expect(queuesFor("engineer")).toEqual(["to_approve", "to_issue"]);
    expect(queuesFor("customer")).toEqual(["to_accept"]);
  });

  it("to measure: draft or measuring, assigned to this installer", () => {
    const me = actor("installer", "i-1");
    expect(inQueue("to_measure", me, row("draft", { assignedInstallerId: "i-1" }))).toBe(true);
    expect(inQueue("to_measure", me, row("measuring", { assignedInstallerId: "i-1" }))).toBe(true);
    expect(inQueue("to_measure", me, row("measuring", { assignedInstallerId: "i-2" }))).toBe(false);
    expect(inQueue("to_measure", me, row("on_hold", { assignedInstallerId: "i-1" }))).toBe(false);
    expect(inQueue("to_measure", me, row("cancelled", { assignedInstallerId: "i-1" }))).toBe(false);
  });

  it("to schedule: drafts without an installer or without a time; never another role's queue", () => {
    const admin = actor("admin");
    const when = new Date("2027-01-01T08:00:00Z");
    expect(inQueue("to_schedule", admin, row("draft"))).toBe(true);
    expect(inQueue("to_schedule", admin, row("draft", { assignedInstallerId: "i-1" }))).toBe(true);
    expect(inQueue("to_schedule", admin, row("draft", { scheduledFor: when }))).toBe(true);
    expect(
      inQueue("to_schedule", admin, row("draft", { assignedInstallerId: "i-1", scheduledFor: when })),
    ).toBe(false);
    expect(inQueue("to_schedule", admin, row("measuring"))).toBe(false);
    expect(inQueue("to_measure", admin, row("draft", { assignedInstallerId: admin.id }))).toBe(false);
  });

  it("review, approval, issue and acceptance queues, and their counts", () => {
    const eng = actor("engineer");
    const rows = [row("in_review"), row("in_review"), row("approved"), row("issued"), row("on_hold")];
    expect(queueCounts(eng, rows)).toEqual([
      { queue: "to_approve", label: "To approve", count: 2 },
      { queue: "to_issue", label: "To issue", count: 1 },
    ]);
    expect(queueCounts(actor("inspector"), rows)).toEqual([
      { queue: "to_inspect", label: "To inspect", count: 2 },
    ]);
    expect(queueCounts(actor("customer", "b-1", "c-1"), rows)).toEqual([
      { queue: "to_accept", label: "To accept", count: 1 },
    ]);
    expect(queueCounts(actor("customer", "b-2", "c-2"), rows)[0]!.count).toBe(0);
  });
});

describe("the queues' two forms", () => {
  it("the predicate and the condition the SQL is written from agree on every status, role, assignment, schedule and customer", () => {
    const when = new Date("2027-01-01T08:00:00Z");
    let checked = 0;
    let held = 0;
    for (const role of ROLES)
      for (const me of [actor(role, "u-1", role === "customer" ? "c-1" : null), actor(role, "u-1", null)])
        for (const queue of JOB_QUEUES)
          for (const status of JOB_STATUSES)
            for (const assignedInstallerId of [null, "u-1", "u-2"])
              for (const scheduledFor of [null, when])
                for (const customerId of ["c-1", "c-2"]) {
                  const r: QueueRow = { status, assignedInstallerId, scheduledFor, customerId };
                  const expected = inQueue(queue, me, r);
                  expect(conditionHolds(queueCondition(queue, me), r), `${role} ${queue} ${status}`).toBe(
                    expected,
                  );
                  checked++;
                  if (expected) held++;
                }
    // Every combination was compared, and some of them are in a queue (the check is not vacuous).
    expect(checked).toBe(ROLES.length * 2 * JOB_QUEUES.length * JOB_STATUSES.length * 12);
    expect(held).toBeGreaterThan(0);
  });

  it("a queue not offered to the role, or acceptance for a customer without a customer, holds nothing", () => {
    expect(queueCondition("to_schedule", actor("installer"))).toBeNull();
    expect(queueCondition("to_accept", actor("customer", "u-9", null))).toBeNull();
    expect(queueCondition("to_measure", actor("installer", "i-7"))).toEqual({
      statuses: ["draft", "measuring"],
      installerId: "i-7",
    });
  });
});

describe("the office's moves", () => {
  const office = [actor("admin"), actor("engineer")];
  const others = [actor("installer"), actor("inspector"), actor("customer", "b", "c-1")];

  it("only the office edits, assigns, holds, releases and cancels", () => {
    for (const a of others) {
      expect(jobRecordEditRefusal(a, { status: "draft" })).toMatch(/office/);
      expect(jobAssignRefusal(a, { status: "draft" })).toMatch(/office/);
      expect(jobHoldRefusal(a, { status: "draft" })).toMatch(/office/);
      expect(jobReleaseRefusal(a, { status: "on_hold" })).toMatch(/office/);
      expect(jobCancelRefusal(a, { status: "draft" })).toMatch(/office/);
    }
    for (const a of office) {
      expect(jobRecordEditRefusal(a, { status: "approved" })).toBeNull();
      expect(jobAssignRefusal(a, { status: "on_hold" })).toBeNull();
      expect(jobHoldRefusal(a, { status: "in_review" })).toBeNull();
      expect(jobReleaseRefusal(a, { status: "on_hold" })).toBeNull();
      expect(jobCancelRefusal(a, { status: "approved" })).toBeNull();
    }
  });

  it("issued, accepted, rejected and cancelled jobs are fixed", () => {
    const admin = actor("admin");
    for (const status of ["issued", "accepted", "rejected", "cancelled"] as const) {
      expect(jobRecordEditRefusal(admin, { status })).not.toBeNull();
      expect(jobCancelRefusal(admin, { status })).not.toBeNull();
      expect(jobHoldRefusal(admin, { status })).not.toBeNull();
      expect(jobAssignRefusal(admin, { status })).not.toBeNull();
    }
    expect(jobReleaseRefusal(admin, { status: "measuring" })).toMatch(/not on hold/);
    expect(jobAssignRefusal(admin, { status: "in_review" })).toMatch(/draft, measuring or on hold/);
  });

  it("a procedure fits when current, not retired, of the kind and (if it names one) the head model", () => {
    const t = { isCurrent: true, retiredAt: null, jobKinds: null, headModel: null };
    expect(procedureApplies(t, "installation", "TH-40")).toBe(true);
    expect(procedureApplies({ ...t, isCurrent: false }, "installation", null)).toBe(false);
    expect(procedureApplies({ ...t, retiredAt: new Date() }, "installation", null)).toBe(false);
    expect(procedureApplies({ ...t, jobKinds: ["after_crash"] }, "installation", null)).toBe(false);
    expect(procedureApplies({ ...t, jobKinds: ["after_crash"] }, "after_crash", null)).toBe(true);
    expect(procedureApplies({ ...t, headModel: "TH-40" }, "installation", "th-40 ")).toBe(true);
    expect(procedureApplies({ ...t, headModel: "TH-40" }, "installation", "TH-60")).toBe(false);
  });
});
