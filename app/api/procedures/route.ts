// Procedures with their versions, steps and head-parameter limits (the service company's staff).
import { listTemplatesWithSteps } from "@/db/queries/templates";
import { requireUser } from "@/lib/auth/session";
import { route } from "@/lib/http";

export const runtime = "nodejs";

export const GET = route(async () => {
  const actor = await requireUser();
  return Response.json({ procedures: await listTemplatesWithSteps(actor) });
});
