// The PNG of one saved view, byte for byte as stored, for anyone who may see its job (404 otherwise).
import { getViewImage } from "@/db/queries/analysis-views";
import { bytesResponse, readRoute } from "@/lib/read-route";

export const runtime = "nodejs";
export const GET = readRoute("view", getViewImage, ({ view, png }) =>
  bytesResponse(png, {
    type: "image/png",
    disposition: `inline; filename="view-${view.id}.png"`,
    sha256: view.sha256,
  }),
);
