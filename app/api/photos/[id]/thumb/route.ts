// A photo's thumbnail (JPEG, at most 320 px), for anyone who may see its job's photos.
import { photoRoute } from "../../photo-route";

export const runtime = "nodejs";

export const GET = photoRoute("thumb");
