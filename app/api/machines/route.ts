// The machines register for the office: list (staff who read it), add (administrator).
import { listMachines } from "@/db/queries/registers";
import { createMachine } from "@/db/queries/registers-admin";
import { registerCollection } from "@/lib/register-routes";
import { machineCreateSchema } from "@/lib/validations/registers";

export const runtime = "nodejs";
const handlers = registerCollection({
  register: "machines",
  plural: "machines",
  singular: "machine",
  list: listMachines,
  schema: machineCreateSchema,
  create: createMachine,
});
export const GET = handlers.GET;
export const POST = handlers.POST;
