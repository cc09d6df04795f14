// What the issued report says about a head fit, against the real database: each parameter judged
// against the limits of the job's procedure version (checked here by hand from the ISO 14253-1
// rules: simple = inside the limits; guarded = inside the limits narrowed by U, outside the limits
// widened by U fails), the engineer's saved 3D view embedded byte for byte (pdfimages, from
// poppler, an independent reader), and the charts' numbers. Job of its own.
import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { PNG } from "pngjs";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { runHeadFit } from "@/db/queries/analyses";
import { saveAnalysisView } from "@/db/queries/analysis-views";
import { chooseReportView } from "@/db/queries/report-views";
import { getJobConformity, issueReport } from "@/db/queries/reports";
import { saveProcedureVersion } from "@/db/queries/procedures";
import { getTemplate } from "@/db/queries/templates";
import { procedureTemplates, reports, templateParameterLimits, templateSteps } from "@/db/schema";
import type { HeadFitJson } from "@/geometry";
import type { ReportData } from "@/lib/report/types";
import { stepInputFromRow, type StepRow } from "@/lib/validations/procedures";
import { pdfFile, pdfImageSizes, pdfText } from "../pdf-tools";
import {
  actorsBeforeAll,
  BASE_JOB,
  DEMO_PASSWORD as PW,
  insertTestJob,
  uploadDemoProbe,
  measureSignAndApprove,
} from "./fixtures";
import { carryOpenResults, jobBaseOf } from "./ready-job";

const as = actorsBeforeAll();
let jobId = "";
let templateId = "";
let fit: HeadFitJson;
let poseResiduals: number[][];
let content: ReportData;
let pdf: Buffer;
let provisional: Awaited<ReturnType<typeof getJobConformity>>;
let provisionalForCustomer: Awaited<ReturnType<typeof getJobConformity>>;
const viewPng = (() => {
  // At the report's least size for a view (lib/report/view-choice: 600 × 400 px).
  const png = new PNG({ width: 600, height: 400 });
  for (let i = 0; i < png.data.length; i += 4) png.data.set([0x5f, 0x7d, 0x99, 255], i);
  return PNG.sync.write(png);
})();

beforeAll(async () => {
  templateId = (await jobBaseOf(BASE_JOB)).templateId;
  jobId = await insertTestJob({
    tag: "RPT",
    title: "Report content test job",
    template: true,
  });
  const { analysis } = await runHeadFit(as.engineer!, await uploadDemoProbe(jobId));
  fit = analysis.result.fit;
  poseResiduals = analysis.result.poses.residual_um.map((r) => [...r]);
  // The gates before issue (lib/report/readiness.ts): every step measured, signed over that record,
  // and each FAIL or undecided parameter carried as a deviation.
  await measureSignAndApprove(as, jobId, analysis.id);
  await carryOpenResults(as.engineer!, jobId, "Within the machine builder's acceptance for this demo head.");
  const saved = await saveAnalysisView(as.engineer!, analysis.id, {
    png: viewPng,
    factor: 300,
    overlayAnalysisId: null,
    caption: "Looking along −Y",
  });
  await chooseReportView(as.engineer!, { viewId: saved.id, include: true });
  provisional = await getJobConformity(as.engineer!, jobId);
  provisionalForCustomer = await getJobConformity(as.buyer!, jobId);
  const { reportId } = await issueReport(as.engineer!, { jobId, password: PW });
  const [r] = await db.select().from(reports).where(eq(reports.id, reportId));
  content = r!.content as ReportData;
  pdf = r!.pdf;
}, 60_000);

describe("the statement of conformity on the job's page (ISO/IEC 17025:2017 §7.8.6)", () => {
  it("before issue: staff see the provisional statement, the same the report then prints; customers none", async () => {
    expect(provisional).toEqual({ conformity: content.conformity, issuedRevision: null });
    expect(provisionalForCustomer).toBeNull();
  });
  it("after issue: everyone who sees the job sees the issued revision's statement", async () => {
    for (const who of ["engineer", "buyer"])
      expect(await getJobConformity(as[who]!, jobId)).toEqual({
        conformity: content.conformity,
        issuedRevision: 1,
      });
    expect(await getJobConformity(as["buyer-tollan"]!, jobId)).toBeNull();
  });
  it("prints the decision rule and limit source on every judged row (§7.8.6.1)", () => {
    const rows = [...content.readings, ...content.parameters, ...content.testPart];
    const judged = rows.filter((r) => r.decision !== "recorded" && r.decision !== "not_measured");
    expect(judged.length).toBeGreaterThan(0);
    for (const r of judged) expect(r.basis).toMatch(/^Rule: (simple|guarded \(ISO 14253-1\))(; limit: .+)?$/);
    for (const r of rows.filter((x) => !judged.includes(x))) expect(r.basis).toBeUndefined();
  });
});

describe("head parameters in the report", () => {
  it("judges each parameter against the procedure's limit with its rule and U, as ISO 14253-1 says", async () => {
    const limits = await db
      .select()
      .from(templateParameterLimits)
      .where(eq(templateParameterLimits.templateId, templateId));
    expect(limits.length).toBeGreaterThan(0);
    for (const p of fit.parameters) {
      const lim = limits.find((l) => l.parameter === p.key);
      const row = content.parameters.find((r) => r.symbol === p.iso)!;
      let expected: string;
      if (!lim) expected = "recorded";
      else if (p.U === null) expected = "not_measured";
      else {
        const lo = lim.lowerLimit!;
        const hi = lim.upperLimit!;
        if (lim.decisionRule === "simple") expected = p.value >= lo && p.value <= hi ? "pass" : "fail";
        else
          expected =
            p.value >= lo + p.U && p.value <= hi - p.U
              ? "pass"
              : p.value < lo - p.U || p.value > hi + p.U
                ? "fail"
                : "undecided";
      }
      expect(row.decision, p.key).toBe(expected);
      if (lim)
        expect(row.tolerance).toBe(
          p.unit === "um" ? `± ${lim.upperLimit!.toFixed(1)} µm` : `± ${lim.upperLimit!.toFixed(1)}″`,
        );
    }
    // The demo limits include a guarded one and the held parameter, so both paths are exercised.
    expect(limits.some((l) => l.decisionRule === "guarded")).toBe(true);
    expect(content.parameters.some((r) => r.decision === "not_measured")).toBe(true);
  });

  it("names the procedure and its version, and the chart carries the same numbers as the table", () => {
    expect(content.work.procedure).toMatch(/, version \d+$/);
    const judged = fit.parameters.filter((p) => p.U !== null);
    expect(content.charts!.parameters!.map((c) => c.value)).toEqual(judged.map((p) => p.value));
    expect(content.charts!.parameters!.map((c) => c.U)).toEqual(judged.map((p) => p.U));
  });

  it("keeps the largest residual in the thinned residual chart, and the pose count", () => {
    const r = content.charts!.residuals!;
    const worst = Math.max(...poseResiduals.map((v) => Math.max(...v.map(Math.abs))));
    expect(r.totalPoses).toBe(poseResiduals.length);
    expect(r.valuesUm.length).toBeLessThanOrEqual(240);
    expect(Math.max(...r.valuesUm)).toBeCloseTo(worst, 3);
  });
});

describe("the saved 3D view in the report", () => {
  it("names the picture by its SHA-256 in the signed content and embeds it at its size", () => {
    expect(content.figures).toHaveLength(1);
    expect(content.figures[0]!.sha256).toBe(createHash("sha256").update(viewPng).digest("hex"));
    expect(content.figures[0]!.caption).toMatch(/× 300.*Looking along −Y/);
    const file = pdfFile(pdf);
    expect(pdfImageSizes(file)).toContain("600x400");
    const text = pdfText(file, true);
    expect(text).toContain("Fitted head parameters against the procedure's limits.");
    expect(text).toContain("Residuals of the approved head fit per pose.");
  });
});

describe("procedure versions", () => {
  /** A procedure of its own (so the demo procedure's current version is untouched) with one step and two limits, followed by a job. */
  async function versionInUse(tag: string) {
    const [base] = await db
      .insert(procedureTemplates)
      .values({
        name: `Limits ${tag} test ${Date.now().toString(36)}`,
        version: 1,
        createdById: as.admin!.id,
      })
      .returning();
    const [step] = await db
      .select()
      .from(templateSteps)
      .where(eq(templateSteps.templateId, templateId))
      .limit(1);
    const { id: _s, templateId: _t, ...stepValues } = step!;
    await db.insert(templateSteps).values({ ...stepValues, templateId: base!.id });
    await db.insert(templateParameterLimits).values([
      {
        templateId: base!.id,
        parameter: "pivot_length_error_um",
        lowerLimit: -30,
        upperLimit: 30,
        decisionRule: "guarded",
        limitSource: "customer_spec",
        limitSourceNote: "test",
      },
      {
        templateId: base!.id,
        parameter: "secondary_tilt_arcsec",
        lowerLimit: null,
        upperLimit: 12,
        decisionRule: "simple",
        limitSource: "common_practice",
        limitSourceNote: null,
      },
    ]);
    // A job follows version 1, so saving publishes version 2.
    await insertTestJob({
      tag: "VER",
      title: "Follows version 1",
      status: "draft",
      template: true,
      assignedInstallerId: null,
      base: { ...(await jobBaseOf(BASE_JOB)), templateId: base!.id },
    });
    const t = await getTemplate(as.admin!, base!.id);
    // The body the builder sends back: the same steps, in their own units.
    return { base: base!, body: { steps: t!.steps.map((x) => stepInputFromRow(x as StepRow)) } };
  }
  const limitsOf = (id: string) =>
    db.select().from(templateParameterLimits).where(eq(templateParameterLimits.templateId, id));

  it("carry the head-parameter limits into the new version unchanged when the body leaves them out", async () => {
    const { base, body } = await versionInUse("copy");
    const before = await limitsOf(base.id);
    const next = await saveProcedureVersion(as.admin!, base.id, body);
    expect(next.version).toBe(2);
    const after = await limitsOf(next.id);
    const strip = ({ id: _i, templateId: _tt, ...l }: (typeof before)[number]) => l;
    const byKey = (a: { parameter: string }, b: { parameter: string }) =>
      a.parameter.localeCompare(b.parameter);
    expect(after.map(strip).sort(byKey)).toEqual(before.map(strip).sort(byKey));
  });

  it("apply the parameter limits sent in the new version: changed, removed, added; a bad one creates nothing", async () => {
    const { base, body } = await versionInUse("edit");
    const refused = await saveProcedureVersion(as.admin!, base.id, {
      ...body,
      parameterLimits: [
        {
          parameter: "tip_offset_s_um",
          lower: 5,
          upper: -5,
          decisionRule: "simple",
          limitSource: "standard",
        },
      ],
    }).then(
      () => null,
      (e: { status?: number; message: string; issues?: { field: string }[] }) => e,
    );
    expect(refused?.status).toBe(422);
    expect(refused?.issues?.map((i) => i.field)).toEqual([
      "parameterLimits.0.lower",
      "parameterLimits.0.limitSourceNote",
    ]);
    expect(
      await db.select().from(procedureTemplates).where(eq(procedureTemplates.name, base.name)),
    ).toHaveLength(1);

    const next = await saveProcedureVersion(as.admin!, base.id, {
      ...body,
      parameterLimits: [
        {
          parameter: "pivot_length_error_um",
          lower: -25,
          upper: 25,
          decisionRule: "guarded",
          limitSource: "maker_manual",
          limitSourceNote: "sheet 4",
        },
        // Both limits empty: recorded, not judged.
        { parameter: "secondary_tilt_arcsec", lower: null, upper: null, limitSource: "customer_spec" },
        {
          parameter: "primary_zero_arcsec",
          lower: -40,
          upper: 40,
          decisionRule: "simple",
          limitSource: "customer_spec",
          limitSourceNote: "acceptance sheet",
        },
      ],
    });
    const by = Object.fromEntries((await limitsOf(next.id)).map((l) => [l.parameter, l]));
    expect(Object.keys(by).sort()).toEqual(["pivot_length_error_um", "primary_zero_arcsec"]);
    expect(by.pivot_length_error_um).toMatchObject({
      lowerLimit: -25,
      upperLimit: 25,
      decisionRule: "guarded",
      limitSource: "maker_manual",
      limitSourceNote: "sheet 4",
    });
    // The earlier version keeps its own limits.
    expect(await limitsOf(base.id)).toHaveLength(2);
  });
});
