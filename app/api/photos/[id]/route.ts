// A photo's stored image (re-encoded JPEG), for anyone who may see its job's photos.
import { getPhotoBytes } from "@/db/queries/photos";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";
import { photoResponse } from "@/lib/photo-response";

export const runtime = "nodejs";
type Ctx = { params: Promise<{ id: string }> };

export const GET = route<Ctx>(async (_req, ctx) => {
  const { id } = await ctx.params;
  const actor = await requireUser();
  const found = await getPhotoBytes(actor, id, "image");
  if (!found) throw notFound("photo");
  return photoResponse(found.data, found.photo.sha256);
});
