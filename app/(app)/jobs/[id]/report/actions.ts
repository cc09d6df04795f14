"use server";

import { deviationRecorderRefusal, reportIssuerRefusal, reportResponderRefusal } from "@/lib/policy/reports";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { issueReport, respondToReport } from "@/db/queries/reports";
import { recordDeviation } from "@/db/queries/readiness";
import { signJobWork } from "@/db/queries/signatures";
import { recordJobInstrument } from "@/db/queries/job-instruments";
import { action } from "@/lib/actions";
import { DATA_INSTRUMENT_USES } from "@/lib/domain/instruments";
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

/** Records an instrument used for the job's measurement data (probe, reference sphere, CMM); checks in recordJobInstrument. */
export const recordJobInstrumentAction = action(
  {
    schema: z.object({
      jobId: zUuid(),
      instrumentId: zUuid("Choose an instrument from the register."),
      use: z.enum(DATA_INSTRUMENT_USES, { message: "Say what the instrument was used for." }),
    }),
  },
  async (input, actor) => {
    const row = await recordJobInstrument(actor, input);
    revalidatePath(`/jobs/${input.jobId}/report`);
    return { id: row.id };
  },
);
