// Every change to a job, reading, dataset, analysis, signature or report is in the audit trail
// with actor, UTC time and old/new values (21 CFR 11.10(e): a secure, computer-generated,
// time-stamped trail of who did what and what it replaced). Two checks:
//  1. a whole job lifecycle through the real write paths, after which every row of those tables
//     that belongs to the job has its event, the job's status history can be rebuilt from the
//     events alone (each old status is the previous new one), and every correction or deletion
//     names the old value;
//  2. a scan of the source: any function that writes one of those tables also calls appendAudit
//     (or adds the row through insertJobRecord, which appends the event itself and is checked for
//     it), so a new write path without an audit event fails here.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { and, asc, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { runHeadFit } from "@/db/queries/analyses";
import { saveAnalysisView } from "@/db/queries/analysis-views";
import { deleteDataset } from "@/db/queries/datasets";
import { createJobFromTemplate } from "@/db/queries/job-status";
import { recordReading } from "@/db/queries/readings";
import { issueReport, respondToReport } from "@/db/queries/reports";
import {
  analyses,
  analysisViews,
  deviations,
  auditEvents,
  datasets,
  jobs,
  readings,
  reports,
  signatures,
} from "@/db/schema";
import { PNG } from "pngjs";
import { upload } from "./dataset-helpers";
import {
  actorsBeforeAll,
  BASE_JOB,
  DEMO_PASSWORD as PW,
  firstStepOf,
  instrumentIdBySerial,
  uploadDemoProbe,
  measureSignAndApprove,
  auditEventsOf,
} from "./fixtures";
import { carryOpenResults, jobBaseOf } from "./ready-job";

const as = actorsBeforeAll();
let jobId = "";

beforeAll(async () => {
  const t = await jobBaseOf(BASE_JOB);
  const job = await createJobFromTemplate(as.admin!, {
    templateId: t.templateId,
    machineId: t.machineId,
    headId: t.headId,
    kind: "reverification",
    title: "Audit completeness job",
    assignedInstallerId: as.installer!.id,
    decisionRule: "simple",
  });
  jobId = job.id;
  const stepId = await firstStepOf(t.templateId);
  const instrumentId = await instrumentIdBySerial();
  const first = await recordReading(as.installer!, jobId, {
    stepId,
    phase: "pre",
    value: 0.0006,
    unit: "in",
    instrumentId,
  });
  await recordReading(as.installer!, jobId, {
    stepId,
    phase: "pre",
    value: 0.0005,
    unit: "in",
    instrumentId,
    note: "misread",
    supersedesId: first.id,
  });
  await recordReading(as.installer!, jobId, {
    stepId,
    phase: "post",
    value: 0.0002,
    unit: "in",
    instrumentId,
  });
  // After adjustment: the job has after-adjustment readings, so that is the state the report vouches for.
  const probeId = await uploadDemoProbe(jobId, { phase: "post" });
  const extra = await upload(
    jobId,
    Buffer.from(
      "feature,characteristic,nominal,measured,lower_tol,upper_tol\nB1,diameter,40,40.01,0,0.025\n",
    ),
    { kind: "test_part", phase: "post" },
    "tp.csv",
  );
  await deleteDataset(as.installer!, (await extra.json()).id);
  const { analysis } = await runHeadFit(as.engineer!, probeId);
  await measureSignAndApprove(as, jobId, analysis.id, "post");
  await carryOpenResults(
    as.engineer!,
    jobId,
    "Carried for this test: the issue path must be audited end to end.",
  );
  const png = new PNG({ width: 8, height: 8 });
  png.data.fill(200);
  await saveAnalysisView(as.engineer!, analysis.id, {
    png: PNG.sync.write(png),
    factor: 100,
    overlayAnalysisId: null,
    caption: null,
  });
  const { reportId } = await issueReport(as.engineer!, { jobId, password: PW });
  await respondToReport(as.buyer!, { reportId, decision: "accepted", password: PW });
}, 90_000);

describe("a whole job's changes are in the audit trail", () => {
  it("every row of the job in the audited tables has an event with actor, UTC time and new values", async () => {
    const events = await db.select().from(auditEvents).where(eq(auditEvents.jobId, jobId));
    const rows: Array<[string, string]> = [
      ["job", jobId],
      ...(await db.select({ id: readings.id }).from(readings).where(eq(readings.jobId, jobId))).map(
        (r) => ["reading", r.id] as [string, string],
      ),
      ...(await db.select({ id: datasets.id }).from(datasets).where(eq(datasets.jobId, jobId))).map(
        (r) => ["dataset", r.id] as [string, string],
      ),
      ...(await db.select({ id: analyses.id }).from(analyses).where(eq(analyses.jobId, jobId))).map(
        (r) => ["analysis", r.id] as [string, string],
      ),
      ...(
        await db.select({ id: analysisViews.id }).from(analysisViews).where(eq(analysisViews.jobId, jobId))
      ).map((r) => ["analysis_view", r.id] as [string, string]),
      ...(await db.select({ id: reports.id }).from(reports).where(eq(reports.jobId, jobId))).map(
        (r) => ["report", r.id] as [string, string],
      ),
    ];
    const carried = (
      await db.select({ id: deviations.id }).from(deviations).where(eq(deviations.jobId, jobId))
    ).map((r) => ["deviation", r.id] as [string, string]);
    rows.push(...carried);
    // 3 readings and 5 after adjustment (the steps not yet measured after adjustment), 2 datasets,
    // 1 analysis, 1 view, 1 report, and a deviation for each FAIL or undecided parameter: the
    // scenario really wrote them.
    expect(rows.length).toBe(1 + 3 + 5 + 2 + 1 + 1 + 1 + carried.length);
    for (const [type, id] of rows) {
      const mine = events.filter((e) => e.entityId === id);
      expect(mine.length, `${type} ${id} has no audit event`).toBeGreaterThan(0);
      for (const e of mine) {
        expect(e.actorId, `${e.action} names its actor`).toBeTruthy();
        expect(e.at).toBeInstanceOf(Date);
        expect(e.newValues, `${e.action} records its new values`).not.toBeNull();
      }
    }
    // Signatures: each is announced by an event carrying its meaning (pre-issue signatures by id;
    // the approval and the acceptance by the report events that wrote them in the same transaction).
    const sigs = await db.select().from(signatures).where(eq(signatures.jobId, jobId));
    expect(sigs.map((s) => s.meaning).sort()).toEqual([
      "accepted",
      "approved",
      "inspected",
      "parameters_approved",
      "performed",
    ]);
    for (const s of sigs) {
      const byId = events.some((e) => e.entityId === s.id);
      const byReport = events.some(
        (e) =>
          e.entityId === s.reportId &&
          e.action === (s.meaning === "approved" ? "report.issued" : `report.${s.meaning}`),
      );
      expect(byId || byReport, `signature ${s.meaning} is audited`).toBe(true);
    }
  });

  it("rebuilds the job's status history from the events alone, ending at its current status", async () => {
    const events = await db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.jobId, jobId))
      .orderBy(asc(auditEvents.id));
    const created = events.find((e) => e.action === "job.created")!;
    let status = (created.newValues as { status: string }).status;
    const seen = [status];
    for (const e of events) {
      const o = e.oldValues as { status?: string } | null;
      const n = e.newValues as { status?: string } | null;
      if (e === created || !n?.status || e.entityType === "dataset") continue;
      expect(o?.status, `${e.action} says which status it left`).toBe(status);
      status = n.status;
      seen.push(status);
    }
    const [job] = await db.select({ status: jobs.status }).from(jobs).where(eq(jobs.id, jobId));
    expect(status).toBe(job!.status);
    expect(seen).toEqual(["draft", "measuring", "in_review", "approved", "issued", "accepted"]);
  });

  it("a correction names the value it replaced, and a deletion the state it ended", async () => {
    // The explicit correction (note "misread"); a later reading of the same step and phase also
    // supersedes the current one, so pick the reading this correction replaced.
    const all = await db.select().from(readings).where(eq(readings.jobId, jobId));
    const correction = all.find((r) => r.note === "misread");
    const old = all.filter((r) => correction && r.supersededById === correction.id);
    expect(old).toHaveLength(1);
    const [fix] = await auditEventsOf({ entityId: old[0]!.supersededById! }, "reading.corrected");
    expect(fix!.oldValues).toMatchObject({ id: old[0]!.id, value: old[0]!.value });
    const [gone] = await db
      .select()
      .from(datasets)
      .where(and(eq(datasets.jobId, jobId), eq(datasets.status, "deleted")));
    const [del] = await auditEventsOf({ entityId: gone!.id }, "dataset.deleted");
    expect(del).toMatchObject({ oldValues: { status: "stored" }, newValues: { status: "deleted" } });
  });
});

// ---- 2. the source scan --------------------------------------------------------------------

const AUDITED_TABLES = [
  "jobs",
  "readings",
  "datasets",
  "analyses",
  "analysisViews",
  "reportViews",
  "jobInstruments",
  "signatures",
  "reports",
  "deviations",
  "photos",
  "environmentRecords",
  "controlValueRecords",
  "analysisBudgetInputs",
];
const WRITE = new RegExp(`\\.(insert|update|delete)\\((${AUDITED_TABLES.join("|")})\\)`, "g");
/** An insert through db/queries/audit.ts's insertJobRecord(tx, actor, table, …), which audits it. */
const AUDITED_INSERT = new RegExp(
  `insertJobRecord\\(\\s*\\w+,\\s*[^,]+,\\s*(${AUDITED_TABLES.join("|")}),`,
  "g",
);

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = path.join(dir, f);
    return statSync(p).isDirectory() ? sourceFiles(p) : /\.tsx?$/.test(f) ? [p] : [];
  });
}

/** Top-level functions of a file with their bodies (from one `function`/`export const … =` to the next). */
function functionsOf(src: string): Array<{ name: string; body: string }> {
  const starts = [...src.matchAll(/^(?:export )?(?:async )?function (\w+)|^export const (\w+) = /gm)];
  return starts.map((m, i) => ({
    name: m[1] ?? m[2]!,
    body: src.slice(m.index, starts[i + 1]?.index ?? src.length),
  }));
}

describe("no write path skips the audit trail", () => {
  const files = [...sourceFiles("db/queries"), ...sourceFiles("app"), ...sourceFiles("lib")];

  it("finds the known write paths (the scan itself works)", () => {
    const writersBy = (pattern: RegExp) =>
      files.flatMap((f) =>
        functionsOf(readFileSync(f, "utf8"))
          .filter((fn) => fn.body.match(pattern))
          .map((fn) => `${f}:${fn.name}`),
      );
    const writers = writersBy(WRITE);
    for (const known of [
      "db/queries/readings.ts:recordReading",
      "db/queries/job-status.ts:changeJobStatus",
      "db/queries/reports.ts:issueReport",
      "db/queries/datasets.ts:deleteDataset",
    ])
      expect(writers).toContain(known);
    const helperWriters = writersBy(AUDITED_INSERT);
    for (const known of [
      "db/queries/photos.ts:addPhoto",
      "db/queries/signatures.ts:signJobWork",
      "db/queries/readiness.ts:recordDeviation",
    ])
      expect(helperWriters).toContain(known);
  });

  it("insertJobRecord appends the event of the row it inserts, after inserting it", () => {
    const helper = functionsOf(readFileSync("db/queries/audit.ts", "utf8")).find(
      (fn) => fn.name === "insertJobRecord",
    );
    const body = helper?.body ?? "";
    const inserted = body.indexOf(".insert(");
    expect(inserted, "insertJobRecord inserts a row").toBeGreaterThan(0);
    expect(body.indexOf("appendAudit(", inserted), "and then appends its event").toBeGreaterThan(inserted);
    expect(body).toContain("id: row!.id");
  });

  it("every function that writes an audited table calls appendAudit, and only db/queries writes them", () => {
    const missing: string[] = [];
    for (const f of files) {
      for (const fn of functionsOf(readFileSync(f, "utf8"))) {
        const writes = [...fn.body.matchAll(WRITE)].map((m) => m[0]);
        const audited = [...fn.body.matchAll(AUDITED_INSERT)].map((m) => m[0]);
        if (!f.startsWith(`db${path.sep}queries`) && writes.length + audited.length > 0)
          missing.push(`${f}:${fn.name} writes ${[...writes, ...audited].join(", ")} outside db/queries`);
        else if (writes.length > 0 && !fn.body.includes("appendAudit("))
          missing.push(`${f}:${fn.name} writes ${writes.join(", ")} without appendAudit`);
      }
    }
    expect(missing).toEqual([]);
  });
});
