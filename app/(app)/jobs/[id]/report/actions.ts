"use server";

import { deviationRecorderRefusal, reportIssuerRefusal, reportResponderRefusal } from "@/lib/policy/reports";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { issueReport, respondToReport } from "@/db/queries/reports";
import { recordDeviation } from "@/db/queries/readiness";
import { signJobWork } from "@/db/queries/signatures";
import { action } from "@/lib/actions";
import { zUuid } from "@/lib/domain/uuid";

const password = z.string().min(1, "Re-enter your password to sign.");

export const signWorkAction = action(
  { schema: z.object({ jobId: zUuid(), meaning: z.enum(["performed", "inspected"]), password }) },
  async (input, actor) => {
    await signJobWork(actor, input);
    revalidatePath(`/jobs/${input.jobId}/report`);
    return { signed: input.meaning };
  },
);

export const issueReportAction = action(
  {
    schema: z.object({ jobId: zUuid(), password, amendmentReason: z.string().max(2000).optional() }),
    refusal: reportIssuerRefusal,
  },
  async (input, actor) => {
    const r = await issueReport(actor, {
      jobId: input.jobId,
      password: input.password,
      ...(input.amendmentReason ? { amendmentReason: input.amendmentReason } : {}),
    });
    revalidatePath(`/jobs/${input.jobId}`, "layout");
    return r;
  },
);

export const respondAction = action(
  {
    schema: z.object({
      jobId: zUuid(),
      reportId: zUuid(),
      decision: z.enum(["accepted", "rejected"]),
      password,
      comment: z.string().max(4000).optional(),
    }),
    refusal: reportResponderRefusal,
  },
  async (input, actor) => {
    await respondToReport(actor, {
      reportId: input.reportId,
      decision: input.decision,
      password: input.password,
      ...(input.comment ? { comment: input.comment } : {}),
    });
    revalidatePath(`/jobs/${input.jobId}`, "layout");
    return { decision: input.decision };
  },
);

export const recordDeviationAction = action(
  {
    schema: z.object({
      jobId: zUuid(),
      subject: z.string().min(1).max(200),
      justification: z.string().max(4000),
    }),
    refusal: deviationRecorderRefusal,
  },
  async (input, actor) => {
    const row = await recordDeviation(actor, input);
    revalidatePath(`/jobs/${input.jobId}`, "layout");
    return { id: row.id };
  },
);
