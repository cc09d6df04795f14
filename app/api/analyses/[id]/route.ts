// One analysis: geometry's JSON of the fit (`fit`) with the poses and residuals the page draws.
import { analysisJson, getAnalysis } from "@/db/queries/analyses";
import { readRoute } from "@/lib/read-route";

export const runtime = "nodejs";
export const GET = readRoute("analysis", getAnalysis, (d) => Response.json({ analysis: analysisJson(d) }));
