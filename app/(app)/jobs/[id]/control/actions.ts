"use server";

import { revalidatePath } from "next/cache";
import { recordBudgetInputs } from "@/db/queries/budget";
import { recordControlValues } from "@/db/queries/control-values";
import { action } from "@/lib/actions";
import { budgetRecorderRefusal, controlValuesRecorderRefusal } from "@/lib/policy/control-values";
import { budgetInputsFormSchema, controlValuesFormSchema } from "@/lib/validations/control-values";

export const recordControlValuesAction = action(
  { schema: controlValuesFormSchema, refusal: controlValuesRecorderRefusal },
  async ({ jobId, record }, actor) => {
    const row = await recordControlValues(actor, jobId, record);
    revalidatePath(`/jobs/${jobId}/control`);
    return { id: row.id, stage: row.stage };
  },
);

export const recordBudgetInputsAction = action(
  { schema: budgetInputsFormSchema, refusal: budgetRecorderRefusal },
  async ({ jobId, ...input }, actor) => {
    const row = await recordBudgetInputs(actor, input);
    revalidatePath(`/jobs/${jobId}/analysis`);
    return { id: row.id };
  },
);
