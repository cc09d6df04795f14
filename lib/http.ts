/**
 * The route-handler wrapper: every API handler reads as steps and throws; this maps what it
 * throws to the JSON error shape of the API, `{ error: { code, message, issues? } }`. A database
 * that is down or restarting answers 503 `unavailable`; anything unexpected 500, never a stack.
 *
 * Before the handler runs, the wrapper also enforces the two rules every route shares:
 * - every path parameter named `id` or `…Id` must be a UUID, or the answer is 404 (lib/domain/uuid);
 * - a state-changing request (POST, PUT, PATCH, DELETE) sent by a browser from another origin is
 *   refused with 403 (`crossSiteRefusal`), so a page elsewhere cannot ride the session cookie.
 */
import "server-only";
import { ZodError } from "zod";
import { isUuid } from "@/lib/domain/uuid";
import { env } from "./env";
import {
  AppError,
  forbidden,
  invalid,
  isDatabaseUnavailable,
  notFound,
  tooLarge,
  unavailable,
} from "./errors";
import { securityHeaderEntries } from "./security-headers";

type Handler<C> = (req: Request, ctx: C) => Promise<Response>;

const UNSAFE_METHODS = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/** The app's own origins: the request's Host, and PUBLIC_URL / NEXTAUTH_URL when they are set. */
function ownHosts(req: Request): Set<string> {
  const hosts = new Set<string>();
  const host = req.headers.get("host");
  hosts.add(host ?? new URL(req.url).host);
  for (const u of [env.PUBLIC_URL, env.NEXTAUTH_URL]) if (u) hosts.add(new URL(u).host);
  return hosts;
}

/**
 * Why a state-changing request must be refused as cross-site, or null. Browsers send `Origin` on
 * every POST/PUT/PATCH/DELETE and `Sec-Fetch-Site` on every request; either naming somewhere else
 * (another host, another port, a sandboxed `null` origin) is refused. A request with neither
 * comes from a program, not a browser, and carries no cookie it did not choose to send.
 */
export function crossSiteRefusal(req: Request): string | null {
  if (!UNSAFE_METHODS.has(req.method.toUpperCase())) return null;
  const site = req.headers.get("sec-fetch-site");
  if (site !== null && site !== "same-origin" && site !== "none")
    return "This request came from another site; it is only accepted from Trammel's own pages.";
  const origin = req.headers.get("origin");
  if (origin === null) return null;
  let host: string | null = null;
  try {
    host = origin === "null" ? null : new URL(origin).host;
  } catch {
    host = null;
  }
  if (host === null || !ownHosts(req).has(host))
    return "This request came from another origin; it is only accepted from Trammel's own pages.";
  return null;
}

/** Path parameters that name a record: `id`, `reportId`, `datasetId`, … */
async function checkIdParams(ctx: unknown): Promise<void> {
  const params = (ctx as { params?: Promise<Record<string, unknown>> } | undefined)?.params;
  if (!params) return;
  const values = await params;
  for (const [name, value] of Object.entries(values ?? {}))
    if ((name === "id" || name.endsWith("Id")) && !isUuid(value)) throw notFound();
}

export function route<C = unknown>(fn: Handler<C>): Handler<C> {
  return async (req, ctx) => {
    let res: Response;
    try {
      const refusal = crossSiteRefusal(req);
      if (refusal) throw forbidden(refusal);
      await checkIdParams(ctx);
      res = await fn(req, ctx);
    } catch (err) {
      res = errorResponse(err);
    }
    // Authenticated answers must not be kept by shared caches.
    if (!res.headers.has("Cache-Control")) res.headers.set("Cache-Control", "no-store");
    // Also set here for routes the proxy does not see (the streaming upload): the same headers.
    for (const [name, value] of securityHeaderEntries())
      if (!res.headers.has(name)) res.headers.set(name, value);
    return res;
  };
}

/** Largest JSON body any route takes. */
export const JSON_MAX_BYTES = 256 * 1024;

/**
 * The body of a JSON route: `Content-Type: application/json` is required (415 otherwise), so a
 * form or a text/plain post that a browser may send cross-site without asking first never
 * reaches the handler; the body is read within JSON_MAX_BYTES (413) and must parse (422).
 */
export async function readJson(req: Request, maxBytes = JSON_MAX_BYTES): Promise<unknown> {
  const type = (req.headers.get("content-type") ?? "").split(";")[0]!.trim().toLowerCase();
  if (type !== "application/json")
    throw new AppError(
      415,
      "unsupported_media_type",
      "Send the body as JSON (Content-Type: application/json).",
    );
  const bytes = await readBodyCapped(req, maxBytes);
  try {
    return JSON.parse(new TextDecoder().decode(bytes));
  } catch {
    throw invalid("The body must be JSON.");
  }
}

/**
 * Reads a whole request body, refusing it with 413 once it passes `maxBytes` — whether the size
 * was declared up front (Content-Length) or only found while reading a chunked body.
 */
export async function readBodyCapped(req: Request, maxBytes: number, message?: string): Promise<Uint8Array> {
  const limit = message ?? `The body is larger than the limit of ${maxBytes} bytes.`;
  const declared = req.headers.get("content-length");
  if (declared !== null && Number(declared) > maxBytes) {
    void req.body?.cancel().catch(() => undefined);
    throw tooLarge(limit);
  }
  if (!req.body) return new Uint8Array(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge(limit);
    }
    chunks.push(value);
  }
  const out = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

/** The innermost cause's first line (drizzle's own message quotes the SQL). */
function rootMessage(err: unknown): string {
  let e = err;
  while (e instanceof Error && e.cause instanceof Error) e = e.cause;
  return (e instanceof Error ? e.message : String(e)).split("\n")[0]!.slice(0, 200);
}

export function errorResponse(err: unknown): Response {
  if (!(err instanceof AppError) && isDatabaseUnavailable(err)) {
    // The database is down or restarting: a short generic answer the client may retry, no detail.
    console.error("[api] database or storage unavailable:", rootMessage(err));
    const e = unavailable();
    return Response.json(
      { error: { code: e.code, message: e.message } },
      {
        status: 503,
        headers: { "Cache-Control": "no-store", "X-Content-Type-Options": "nosniff", "Retry-After": "2" },
      },
    );
  }
  if (err instanceof AppError) {
    const body = {
      error: { code: err.code, message: err.message, ...(err.issues ? { issues: err.issues } : {}) },
    };
    return Response.json(body, {
      status: err.status,
      headers: { "Cache-Control": "no-store", "X-Content-Type-Options": "nosniff" },
    });
  }
  if (err instanceof ZodError) {
    const issues = err.issues.map((i) => ({ field: i.path.join("."), message: i.message }));
    return Response.json(
      { error: { code: "invalid", message: "The request is not valid.", issues } },
      { status: 422 },
    );
  }
  console.error("[api] unexpected error", err);
  return Response.json(
    { error: { code: "internal", message: "Something went wrong on the server." } },
    { status: 500 },
  );
}
