// Correct one row of the sites register (administrator); audited.
import { updateSite } from "@/db/queries/registers-admin";
import { registerItem } from "@/lib/register-routes";
import { sitePatchSchema } from "@/lib/validations/registers";

export const runtime = "nodejs";
export const PATCH = registerItem({
  register: "customers",
  singular: "site",
  schema: sitePatchSchema,
  update: updateSite,
}).PATCH;
