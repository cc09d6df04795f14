"use server";

import { fitApproverRefusal } from "@/lib/policy/analyses";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { approveAnalysis, runHeadFit } from "@/db/queries/analyses";
import { chooseReportView } from "@/db/queries/report-views";
import { action } from "@/lib/actions";
import { zUuid } from "@/lib/domain/uuid";

/** Runs (or finds the stored) head fit of a sphere-probe dataset; the role and tenant checks are in runHeadFit. */
export const runFitAction = action(
  {
    schema: z.object({
      jobId: zUuid("jobId must be a job id"),
      datasetId: zUuid("datasetId must be a dataset id"),
    }),
  },
  async ({ jobId, datasetId }, actor) => {
    const { analysis, created } = await runHeadFit(actor, datasetId);
    revalidatePath(`/jobs/${jobId}/analysis`);
    return { id: analysis.id, reused: !created };
  },
);

/**
 * An engineer approves a fit as the job's parameter set: a signature ("parameters approved") given
 * with the password entered again (in review → approved; signed and audited together).
 */
export const approveFitAction = action(
  {
    schema: z.object({
      jobId: zUuid("jobId must be a job id"),
      analysisId: zUuid("analysisId must be an analysis id"),
      password: z
        .string({ error: "Re-enter your password to sign." })
        .min(1, "Re-enter your password to sign."),
      /** Comma-separated keys of the non-conforming parameters the engineer confirmed (a checkbox). */
      acknowledged: z.string().optional(),
    }),
    refusal: fitApproverRefusal,
  },
  async ({ jobId, analysisId, password, acknowledged }, actor) => {
    const keys = (acknowledged ?? "").split(",").filter((k) => k !== "");
    const r = await approveAnalysis(actor, analysisId, password, keys);
    revalidatePath(`/jobs/${jobId}`, "layout");
    return r;
  },
);

/**
 * The engineer ticks (or unticks) a saved 3D view for the report; only views of the approved fit
 * of at least 600 × 400 px may be ticked (db/queries/report-views.chooseReportView checks who and
 * what, and refuses with the reason).
 */
export const chooseReportViewAction = action(
  {
    schema: z.object({
      jobId: zUuid("jobId must be a job id"),
      viewId: zUuid("viewId must be a saved view's id"),
      include: z.preprocess((v) => v === true || v === "true" || v === "on", z.boolean()),
    }),
  },
  async ({ jobId, viewId, include }, actor) => {
    const r = await chooseReportView(actor, { viewId, include });
    revalidatePath(`/jobs/${jobId}/analysis`);
    revalidatePath(`/jobs/${jobId}/report`);
    return r;
  },
);
