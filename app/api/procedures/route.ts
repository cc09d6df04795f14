// Procedures with their versions, steps and head-parameter limits (the service company's staff);
// `?jobKind=&headModel=` keeps those that apply. POST creates a procedure (office and engineers).
import { z } from "zod";
import { createProcedure, listProcedures } from "@/db/queries/procedures";
import { signedInRoute } from "@/lib/auth/route";
import { JOB_KINDS } from "@/lib/domain/jobs";
import { forbidden } from "@/lib/errors";
import { readJson } from "@/lib/http";
import { procedureEditRefusal } from "@/lib/policy/procedures";

export const runtime = "nodejs";

const filterSchema = z.object({
  jobKind: z
    .enum([...JOB_KINDS, "recheck"])
    .transform((k) => (k === "recheck" ? "reverification" : k))
    .optional(),
  headModel: z.string().trim().min(1).max(120).optional(),
});

export const GET = signedInRoute(async (req, actor) => {
  const q = new URL(req.url).searchParams;
  const filter = filterSchema.parse({
    jobKind: q.get("jobKind") || undefined,
    headModel: q.get("headModel") || undefined,
  });
  return Response.json({ procedures: await listProcedures(actor, filter) });
});

export const POST = signedInRoute(async (req, actor) => {
  const refusal = procedureEditRefusal(actor, null);
  if (refusal) throw forbidden(refusal);
  const procedure = await createProcedure(actor, await readJson(req));
  return Response.json({ procedure }, { status: 201 });
});
