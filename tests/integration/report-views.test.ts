// The engineer's choice of saved 3D views for the report, against the real database: only a view
// of the approved fit of at least 600 × 400 px may be ticked (refused with the reason otherwise),
// the choice is audited with old and new values, other roles are refused and change nothing, and
// the issued report prints exactly the ticked views (ISO/IEC 17025:2017 §7.8.1.1: results
// reported accurately and unambiguously — no picture of a fit the report does not vouch for).
import { and, desc, eq } from "drizzle-orm";
import { PNG } from "pngjs";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { runHeadFit } from "@/db/queries/analyses";
import { saveAnalysisView } from "@/db/queries/analysis-views";
import { chooseReportView, reportViewChoices } from "@/db/queries/report-views";
import { issueReport } from "@/db/queries/reports";
import { auditEvents, jobs, reports } from "@/db/schema";
import type { ReportData } from "@/lib/report/types";
import { carryOpenResults } from "./ready-job";
import {
  actorsBeforeAll,
  measureSignAndApprove,
  DEMO_PASSWORD as PW,
  insertTestJob,
  refusalOf,
  uploadDemoProbe,
} from "./fixtures";

const as = actorsBeforeAll();
let jobId = "";
let analysisId = "";
let otherAnalysisId = "";
const png = (w: number, h: number) => PNG.sync.write(new PNG({ width: w, height: h }));
const save = async (analysis: string, w: number, h: number, caption: string) =>
  (
    await saveAnalysisView(as.engineer!, analysis, {
      png: png(w, h),
      factor: 500,
      overlayAnalysisId: null,
      caption,
    })
  ).id;

beforeAll(async () => {
  jobId = await insertTestJob({
    tag: "VW",
    title: "Report views test job",
    template: true,
  });
  const ids: string[] = [];
  for (const name of ["a.csv", "b.csv"]) ids.push(await uploadDemoProbe(jobId, { filename: name }));
  analysisId = (await runHeadFit(as.engineer!, ids[0]!)).analysis.id;
  otherAnalysisId = (await runHeadFit(as.engineer!, ids[1]!)).analysis.id;
}, 60_000);

describe("choosing saved views for the report", () => {
  it("refuses any view before a fit is approved", async () => {
    const v = await save(analysisId, 800, 600, "early");
    const e = await refusalOf(chooseReportView(as.engineer!, { viewId: v, include: true }));
    expect(e.status).toBe(422);
    expect(e.message).toMatch(/No fit is approved/);
  });

  it("refuses a view of another fit and a view under 600 × 400 px, with the reason; nothing stored", async () => {
    await measureSignAndApprove(as, jobId, analysisId);
    await carryOpenResults(as.engineer!, jobId, "Accepted for the test job.");
    const other = await save(otherAnalysisId, 800, 600, "other fit");
    expect(
      (await refusalOf(chooseReportView(as.engineer!, { viewId: other, include: true }))).message,
    ).toMatch(/not the approved one/);
    const tiny = await save(analysisId, 64, 40, "tiny");
    expect(
      (await refusalOf(chooseReportView(as.engineer!, { viewId: tiny, include: true }))).message,
    ).toMatch(/64 × 40 px.*600 × 400/);
    const choices = await reportViewChoices(jobId);
    expect(choices.has(other)).toBe(false);
    expect(choices.has(tiny)).toBe(false);
  });

  it("other roles are refused (403), the other tenant's customer is told there is no such view (404)", async () => {
    const v = await save(analysisId, 600, 400, "for roles");
    for (const who of ["installer", "inspector", "admin", "buyer"])
      expect((await refusalOf(chooseReportView(as[who]!, { viewId: v, include: true }))).status).toBe(403);
    expect(
      (await refusalOf(chooseReportView(as["buyer-tollan"]!, { viewId: v, include: true }))).status,
    ).toBe(404);
    expect((await reportViewChoices(jobId)).has(v)).toBe(false);
  });

  it("the engineer ticks and unticks; each change is audited; the report prints exactly the ticked views", async () => {
    const first = await save(analysisId, 600, 400, "<b>first</b> view");
    const second = await save(analysisId, 1200, 800, "second view");
    const dropped = await save(analysisId, 900, 600, "dropped view");
    for (const v of [first, second, dropped])
      await chooseReportView(as.engineer!, { viewId: v, include: true });
    await chooseReportView(as.engineer!, { viewId: dropped, include: false });
    const [ev] = await db
      .select()
      .from(auditEvents)
      .where(
        and(eq(auditEvents.entityId, dropped), eq(auditEvents.action, "analysis_view.left_out_of_report")),
      )
      .orderBy(desc(auditEvents.id));
    expect(ev).toMatchObject({ oldValues: { included: true }, newValues: { included: false }, jobId });

    await db.update(jobs).set({ status: "approved" }).where(eq(jobs.id, jobId));
    const { reportId } = await issueReport(as.engineer!, { jobId, password: PW });
    const [r] = await db.select().from(reports).where(eq(reports.id, reportId));
    const figures = (r!.content as ReportData).figures;
    expect(figures.map((f) => f.viewId)).toEqual([first, second]);
    // The caption is text: the markup is kept as characters, never interpreted.
    expect(figures[0]!.caption).toContain("<b>first</b> view");
  });
});
