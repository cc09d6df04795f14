"use server";

import { revalidatePath } from "next/cache";
import { updateIssuer } from "@/db/queries/issuer";
import { action } from "@/lib/actions";
import { issuerSettingsRefusal } from "@/lib/policy/issuer";
import { issuerSettingsSchema } from "@/lib/validations/issuer";

/** Saves the issuer's details printed on every report (administrator). */
export const updateIssuerSettingsAction = action(
  { schema: issuerSettingsSchema, refusal: issuerSettingsRefusal },
  async (input, actor) => {
    const saved = await updateIssuer(actor, input);
    revalidatePath("/registers/settings");
    return saved;
  },
);
