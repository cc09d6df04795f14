// Save a procedure's steps: a version no job uses yet changes in place (200); otherwise the body
// becomes the next version (201) and the jobs keep theirs.
import { saveProcedureVersion } from "@/db/queries/procedures";
import { signedInRoute } from "@/lib/auth/route";
import { forbidden } from "@/lib/errors";
import { readJson } from "@/lib/http";
import { procedureEditRefusal } from "@/lib/policy/procedures";

export const runtime = "nodejs";
export const POST = signedInRoute<{ id: string }>(async (req, actor, { id }) => {
  const refusal = procedureEditRefusal(actor, null);
  if (refusal) throw forbidden(refusal);
  const { replaced, ...procedure } = await saveProcedureVersion(actor, id, await readJson(req));
  return Response.json({ procedure, replaced }, { status: replaced ? 200 : 201 });
});
