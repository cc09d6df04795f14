import { getReportMeta } from "@/db/queries/reports";
import { listJobSignatures } from "@/db/queries/signatures";
import { readRoute } from "@/lib/read-route";

/** Report metadata and its signatures, for users who may see the job. */
export const GET = readRoute("report", getReportMeta, async (meta, { actor, id }) => {
  const sigs = (await listJobSignatures(actor, meta.jobId)) ?? [];
  return Response.json({
    report: { ...meta, issuedAt: meta.issuedAt.toISOString() },
    signatures: sigs
      .filter((s) => s.reportId === null || s.reportId === id)
      .map((s) => ({ ...s, signedAt: s.signedAt.toISOString() })),
  });
});
