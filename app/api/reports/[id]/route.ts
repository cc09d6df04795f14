import { getReportMeta } from "@/db/queries/reports";
import { listJobSignatures } from "@/db/queries/signatures";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";

type Ctx = { params: Promise<{ id: string }> };

/** Report metadata and its signatures, for users who may see the job. */
export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const meta = await getReportMeta(actor, id);
  if (!meta) throw notFound("report");
  const sigs = (await listJobSignatures(actor, meta.jobId)) ?? [];
  return Response.json({
    report: { ...meta, issuedAt: meta.issuedAt.toISOString() },
    signatures: sigs
      .filter((s) => s.reportId === null || s.reportId === id)
      .map((s) => ({ ...s, signedAt: s.signedAt.toISOString() })),
  });
});
