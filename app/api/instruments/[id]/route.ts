// Correct one row of the instruments register (administrator); audited.
import { updateInstrument } from "@/db/queries/instruments";
import { registerItem } from "@/lib/register-routes";
import { instrumentPatchSchema } from "@/lib/validations/registers";

export const runtime = "nodejs";
export const PATCH = registerItem({
  register: "instruments",
  singular: "instrument",
  schema: instrumentPatchSchema,
  update: updateInstrument,
}).PATCH;
