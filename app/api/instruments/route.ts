// The instruments register for the office: list (staff who read it), add (administrator).
import { createInstrument, listInstruments } from "@/db/queries/instruments";
import { registerCollection } from "@/lib/register-routes";
import { instrumentCreateSchema } from "@/lib/validations/registers";

export const runtime = "nodejs";
const handlers = registerCollection({
  register: "instruments",
  plural: "instruments",
  singular: "instrument",
  list: listInstruments,
  schema: instrumentCreateSchema,
  create: createInstrument,
});
export const GET = handlers.GET;
export const POST = handlers.POST;
