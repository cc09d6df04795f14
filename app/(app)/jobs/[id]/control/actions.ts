"use server";

import { revalidatePath } from "next/cache";
import { recordControlValues } from "@/db/queries/control-values";
import { action } from "@/lib/actions";
import { controlValuesRecorderRefusal } from "@/lib/policy/control-values";
import { controlValuesFormSchema } from "@/lib/validations/control-values";

export const recordControlValuesAction = action(
  { schema: controlValuesFormSchema, refusal: controlValuesRecorderRefusal },
  async ({ jobId, record }, actor) => {
    const row = await recordControlValues(actor, jobId, record);
    revalidatePath(`/jobs/${jobId}/control`);
    return { id: row.id, stage: row.stage };
  },
);
