/**
 * The server-action wrapper: session first, then zod parsing, then the work. Returns a result
 * the form can show — `{ ok: true, data }` or `{ ok: false, message, fieldErrors }` — and never
 * leaks an unexpected error's detail. Call `redirect()` after it, outside any try/catch.
 */
import "server-only";
import { z } from "zod";
import type { Actor } from "@/lib/domain/roles";
import { requireUser } from "@/lib/auth/session";
import { AppError, forbidden, isDatabaseUnavailable, unavailable } from "./errors";

/** `code` is the AppError code on failure ("unauthorized", "forbidden", "not_found", "invalid", …), so callers and tests can tell a refusal from a correction to make. */
export type ActionResult<T> =
  | { ok: true; data: T }
  | { ok: false; message: string; code: string; fieldErrors?: Record<string, string[]> };

export function action<S extends z.ZodType, T>(
  /** `refusal`: a rule from lib/policy checked on the actor before anything else (403 with its reason). */
  options: { schema: S; refusal?: (actor: Actor) => string | null },
  fn: (input: z.infer<S>, actor: Actor) => Promise<T>,
): (raw: unknown) => Promise<ActionResult<T>> {
  return async (raw) => {
    try {
      const actor = await requireUser();
      const refused = options.refusal?.(actor);
      if (refused) throw forbidden(refused);
      const input = raw instanceof FormData ? Object.fromEntries(raw.entries()) : raw;
      const parsed = options.schema.safeParse(input);
      if (!parsed.success) {
        const fieldErrors: Record<string, string[]> = {};
        for (const issue of parsed.error.issues) {
          const key = issue.path.join(".") || "_";
          (fieldErrors[key] ??= []).push(issue.message);
        }
        return { ok: false, message: "Some fields need attention.", code: "invalid", fieldErrors };
      }
      return { ok: true, data: await fn(parsed.data, actor) };
    } catch (err) {
      if (err instanceof AppError) {
        const fieldErrors = err.issues?.length
          ? Object.fromEntries(err.issues.map((i) => [i.field ?? i.column ?? "_", [i.message]]))
          : undefined;
        return { ok: false, message: err.message, code: err.code, ...(fieldErrors ? { fieldErrors } : {}) };
      }
      if (isDatabaseUnavailable(err)) {
        console.error("[action] database unavailable:", err instanceof Error ? err.message : String(err));
        return { ok: false, message: unavailable().message + " Nothing was saved.", code: "unavailable" };
      }
      console.error("[action] unexpected error", err);
      return {
        ok: false,
        message: "Something went wrong on the server; nothing was saved.",
        code: "server_error",
      };
    }
  };
}
