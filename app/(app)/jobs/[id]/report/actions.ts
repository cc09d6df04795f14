"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { issueReport, respondToReport, signJobWork } from "@/db/queries/reports";
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
    roles: ["engineer"],
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
    roles: ["customer"],
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
