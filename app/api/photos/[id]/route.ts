// A photo's stored image (re-encoded JPEG), for anyone who may see its job's photos.
import { photoRoute } from "../photo-route";

export const runtime = "nodejs";

export const GET = photoRoute("image");
