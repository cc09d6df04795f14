// The PNG of one saved view, byte for byte as stored, for anyone who may see its job (404 otherwise).
import { getViewImage } from "@/db/queries/analysis-views";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";

export const runtime = "nodejs";
type Ctx = { params: Promise<{ id: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const found = await getViewImage(actor, id);
  if (!found) throw notFound("view");
  const { view, png } = found;
  return new Response(new Uint8Array(png), {
    headers: {
      "Content-Type": "image/png",
      "Content-Length": String(png.length),
      "Content-Disposition": `inline; filename="view-${view.id}.png"`,
      "X-Content-Type-Options": "nosniff",
      "X-Checksum-SHA256": view.sha256,
      "Cache-Control": "private, no-store",
    },
  });
});
