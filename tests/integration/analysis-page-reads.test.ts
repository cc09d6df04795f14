// The analysis page's reads: the list of fits leaves the per-pose arrays out, withPoses puts back
// exactly the stored ones for the fit shown, and the visit plan is lib/pose-coverage's own result
// on those poses, computed once per fit and configuration. Reads the seeded demo job only.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { headConfigOf, listJobAnalyses, visitPlanOf, withPoses } from "@/db/queries/analyses";
import { getJobDetail } from "@/db/queries/jobs";
import { getActor } from "@/db/queries/users";
import { analyses } from "@/db/schema";
import type { Actor } from "@/lib/domain/roles";
import { nextVisitPlan } from "@/lib/pose-coverage";
import { jobIdByReference, signInAs } from "./helpers";

let engineer: Actor;
let jobId = "";

beforeAll(async () => {
  engineer = (await getActor((await signInAs("engineer@halvard.example"))!))!;
  jobId = await jobIdByReference("TR-2026-0052");
});

describe("analysis page reads", () => {
  it("lists fits without poses and reads back the stored poses of one", async () => {
    const list = (await listJobAnalyses(engineer, jobId))!;
    expect(list.length).toBeGreaterThan(0);
    for (const row of list) {
      expect(row.analysis.result).not.toHaveProperty("poses");
      const [stored] = await db.select().from(analyses).where(eq(analyses.id, row.analysis.id));
      const full = await withPoses(row);
      // Everything stored, nothing more: the list's summary plus the poses is the stored JSON.
      expect(full.analysis.result).toEqual(stored!.result);
      expect(full.analysis.id).toBe(row.analysis.id);
      expect(full.datasetFilename).toBe(row.datasetFilename);
    }
  });

  it("gives the pose planner's own result, computed once per fit and configuration", async () => {
    const [row] = (await listJobAnalyses(engineer, jobId))!;
    const full = await withPoses(row!);
    const config = headConfigOf((await getJobDetail(engineer, jobId))!.head);
    const p = full.analysis.result.poses;
    const plan = visitPlanOf(full.analysis, config);
    expect(plan).toEqual(nextVisitPlan(config, p.primary_deg, p.secondary_deg, p.tool_mm));
    expect(visitPlanOf(full.analysis, config)).toBe(plan);
    // Another configuration is another plan, not the remembered one.
    const longer = { ...config, pivotLengthMm: config.pivotLengthMm + 10 };
    expect(visitPlanOf(full.analysis, longer)).not.toBe(plan);
    expect(visitPlanOf(full.analysis, longer)).toEqual(
      nextVisitPlan(longer, p.primary_deg, p.secondary_deg, p.tool_mm),
    );
  });
});
