import { getReportPdf } from "@/db/queries/reports";
import { bytesResponse, readRoute } from "@/lib/read-route";

export const runtime = "nodejs";
/** The stored PDF, byte for byte as issued and signed (never re-rendered). */
export const GET = readRoute("report", getReportPdf, (r) =>
  bytesResponse(r.pdf, {
    type: "application/pdf",
    disposition: `attachment; filename="${r.reference}-rev${r.revision}.pdf"`,
  }),
);
