// The air and machine temperature at the machine. GET lists a job's records (anyone who sees the
// job); POST records one (those who record readings, while readings are open). 201 with the
// record; 200 with the stored one when its clientId was already sent.
import { listEnvironment, recordEnvironment } from "@/db/queries/environment";
import { signedInRoute } from "@/lib/auth/route";
import { readJson } from "@/lib/http";
import { readRoute } from "@/lib/read-route";
import { environmentCreateSchema } from "@/lib/validations/environment";

export const GET = readRoute("job", listEnvironment, (records) => Response.json({ records }));

export const POST = signedInRoute<{ id: string }>(async (req, actor, { id }) => {
  const input = environmentCreateSchema.parse(await readJson(req));
  const { record, replay } = await recordEnvironment(actor, id, input);
  return Response.json({ record }, { status: replay ? 200 : 201 });
});
