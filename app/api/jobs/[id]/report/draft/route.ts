import { renderDraftReport } from "@/db/queries/reports";
import { bytesResponse, readRoute } from "@/lib/read-route";

export const runtime = "nodejs";
/**
 * The draft preview of the job's report: rendered now, watermarked DRAFT, unsigned, never stored.
 * Staff only (lib/policy/reports.draftPreviewRefusal, applied in renderDraftReport after the job's
 * visibility: a job one may not see is 404, a customer's own job 403).
 */
export const GET = readRoute("job", renderDraftReport, (r) =>
  bytesResponse(r.pdf, {
    type: "application/pdf",
    disposition: `inline; filename="${r.reference}-DRAFT.pdf"`,
  }),
);
