import { getPhotoBytes } from "@/db/queries/photos";
import { readRoute } from "@/lib/read-route";
import { photoResponse } from "@/lib/photo-response";

/**
 * GET for one size of a stored photo, for anyone who may see its job's photos: getPhotoBytes
 * checks the actor (not found outside their jobs, refused by the photo policy). The full image
 * carries its SHA-256; the thumbnail, made from it, does not.
 */
export function photoRoute(size: "image" | "thumb") {
  return readRoute(
    "photo",
    (actor, id) => getPhotoBytes(actor, id, size),
    (found) => photoResponse(found.data, size === "image" ? found.photo.sha256 : null),
  );
}
