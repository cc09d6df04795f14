"use server";
// The procedure builder's actions: create, save a version, retire or bring back. The same
// db/queries functions (and so the same policies and audit events) as the JSON API.
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { createProcedure, saveProcedureVersion, setProcedureRetired } from "@/db/queries/procedures";
import { action } from "@/lib/actions";
import { zUuid } from "@/lib/domain/uuid";
import { procedureEditRefusal, procedureRetireRefusal } from "@/lib/policy/procedures";
import { procedureSchema, procedureVersionSchema } from "@/lib/validations/procedures";

export const createProcedureAction = action(
  { schema: procedureSchema, refusal: (a) => procedureEditRefusal(a, null) },
  async (input, actor) => {
    const t = await createProcedure(actor, input);
    revalidatePath("/registers/procedures");
    return { id: t.id, version: t.version };
  },
);

export const saveProcedureVersionAction = action(
  {
    // The procedure's fields at the top level, so an error names `steps.3.upper` as the API does.
    schema: procedureVersionSchema.extend({ id: zUuid("Choose a procedure.") }),
    refusal: (a) => procedureEditRefusal(a, null),
  },
  async ({ id, ...procedure }, actor) => {
    const t = await saveProcedureVersion(actor, id, procedure);
    revalidatePath("/registers/procedures");
    return { id: t.id, version: t.version, replaced: t.replaced };
  },
);

export const setProcedureRetiredAction = action(
  {
    schema: z.object({
      id: zUuid("Choose a procedure."),
      retired: z.preprocess((v) => (v === "true" ? true : v === "false" ? false : v), z.boolean()),
    }),
    refusal: procedureRetireRefusal,
  },
  async ({ id, retired }, actor) => {
    const t = await setProcedureRetired(actor, id, retired);
    revalidatePath("/registers/procedures");
    return { id: t.id, retired: Boolean(t.retiredAt) };
  },
);
