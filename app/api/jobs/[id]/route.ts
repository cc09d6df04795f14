import { getJobDetail, jobDetailJson } from "@/db/queries/jobs";
import { readRoute } from "@/lib/read-route";

// Another tenant's job is "not found", exactly like a missing one.
export const GET = readRoute("job", getJobDetail, (detail) => Response.json({ job: jobDetailJson(detail) }));
