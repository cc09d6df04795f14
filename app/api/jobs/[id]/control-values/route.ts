import { controlValuesJson, getControlValues, recordControlValues } from "@/db/queries/control-values";
import { signedInRoute } from "@/lib/auth/route";
import { readJson } from "@/lib/http";
import { readRoute } from "@/lib/read-route";
import { controlValuesRecordSchema } from "@/lib/validations/control-values";

/** The control's values as found, to enter (from the approved fit) and as left, with flags. Staff only. */
export const GET = readRoute("job", getControlValues, (c) => Response.json(controlValuesJson(c)));

/** Records one stage (`as_found` or `as_left`) in the control's units; answers the loop as GET does. */
export const PUT = signedInRoute<{ id: string }>(async (req, actor, { id }) => {
  const body = controlValuesRecordSchema.parse(await readJson(req));
  await recordControlValues(actor, id, body);
  const c = await getControlValues(actor, id);
  return Response.json(controlValuesJson(c!));
});
