import { getPhotoBytes } from "@/db/queries/photos";
import { requireUser } from "@/lib/auth/session";
import { notFound } from "@/lib/errors";
import { route } from "@/lib/http";
import { photoResponse } from "@/lib/photo-response";

type Ctx = { params: Promise<{ id: string }> };

/**
 * GET for one size of a stored photo, for anyone who may see its job's photos: getPhotoBytes
 * checks the actor (not found outside their jobs, refused by the photo policy). The full image
 * carries its SHA-256; the thumbnail, made from it, does not.
 */
export function photoRoute(size: "image" | "thumb") {
  return route<Ctx>(async (_req, ctx) => {
    const { id } = await ctx.params;
    const actor = await requireUser();
    const found = await getPhotoBytes(actor, id, size);
    if (!found) throw notFound("photo");
    return photoResponse(found.data, size === "image" ? found.photo.sha256 : null);
  });
}
