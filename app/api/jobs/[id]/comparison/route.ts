import { comparisonJson, getComparison } from "@/db/queries/readings";
import { readRoute } from "@/lib/read-route";

/** Pre/post readings side by side with change and status, canonical units (mm, arcsec). */
export const GET = readRoute("job", getComparison, (c) => Response.json(comparisonJson(c)));
