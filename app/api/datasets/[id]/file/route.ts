// The original file of a dataset, byte for byte as uploaded, for anyone who may see its job.
import { getDatasetOriginal } from "@/db/queries/datasets";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";

export const runtime = "nodejs";
type Ctx = { params: Promise<{ id: string }> };

/** RFC 6266: an ASCII fallback name plus the UTF-8 name, neither able to break the header. */
function contentDisposition(name: string): string {
  const ascii = name.replace(/[^\x20-\x7e]/g, "_").replace(/["\\;]/g, "_") || "dataset.csv";
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}

export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const found = await getDatasetOriginal(actor, id);
  if (!found) throw notFound("dataset");
  const { detail, data } = found;
  return new Response(new Uint8Array(data), {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Length": String(data.length),
      "Content-Disposition": contentDisposition(detail.dataset.originalFilename),
      "X-Content-Type-Options": "nosniff",
      "X-Checksum-SHA256": detail.dataset.sha256,
      "Cache-Control": "private, no-store",
    },
  });
});
