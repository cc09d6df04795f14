// The air and machine temperature at the machine. GET lists a job's records (anyone who sees the
// job); POST records one (those who record readings, while readings are open). 201 with the
// record; 200 with the stored one when its clientId was already sent.
import { listEnvironment, recordEnvironment } from "@/db/queries/environment";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { readJson, route } from "@/lib/http";
import { environmentCreateSchema } from "@/lib/validations/environment";

type Ctx = { params: Promise<{ id: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const records = await listEnvironment(actor, id);
  if (!records) throw notFound("job");
  return Response.json({ records });
});

export const POST = route<Ctx>(async (req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const input = environmentCreateSchema.parse(await readJson(req));
  const { record, replay } = await recordEnvironment(actor, id, input);
  return Response.json({ record }, { status: replay ? 200 : 201 });
});
