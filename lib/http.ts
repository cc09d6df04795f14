/**
 * The route-handler wrapper: every API handler reads as steps and throws; this maps what it
 * throws to the JSON error shape of the API, `{ error: { code, message, issues? } }`.
 */
import "server-only";
import { ZodError } from "zod";
import { AppError } from "./errors";

type Handler<C> = (req: Request, ctx: C) => Promise<Response>;

export function route<C = unknown>(fn: Handler<C>): Handler<C> {
  return async (req, ctx) => {
    try {
      const res = await fn(req, ctx);
      // Authenticated answers must not be kept by shared caches.
      if (!res.headers.has("Cache-Control")) res.headers.set("Cache-Control", "no-store");
      // Also set here for routes the proxy does not see (the streaming upload).
      if (!res.headers.has("X-Content-Type-Options")) res.headers.set("X-Content-Type-Options", "nosniff");
      return res;
    } catch (err) {
      return errorResponse(err);
    }
  };
}

export function errorResponse(err: unknown): Response {
  if (err instanceof AppError) {
    const body = { error: { code: err.code, message: err.message, ...(err.issues ? { issues: err.issues } : {}) } };
    return Response.json(body, { status: err.status, headers: { "Cache-Control": "no-store", "X-Content-Type-Options": "nosniff" } });
  }
  if (err instanceof ZodError) {
    const issues = err.issues.map((i) => ({ field: i.path.join("."), message: i.message }));
    return Response.json({ error: { code: "invalid", message: "The request is not valid.", issues } }, { status: 422 });
  }
  console.error("[api] unexpected error", err);
  return Response.json({ error: { code: "internal", message: "Something went wrong on the server." } }, { status: 500 });
}
