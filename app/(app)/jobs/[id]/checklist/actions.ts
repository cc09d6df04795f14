"use server";

import { revalidatePath } from "next/cache";
import { eq } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db";
import { changeJobStatus } from "@/db/queries/job-status";
import { recordReading } from "@/db/queries/readings";
import { users } from "@/db/schema";
import { action } from "@/lib/actions";
import { JOB_STATUSES } from "@/lib/domain/jobs";
import { readingCreateSchema } from "@/lib/validations/readings";
import { zUuid } from "@/lib/domain/uuid";

export const recordReadingAction = action(
  { schema: readingCreateSchema.extend({ jobId: zUuid() }) },
  async ({ jobId, ...input }, actor) => {
    const reading = await recordReading(actor, jobId, input);
    revalidatePath(`/jobs/${jobId}`, "layout");
    return { id: reading.id, decision: reading.decision };
  },
);

export const changeStatusAction = action(
  { schema: z.object({ jobId: zUuid(), to: z.enum(JOB_STATUSES) }) },
  async ({ jobId, to }, actor) => {
    const r = await changeJobStatus(actor, jobId, to);
    revalidatePath(`/jobs/${jobId}`, "layout");
    return r;
  },
);

/** The signed-in user's own display units (inch or metric); stored values do not change. */
export const setUnitSystemAction = action(
  { schema: z.object({ unitSystem: z.enum(["metric", "inch"]), path: z.string().startsWith("/jobs/") }) },
  async ({ unitSystem, path }, actor) => {
    await db.update(users).set({ unitSystem }).where(eq(users.id, actor.id));
    revalidatePath(path);
    return { unitSystem };
  },
);
