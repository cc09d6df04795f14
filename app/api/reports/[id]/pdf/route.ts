import { getReportPdf } from "@/db/queries/reports";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";

export const runtime = "nodejs";
type Ctx = { params: Promise<{ id: string }> };

/** The stored PDF, byte for byte as issued and signed (never re-rendered). */
export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const r = await getReportPdf(actor, id);
  if (!r) throw notFound("report");
  return new Response(new Uint8Array(r.pdf), {
    headers: {
      "Content-Type": "application/pdf",
      "Content-Disposition": `attachment; filename="${r.reference}-rev${r.revision}.pdf"`,
      "Content-Length": String(r.pdf.length),
      "X-Content-Type-Options": "nosniff",
      "Cache-Control": "private, no-store",
    },
  });
});
