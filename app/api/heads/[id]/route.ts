// Correct one row of the heads register (administrator); audited.
import { updateHead } from "@/db/queries/registers-admin";
import { registerItem } from "@/lib/register-routes";
import { headPatchSchema } from "@/lib/validations/registers";

export const runtime = "nodejs";
export const PATCH = registerItem({
  register: "heads",
  singular: "head",
  schema: headPatchSchema,
  update: updateHead,
}).PATCH;
