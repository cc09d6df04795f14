import { getReadiness } from "@/db/queries/readiness";
import { forbidden } from "@/lib/errors";
import { readinessRefusal } from "@/lib/policy/reports";
import { readRoute } from "@/lib/read-route";

/** What still stands between the job and an issued report: `{ ready, blockers: [{ code, message, href }] }`. */
export const GET = readRoute("job", getReadiness, (r, { actor }) => {
  const refusal = readinessRefusal(actor);
  if (refusal) throw forbidden(refusal);
  return Response.json(r);
});
