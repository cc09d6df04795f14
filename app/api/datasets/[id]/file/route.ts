// The original file of a dataset, byte for byte as uploaded, for anyone who may see its job.
import { getDatasetOriginal } from "@/db/queries/datasets";
import { bytesResponse, readRoute } from "@/lib/read-route";

export const runtime = "nodejs";
/** RFC 6266: an ASCII fallback name plus the UTF-8 name, neither able to break the header. */
function contentDisposition(name: string): string {
  const ascii = name.replace(/[^\x20-\x7e]/g, "_").replace(/["\\;]/g, "_") || "dataset.csv";
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}

export const GET = readRoute("dataset", getDatasetOriginal, ({ detail, data }) =>
  bytesResponse(data, {
    type: "text/csv; charset=utf-8",
    disposition: contentDisposition(detail.dataset.originalFilename),
    sha256: detail.dataset.sha256,
  }),
);
