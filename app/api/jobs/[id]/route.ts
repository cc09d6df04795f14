import { getJobDetail, jobDetailJson } from "@/db/queries/jobs";
import { moveJob, updateJobRecord } from "@/db/queries/job-office";
import { signedInRoute } from "@/lib/auth/route";
import { notFound } from "@/lib/errors";
import { readJson } from "@/lib/http";
import { readRoute } from "@/lib/read-route";
import { jobMoveSchema, jobRecordSchema } from "@/lib/validations/jobs";

// Another tenant's job is "not found", exactly like a missing one.
export const GET = readRoute("job", getJobDetail, (detail) => Response.json({ job: jobDetailJson(detail) }));

/**
 * The office's changes to a job: a body with `action` ("hold" | "release" | "cancel", with a
 * `reason`) moves it; any other body edits record fields and/or the installer. → 200 `{ job }`.
 */
export const PATCH = signedInRoute<{ id: string }>(async (req, actor, { id }) => {
  const body = await readJson(req);
  if (body && typeof body === "object" && "action" in body)
    await moveJob(actor, id, jobMoveSchema.parse(body));
  else await updateJobRecord(actor, id, jobRecordSchema.parse(body));
  const detail = await getJobDetail(actor, id);
  if (!detail) throw notFound("job");
  return Response.json({ job: jobDetailJson(detail) });
});
