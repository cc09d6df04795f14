import { renderDraftReport } from "@/db/queries/reports";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";

export const runtime = "nodejs";
type Ctx = { params: Promise<{ id: string }> };

/**
 * The draft preview of the job's report: rendered now, watermarked DRAFT, unsigned, never stored.
 * Staff only (lib/policy/reports.draftPreviewRefusal, applied in renderDraftReport after the job's
 * visibility: a job one may not see is 404, a customer's own job 403).
 */
export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const r = await renderDraftReport(actor, id);
  if (!r) throw notFound("job");
  return new Response(new Uint8Array(r.pdf), {
    headers: {
      "Content-Type": "application/pdf",
      "Content-Disposition": `inline; filename="${r.reference}-DRAFT.pdf"`,
      "Content-Length": String(r.pdf.length),
      "X-Content-Type-Options": "nosniff",
      "Cache-Control": "private, no-store",
    },
  });
});
