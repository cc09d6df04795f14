import { verifyPdfFile } from "@/db/queries/verification";
import { invalid, tooLarge } from "@/lib/errors";
import { route } from "@/lib/http";

export const runtime = "nodejs";
const MAX_PDF_BYTES = 20 * 1024 * 1024;

/** Public: upload a PDF (multipart field `file`, or the raw bytes) and learn whether it is an issued report, unaltered. */
export const POST = route(async (req) => {
  const declared = Number(req.headers.get("content-length") ?? 0);
  if (declared > MAX_PDF_BYTES) throw tooLarge("A report PDF is at most 20 MB.");
  let bytes: Uint8Array;
  if ((req.headers.get("content-type") ?? "").startsWith("multipart/form-data")) {
    const file = (await req.formData()).get("file");
    if (!(file instanceof File))
      throw invalid("Attach the PDF as the field 'file'.", [{ field: "file", message: "Required." }]);
    bytes = new Uint8Array(await file.arrayBuffer());
  } else {
    bytes = new Uint8Array(await req.arrayBuffer());
  }
  if (bytes.length === 0) throw invalid("The file is empty.", [{ field: "file", message: "Empty." }]);
  if (bytes.length > MAX_PDF_BYTES) throw tooLarge("A report PDF is at most 20 MB.");
  return Response.json(await verifyPdfFile(bytes));
});
