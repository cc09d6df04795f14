"use server";

import { revalidatePath } from "next/cache";
import { moveJob, openJob, updateJobRecord } from "@/db/queries/job-office";
import { action } from "@/lib/actions";
import { jobCreateRefusal } from "@/lib/policy/jobs";
import { jobMoveFormSchema, jobOpenSchema, jobRecordFormSchema } from "@/lib/validations/jobs";

/** "New job" on the jobs list (administrator or engineer). */
export const openJobAction = action(
  { schema: jobOpenSchema, refusal: jobCreateRefusal },
  async (input, actor) => {
    const job = await openJob(actor, input);
    revalidatePath("/jobs");
    return { id: job.id, reference: job.reference };
  },
);

/** The job page's record and installer forms; the query checks who may (and that the job is visible). */
export const updateJobAction = action({ schema: jobRecordFormSchema }, async ({ jobId, ...input }, actor) => {
  const r = await updateJobRecord(actor, jobId, input);
  revalidatePath(`/jobs/${jobId}`);
  revalidatePath("/jobs");
  return { changed: r.changed };
});

/** Hold, release and cancel on the job page. */
export const moveJobAction = action({ schema: jobMoveFormSchema }, async ({ jobId, ...move }, actor) => {
  const row = await moveJob(actor, jobId, move);
  revalidatePath(`/jobs/${jobId}`);
  revalidatePath("/jobs");
  return { status: row.status };
});
