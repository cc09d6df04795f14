// A head's fitted parameters across its jobs (installation, re-verification, after-crash), oldest
// first: the office and engineers see every job on the head; installers and inspectors every job on
// a head that one of their jobs is on (404 otherwise); a customer only their own company's jobs on
// it (404 when none).
import { getHeadFitHistory, headHistoryJson } from "@/db/queries/heads-admin";
import { readRoute } from "@/lib/read-route";

export const runtime = "nodejs";
export const GET = readRoute("head", getHeadFitHistory, (h) => Response.json(headHistoryJson(h)));
