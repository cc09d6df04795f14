// Correct one row of the customers register (administrator); audited.
import { updateCustomer } from "@/db/queries/registers-admin";
import { registerItem } from "@/lib/register-routes";
import { customerPatchSchema } from "@/lib/validations/registers";

export const runtime = "nodejs";
export const PATCH = registerItem({
  register: "customers",
  singular: "customer",
  schema: customerPatchSchema,
  update: updateCustomer,
}).PATCH;
