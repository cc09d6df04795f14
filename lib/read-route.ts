/**
 * `GET …/{id}` of one thing read through its db/queries function (whose access rule applies): who
 * is asking (401 when nobody), the thing, 404 when there is none or it is another tenant's, then
 * the answer. The route files that read one thing by its id are one call of `readRoute`.
 */
import "server-only";
import { signedInRoute } from "@/lib/auth/route";
import type { Actor } from "@/lib/domain/roles";
import { notFound } from "@/lib/errors";

export function readRoute<T>(
  what: string,
  read: (actor: Actor, id: string) => Promise<T | null | undefined>,
  answer: (found: T, at: { req: Request; actor: Actor; id: string }) => Response | Promise<Response>,
) {
  return signedInRoute<{ id: string }>(async (req, actor, { id }) => {
    const found = await read(actor, id);
    if (!found) throw notFound(what);
    return answer(found, { req, actor, id });
  });
}

/**
 * Stored bytes as a response that is never cached and never sniffed: the type, how to show it
 * (`inline` or `attachment` with a file name), and the SHA-256 it was stored with when known.
 */
export function bytesResponse(
  bytes: Uint8Array,
  o: { type: string; disposition: string; sha256?: string },
): Response {
  return new Response(new Uint8Array(bytes), {
    headers: {
      "Content-Type": o.type,
      "Content-Length": String(bytes.length),
      "Content-Disposition": o.disposition,
      "X-Content-Type-Options": "nosniff",
      ...(o.sha256 ? { "X-Checksum-SHA256": o.sha256 } : {}),
      "Cache-Control": "private, no-store",
    },
  });
}
