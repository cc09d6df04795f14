// The heads register for the office: list (staff who read it), add (administrator).
import { listHeads } from "@/db/queries/registers";
import { createHead } from "@/db/queries/registers-admin";
import { registerCollection } from "@/lib/register-routes";
import { headCreateSchema } from "@/lib/validations/registers";

export const runtime = "nodejs";
const handlers = registerCollection({
  register: "heads",
  plural: "heads",
  singular: "head",
  list: listHeads,
  schema: headCreateSchema,
  create: createHead,
});
export const GET = handlers.GET;
export const POST = handlers.POST;
