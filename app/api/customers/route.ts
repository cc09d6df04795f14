// The customers register for the office: list (staff who read it), add (administrator).
import { listCustomersWithSites } from "@/db/queries/registers";
import { createCustomer } from "@/db/queries/registers-admin";
import { registerCollection } from "@/lib/register-routes";
import { customerCreateSchema } from "@/lib/validations/registers";

export const runtime = "nodejs";
const handlers = registerCollection({
  register: "customers",
  plural: "customers",
  singular: "customer",
  list: listCustomersWithSites,
  schema: customerCreateSchema,
  create: createCustomer,
});
export const GET = handlers.GET;
export const POST = handlers.POST;
