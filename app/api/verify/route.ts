import { verifyPdfFile } from "@/db/queries/verification";
import { invalid, tooLarge } from "@/lib/errors";
import { readBodyCapped, route } from "@/lib/http";
import { readMultipart } from "@/lib/storage/multipart";

export const runtime = "nodejs";
const MAX_PDF_BYTES = 20 * 1024 * 1024;
/** Room for the multipart boundaries and headers around the PDF. */
const MULTIPART_OVERHEAD_BYTES = 64 * 1024;
const TOO_LARGE = "A report PDF is at most 20 MB.";

/**
 * Public: upload a PDF (multipart field `file`, or the raw bytes) and learn whether it is an
 * issued report, unaltered. The body is read within the limit whether its length was declared or
 * it arrives chunked (413 past it); a malformed multipart body is a 422, never a 500.
 */
export const POST = route(async (req) => {
  let bytes: Uint8Array;
  if (/^multipart\//i.test(req.headers.get("content-type") ?? "")) {
    const { file } = await readMultipart(req, MAX_PDF_BYTES + MULTIPART_OVERHEAD_BYTES);
    if (!file)
      throw invalid("Attach the PDF as the field 'file'.", [{ field: "file", message: "Required." }]);
    bytes = file.data;
  } else {
    bytes = await readBodyCapped(req, MAX_PDF_BYTES, TOO_LARGE);
  }
  if (bytes.length === 0) throw invalid("The file is empty.", [{ field: "file", message: "Empty." }]);
  if (bytes.length > MAX_PDF_BYTES) throw tooLarge(TOO_LARGE);
  return Response.json(await verifyPdfFile(bytes));
});
