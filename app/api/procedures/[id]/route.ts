// One procedure version with its steps, head-parameter and rotary-axis positioning limits; 404
// when there is none.
// PATCH `{ retired: true|false }` retires the procedure (every version) or brings it back.
import { z } from "zod";
import { setProcedureRetired } from "@/db/queries/procedures";
import { getTemplate } from "@/db/queries/templates";
import { signedInRoute } from "@/lib/auth/route";
import { forbidden } from "@/lib/errors";
import { readJson } from "@/lib/http";
import { procedureRetireRefusal } from "@/lib/policy/procedures";
import { readRoute } from "@/lib/read-route";

export const runtime = "nodejs";
export const GET = readRoute("procedure", getTemplate, (procedure) => Response.json({ procedure }));

const patchSchema = z.object({ retired: z.boolean() });

export const PATCH = signedInRoute<{ id: string }>(async (req, actor, { id }) => {
  const refusal = procedureRetireRefusal(actor);
  if (refusal) throw forbidden(refusal);
  const procedure = await setProcedureRetired(actor, id, patchSchema.parse(await readJson(req)).retired);
  return Response.json({ procedure });
});
