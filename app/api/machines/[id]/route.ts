// Correct one row of the machines register (administrator); audited.
import { updateMachine } from "@/db/queries/registers-admin";
import { registerItem } from "@/lib/register-routes";
import { machinePatchSchema } from "@/lib/validations/registers";

export const runtime = "nodejs";
export const PATCH = registerItem({
  register: "machines",
  singular: "machine",
  schema: machinePatchSchema,
  update: updateMachine,
}).PATCH;
