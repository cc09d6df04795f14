import { controlValuesJson, getControlValues, recordControlValues } from "@/db/queries/control-values";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { readJson, route } from "@/lib/http";
import { controlValuesRecordSchema } from "@/lib/validations/control-values";

type Ctx = { params: Promise<{ id: string }> };

/** The control's values as found, to enter (from the approved fit) and as left, with flags. Staff only. */
export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const c = await getControlValues(actor, id);
  if (!c) throw notFound("job");
  return Response.json(controlValuesJson(c));
});

/** Records one stage (`as_found` or `as_left`) in the control's units; answers the loop as GET does. */
export const PUT = route<Ctx>(async (req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const body = controlValuesRecordSchema.parse(await readJson(req));
  await recordControlValues(actor, id, body);
  const c = await getControlValues(actor, id);
  return Response.json(controlValuesJson(c!));
});
