/**
 * The route-handler wrapper: every API handler reads as steps and throws; this maps what it
 * throws to the JSON error shape of the API, `{ error: { code, message, issues? } }`. A database
 * that is down or restarting answers 503 `unavailable`; anything unexpected 500, never a stack.
 */
import "server-only";
import { ZodError } from "zod";
import { AppError, isDatabaseUnavailable, unavailable } from "./errors";

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
