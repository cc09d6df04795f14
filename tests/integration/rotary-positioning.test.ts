// ISO 230-2 positioning of a rotary axis through the app, against the real database: the public
// worked data set (the ISO 230-2 test report in the open-source repository
// paulscherrerinstitute/ecmccfg, examples/test/fat_sat/report.md; tests/fixtures/iso230-2-public.ts)
// uploaded as degrees, its stored evaluation recomputed to the report's printed figures (mm there,
// × 3600 here: the same numbers read as degrees give arc seconds); then a procedure that limits
// the primary axis blocks issue until a test is stored, judges it, takes a deviation for its FAIL,
// and the report (content and the PDF read back with pdftotext) prints section 5.4.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as draftRoute } from "@/app/api/jobs/[id]/report/draft/route";
import { GET as procedureGet } from "@/app/api/procedures/[id]/route";
import { POST as versionPost } from "@/app/api/procedures/[id]/versions/route";
import { db } from "@/db";
import {
  jobRotaryPositioning,
  positioningJobOf,
  positioningLimitsOfTemplate,
} from "@/db/queries/positioning";
import { saveProcedureVersion } from "@/db/queries/procedures";
import { getReadiness, recordDeviation } from "@/db/queries/readiness";
import { getReportContent, issueReport } from "@/db/queries/reports";
import { getJobDetail } from "@/db/queries/jobs";
import { getActor } from "@/db/queries/users";
import { auditEvents, datasets, jobs, procedureTemplates, templatePositioningLimits } from "@/db/schema";
import { rotaryPositioningSubject } from "@/lib/rotary-positioning-display";
import { pdfText } from "../pdf-tools";
import { BIDIRECTIONAL, PRINTED_AXIS, publicDataCsv } from "../fixtures/iso230-2-public";
import { upload } from "./dataset-helpers";
import { issueFields, jsonBody, request, signInAs } from "./helpers";
import { actorsBeforeAll, insertTestJob, signPerformedAndInspected } from "./fixtures";
import { jobBaseOf } from "./ready-job";

const PW = "trammel-demo";
const as = actorsBeforeAll([
  "installer@halvard.example",
  "inspector@halvard.example",
  "engineer@halvard.example",
]);
const p = (id: string) => ({ params: Promise.resolve({ id }) });
let jobId = "";

/** The report's printed figures (mm, rounded to 8 decimals) as arc seconds, to half a unit of that rounding. */
const printedArcsec = (value: number, printedMm: number, what?: string) =>
  expect(Math.abs(value - printedMm * 3600), what).toBeLessThanOrEqual(0.5e-8 * 3600 + 1e-12);

beforeAll(async () => {
  // A procedure version of our own (no steps) that limits the primary axis: A ≤ 0.25″, R ≤ 0.3″.
  const [t] = await db
    .insert(procedureTemplates)
    .values({ name: `Positioning procedure ${Date.now().toString(36)}`, version: 1 })
    .returning();
  await db.insert(templatePositioningLimits).values([
    {
      templateId: t!.id,
      axis: "primary",
      quantity: "A",
      upperLimitArcsec: 0.25,
      limitSource: "customer_spec",
    },
    {
      templateId: t!.id,
      axis: "primary",
      quantity: "R",
      upperLimitArcsec: 0.3,
      limitSource: "standard",
      limitSourceNote: "ISO 230-2 test of record",
    },
  ]);
  // Head TH-2241 (invented demo head): primary axis C, secondary A.
  jobId = await insertTestJob({
    tag: "ROT",
    title: "Rotary positioning job",
    kind: "after_crash",
    status: "approved",
    template: true,
    base: { ...(await jobBaseOf("TR-2026-0052")), templateId: t!.id },
  });
}, 30_000);

const codes = async () => (await getReadiness(as.engineer!, jobId))!.blockers.map((b) => b.code);

describe("a rotary positioning test through the app", () => {
  it("blocks issue while the limited axis has no test", async () => {
    await signPerformedAndInspected(as, jobId);
    expect(await codes()).toEqual(["rotary_positioning_missing"]);
    const refused = await issueReport(as.engineer!, { jobId, password: PW }).then(
      () => "issued",
      (e: { status?: number; code?: string }) => `${e.status} ${e.code}`,
    );
    expect(refused).toBe("409 not_ready");
  });

  it("refuses a file without the axis field, a file for another axis letter, and too few runs", async () => {
    await signInAs("installer@halvard.example");
    const csv = Buffer.from(publicDataCsv("C"));
    const noAxis = await upload(jobId, csv, { kind: "rotary_positioning", phase: "post" });
    expect(noAxis.status).toBe(422);
    expect((await noAxis.json()).error.issues).toEqual([
      { field: "axis", message: "choose the primary (rotary) or the secondary (tilt) axis" },
    ]);
    // The head's secondary axis is A; a C-axis file filed as the tilt axis is refused.
    const wrong = await upload(jobId, csv, { kind: "rotary_positioning", phase: "post", axis: "secondary" });
    expect(wrong.status).toBe(422);
    expect((await wrong.json()).error.message).toBe(
      "The file is for axis C; the head's secondary (tilt) axis is A.",
    );
    const few = await upload(
      jobId,
      Buffer.from("target_deg,run,direction,measured_deg\n0,1,pos,0\n0,2,pos,0.001\n0,1,neg,0\n"),
      { kind: "rotary_positioning", phase: "post", axis: "primary" },
    );
    expect(few.status).toBe(422);
    expect(JSON.stringify(await few.json())).toMatch(/1 run in the neg direction/);
    const stored = await db.select().from(datasets).where(eq(datasets.jobId, jobId));
    expect(stored).toEqual([]);
  });

  it("stores the public data set's figures (ecmccfg fat_sat report, × 3600) and judges them", async () => {
    await signInAs("installer@halvard.example");
    const res = await upload(
      jobId,
      Buffer.from(publicDataCsv("C")),
      { kind: "rotary_positioning", phase: "post", axis: "primary", uncertainty_arcsec: "0.02" },
      "c-axis-iso230-2.csv",
    );
    expect(res.status).toBe(201);
    const { id } = await res.json();
    const [row] = await db.select().from(datasets).where(eq(datasets.id, id));
    expect(row!.units).toEqual({ axis: "primary", uncertainty_arcsec: 0.02 });
    const s = (row!.summary as { rotary: Record<string, number> & { axis: string; targets: unknown[] } })
      .rotary;
    expect(s.axis).toBe("C");
    expect(s.targets).toHaveLength(5);
    // Printed by the report: A, A↑, A↓, M, B, B̄, E↑, E↓, R↑, R↓; and ISO 230-2's bidirectional R
    // and E recomputed from its printed per-target figures (check values 0.0688 µm, 0.0368 µm).
    for (const [q, mm] of [...PRINTED_AXIS, ...BIDIRECTIONAL]) printedArcsec(s[q]!, mm, q);

    // Judged with the job's rule (simple): A 0.32″ > 0.25″ fails, R 0.25″ ≤ 0.3″ passes.
    const d = (await getJobDetail(as.engineer!, jobId))!;
    const judged = await jobRotaryPositioning(positioningJobOf(d));
    expect(judged.required).toEqual(["primary"]);
    const test = judged.latest.primary!;
    expect(test.view.axisText).toBe("primary (rotary) axis C");
    expect(
      test.view.rows.filter((r) => r.decision !== "recorded").map((r) => [r.symbol, r.both, r.decision]),
    ).toEqual([
      ["A", "0.32″", "fail"],
      ["R", "0.25″", "pass"],
    ]);
    expect(test.view.decision).toBe("fail");

    // The new data makes the signatures stale; signed again, the FAIL is what stands.
    expect(await codes()).toEqual(["signature_stale", "signature_stale", "result_not_conforming"]);
    await signPerformedAndInspected(as, jobId);
    expect(await codes()).toEqual(["result_not_conforming"]);
    await recordDeviation(as.engineer!, {
      jobId,
      subject: rotaryPositioningSubject(id),
      justification: "Accuracy 0.07″ over the customer's figure; accepted by the customer for this head.",
    });
    expect(await codes()).toEqual([]);
  }, 60_000);

  it("prints 5.4 in the draft PDF and issues a report that conforms with the deviation", async () => {
    await signInAs("engineer@halvard.example");
    const draft = await draftRoute(request(`/api/jobs/${jobId}/report/draft`), p(jobId));
    expect(draft.status).toBe(200);
    const text = pdfText(Buffer.from(await draft.arrayBuffer()), true);
    expect(text).toContain("5.4 Positioning of the rotary axes (ISO 230-2)");
    expect(text).toContain("Primary (rotary) axis C: FAIL");
    expect(text).toContain("c-axis-iso230-2.csv");
    // pdftotext reads the table's cells in its own order: each figure and word is checked present.
    for (const cell of [
      "Accuracy of positioning (A)",
      "Repeatability of positioning (R)",
      "Mean reversal value (B̄)",
      "≤ 0.25″",
      "≤ 0.30″",
      "Customer specification FAIL",
      "Standard: ISO 230-2 test of record Pass",
      "-10° -4.88° 0.24° 5.36° 10.48°",
      "positioning of the rotary axes by ISO 230-2",
    ])
      expect(text).toContain(cell);
    expect(text).toContain("Mean positional deviation in arc seconds (″, left scale) at each target angle");

    const { reportId } = await issueReport(as.engineer!, { jobId, password: PW });
    const content = await getReportContent(as.engineer!, reportId);
    expect(content?.rotaryPositioning?.map((t) => [t.axis, t.file, t.decision])).toEqual([
      ["primary (rotary) axis C", "c-axis-iso230-2.csv", "fail"],
    ]);
    expect(content?.rotaryPositioning?.[0]!.chart.pos).toHaveLength(5);
    expect(content?.conformity?.verdict).toBe("conforms_with_deviations");
    expect(content?.conformity?.text).toContain("1 of 1 judged results");
  }, 60_000);
});

describe("the demo (invented data)", () => {
  it("TR-2026-0059 carries a passing C-axis positioning test against its procedure's A and R limits", async () => {
    const [row] = await db.select({ id: jobs.id }).from(jobs).where(eq(jobs.reference, "TR-2026-0059"));
    const d = (await getJobDetail(as.engineer!, row!.id))!;
    const p = await jobRotaryPositioning(positioningJobOf(d));
    expect(p.required).toEqual(["primary"]);
    expect(p.limits.map((l) => [l.axis, l.quantity, l.upperLimitArcsec])).toEqual([
      ["primary", "A", 20],
      ["primary", "R", 6],
    ]);
    expect(p.tests.map((t) => [t.view.axisText, t.view.targets, t.view.decision])).toEqual([
      ["primary (rotary) axis C", 12, "pass"],
    ]);
    expect((await getReadiness(as.engineer!, row!.id))!.blockers.map((b) => b.code)).not.toContain(
      "rotary_positioning_missing",
    );
  });
});

describe("a new procedure version", () => {
  it("keeps the positioning limits of the version it was made from", async () => {
    const admin = (await getActor((await signInAs("admin@halvard.example"))!))!;
    const [job] = await db.select({ templateId: jobs.templateId }).from(jobs).where(eq(jobs.id, jobId));
    // The builder's body: this version has no steps, and a version needs one, so it gains a note.
    const next = await saveProcedureVersion(admin, job!.templateId!, {
      steps: [{ title: "Findings", kind: "note" }],
    });
    const limits = await positioningLimitsOfTemplate(next.id);
    expect(limits.map((l) => [l.axis, l.quantity, l.upperLimitArcsec, l.limitSource])).toEqual([
      ["primary", "A", 0.25, "customer_spec"],
      ["primary", "R", 0.3, "standard"],
    ]);
  });

  it("takes new limits through the API's version body, reads them back, and judges a job on that version by them", async () => {
    await signInAs("admin@halvard.example");
    const [job] = await db.select({ templateId: jobs.templateId }).from(jobs).where(eq(jobs.id, jobId));
    const from = job!.templateId!;
    const post = (body: unknown, id = from) =>
      versionPost(request(`/api/procedures/${id}/versions`, jsonBody("POST", body)), p(id));
    const steps = [{ title: "Findings", kind: "note" }];
    // A limit without its source is refused, naming the field; nothing is stored.
    const refused = await post({
      steps,
      positioningLimits: [{ axis: "primary", quantity: "A", upper: 0.4 }],
    });
    expect(refused.status).toBe(422);
    expect(await issueFields(refused)).toEqual(["positioningLimits.0.limitSource"]);
    const unknown = await post({ steps, positioningLimits: [{ axis: "primary", quantity: "Q", upper: 1 }] });
    expect(unknown.status).toBe(422);
    expect(await issueFields(unknown)).toEqual(["positioningLimits.0.quantity"]);

    // A job follows `from`, so the body becomes a new version with the new limits.
    const res = await post({
      steps,
      positioningLimits: [
        {
          axis: "primary",
          quantity: "A",
          upper: "0.4",
          limitSource: "maker_manual",
          limitSourceNote: "Head data sheet",
        },
        { axis: "primary", quantity: "E", upper: 0.1, limitSource: "common_practice" },
        { axis: "secondary", quantity: "R", upper: "", limitSource: "" },
      ],
    });
    expect(res.status).toBe(201);
    const { procedure } = await res.json();
    const read = await (
      await procedureGet(request(`/api/procedures/${procedure.id}`), p(procedure.id))
    ).json();
    const rowsOf = (ls: ReadonlyArray<object>) =>
      (ls as Array<Record<string, unknown>>).map((l) => [
        l.axis,
        l.quantity,
        l.upperLimitArcsec,
        l.limitSource,
        l.limitSourceNote,
      ]);
    expect(rowsOf(read.procedure.positioningLimits)).toEqual([
      ["primary", "A", 0.4, "maker_manual", "Head data sheet"],
      ["primary", "E", 0.1, "common_practice", null],
    ]);
    // The version it came from keeps its own.
    expect((await positioningLimitsOfTemplate(from)).map((l) => [l.quantity, l.upperLimitArcsec])).toEqual([
      ["A", 0.25],
      ["R", 0.3],
    ]);
    const [audit] = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entityId, procedure.id), eq(auditEvents.action, "procedure.versioned")));
    expect(
      rowsOf((audit!.newValues as { positioningLimits: Array<Record<string, unknown>> }).positioningLimits),
    ).toEqual(rowsOf(read.procedure.positioningLimits));

    // Saved again without them (no job follows it yet, so in place), the version keeps them.
    const again = await post({ steps: [{ title: "Findings and photos", kind: "note" }] }, procedure.id);
    expect(again.status).toBe(200);
    expect(rowsOf(await positioningLimitsOfTemplate(procedure.id))).toEqual(
      rowsOf(read.procedure.positioningLimits),
    );

    // A job on the new version: the public data set (ecmccfg fat_sat report, × 3600) is judged by
    // the new limits: A 0.32″ ≤ 0.4″ passes, E 0.13″ > 0.1″ fails.
    const newJob = await insertTestJob({
      tag: "ROT2",
      title: "Rotary positioning job on the new version",
      kind: "after_crash",
      status: "approved",
      template: true,
      base: { ...(await jobBaseOf("TR-2026-0052")), templateId: procedure.id },
    });
    await signInAs("installer@halvard.example");
    const up = await upload(
      newJob,
      Buffer.from(publicDataCsv("C")),
      { kind: "rotary_positioning", phase: "post", axis: "primary" },
      "c-axis-new-limits.csv",
    );
    expect(up.status).toBe(201);
    const judged = await jobRotaryPositioning(positioningJobOf((await getJobDetail(as.engineer!, newJob))!));
    expect(judged.required).toEqual(["primary"]);
    expect(
      judged.latest
        .primary!.view.rows.filter((r) => r.decision !== "recorded")
        .map((r) => [r.symbol, r.limitText, r.decision]),
    ).toEqual([
      ["A", "≤ 0.40″", "pass"],
      ["E", "≤ 0.10″", "fail"],
    ]);
  }, 60_000);
});
