// The sites register for the office: list (staff who read it), add (administrator).
import { listSites } from "@/db/queries/registers";
import { createSite } from "@/db/queries/registers-admin";
import { registerCollection } from "@/lib/register-routes";
import { siteCreateSchema } from "@/lib/validations/registers";

export const runtime = "nodejs";
const handlers = registerCollection({
  register: "customers",
  plural: "sites",
  singular: "site",
  list: listSites,
  schema: siteCreateSchema,
  create: createSite,
});
export const GET = handlers.GET;
export const POST = handlers.POST;
