// One procedure version with its steps and head-parameter limits; 404 when there is none.
import { getTemplate } from "@/db/queries/templates";
import { readRoute } from "@/lib/read-route";

export const runtime = "nodejs";
export const GET = readRoute("procedure", getTemplate, (procedure) => Response.json({ procedure }));
