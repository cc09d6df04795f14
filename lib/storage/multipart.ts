/**
 * Streams a multipart/form-data request body through busboy with a hard size limit, so an upload
 * is never read past the limit: a Content-Length over it is refused before a byte is read, and a
 * chunked body is cancelled as soon as the running count passes it. The one file part is kept in
 * memory (the server must re-parse it anyway) with its SHA-256 computed on the way in.
 */
import "server-only";
import { createHash } from "node:crypto";
import busboy from "busboy";
import { invalid, tooLarge } from "@/lib/errors";

export interface UploadedFile {
  readonly filename: string;
  readonly contentType: string;
  readonly data: Buffer;
  readonly sha256: string;
}

export interface MultipartUpload {
  readonly fields: Readonly<Record<string, string>>;
  readonly file: UploadedFile | null;
}

const MAX_FIELDS = 20;
const MAX_FIELD_BYTES = 16 * 1024;

function limitMessage(maxBytes: number): string {
  return `The upload is larger than the limit of ${(maxBytes / (1024 * 1024)).toFixed(0)} MiB.`;
}

/** Reads `req` (multipart/form-data, one part named `fileField`) within `maxBytes`; throws 413 or 422. */
export async function readMultipart(
  req: Request,
  maxBytes: number,
  fileField = "file",
): Promise<MultipartUpload> {
  const contentType = req.headers.get("content-type") ?? "";
  if (!/^multipart\/form-data\s*;/i.test(contentType)) {
    throw invalid("Send the upload as multipart/form-data.", [
      { field: "content-type", message: "expected multipart/form-data with a boundary" },
    ]);
  }
  const declared = req.headers.get("content-length");
  if (declared !== null && Number(declared) > maxBytes) {
    // Refused without reading the body.
    void req.body?.cancel().catch(() => undefined);
    throw tooLarge(limitMessage(maxBytes));
  }
  if (!req.body)
    throw invalid("The upload has no body.", [{ field: fileField, message: "no file was sent" }]);

  let bb: busboy.Busboy;
  try {
    bb = busboy({
      headers: { "content-type": contentType },
      limits: { files: 1, fields: MAX_FIELDS, fieldSize: MAX_FIELD_BYTES, parts: MAX_FIELDS + 1 },
      defParamCharset: "utf8",
    });
  } catch {
    throw invalid("The multipart body has no boundary.", [
      { field: "content-type", message: "missing boundary" },
    ]);
  }

  const fields: Record<string, string> = {};
  let file: UploadedFile | null = null;
  let problem: Error | null = null;
  const fail = (e: Error) => {
    problem ??= e;
  };

  const done = new Promise<void>((resolve) => {
    bb.on("field", (name, value, info) => {
      if (info.valueTruncated)
        fail(
          invalid(`The field '${name}' is too long.`, [
            { field: name, message: `longer than ${MAX_FIELD_BYTES} bytes` },
          ]),
        );
      else fields[name] = value;
    });
    bb.on("file", (name, stream, info) => {
      if (name !== fileField || file) {
        stream.on("error", () => undefined);
        stream.resume();
        return;
      }
      // A body cut off at the limit ends the part early; that is already reported as a 413.
      stream.on("error", () => undefined);
      const hash = createHash("sha256");
      // One buffer sized from the declared length (grown by doubling otherwise), so a large file
      // is held once rather than as chunks plus their concatenation.
      let buf = Buffer.allocUnsafe(Math.max(64 * 1024, Math.min(maxBytes, Number(declared ?? 0) || 0)));
      let used = 0;
      stream.on("data", (c: Buffer) => {
        hash.update(c);
        if (used + c.length > buf.length) {
          const grown = Buffer.allocUnsafe(
            Math.min(Math.max(buf.length * 2, used + c.length), maxBytes + c.length),
          );
          buf.copy(grown, 0, 0, used);
          buf = grown;
        }
        c.copy(buf, used);
        used += c.length;
      });
      stream.on("end", () => {
        file = {
          filename: info.filename ?? "upload.csv",
          contentType: info.mimeType || "text/csv",
          data: buf.subarray(0, used),
          sha256: hash.digest("hex"),
        };
      });
    });
    bb.on("filesLimit", () =>
      fail(invalid("Send one file per upload.", [{ field: fileField, message: "more than one file" }])),
    );
    bb.on("fieldsLimit", () =>
      fail(invalid("Too many form fields.", [{ field: "form", message: `more than ${MAX_FIELDS} fields` }])),
    );
    bb.on("partsLimit", () =>
      fail(invalid("Too many form parts.", [{ field: "form", message: "too many parts" }])),
    );
    bb.on("error", (e: unknown) => {
      fail(
        invalid("The multipart body is malformed.", [
          { field: "form", message: e instanceof Error ? e.message : "malformed multipart body" },
        ]),
      );
      resolve();
    });
    bb.on("close", () => resolve());
  });

  const reader = req.body.getReader();
  let total = 0;
  try {
    for (;;) {
      const { done: end, value } = await reader.read();
      if (end) break;
      total += value.byteLength;
      if (total > maxBytes) {
        await reader.cancel().catch(() => undefined);
        bb.destroy();
        throw tooLarge(limitMessage(maxBytes));
      }
      if (!bb.write(value)) await new Promise<void>((r) => bb.once("drain", () => r()));
      if (problem) break;
    }
  } finally {
    reader.releaseLock();
  }
  if (!problem) bb.end();
  else bb.destroy();
  await Promise.race([done, new Promise<void>((r) => setTimeout(r, problem ? 0 : 30_000))]);
  if (problem) throw problem;
  return { fields, file };
}
