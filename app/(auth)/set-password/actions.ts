"use server";

import { setPasswordWithToken } from "@/db/queries/users-admin";
import type { ActionResult } from "@/lib/actions";
import { AppError } from "@/lib/errors";
import { setPasswordSchema } from "@/lib/validations/registers";

/** Anonymous by design: the one-time token is the credential. */
export async function setPasswordAction(raw: unknown): Promise<ActionResult<{ email: string }>> {
  const input = raw instanceof FormData ? Object.fromEntries(raw.entries()) : raw;
  const parsed = setPasswordSchema.safeParse(input);
  if (!parsed.success) {
    const fieldErrors: Record<string, string[]> = {};
    for (const i of parsed.error.issues) (fieldErrors[i.path.join(".") || "_"] ??= []).push(i.message);
    return { ok: false, message: "Some fields need attention.", code: "invalid", fieldErrors };
  }
  try {
    return { ok: true, data: await setPasswordWithToken(parsed.data.token, parsed.data.password) };
  } catch (err) {
    if (err instanceof AppError) return { ok: false, message: err.message, code: err.code };
    console.error("[set-password] unexpected error", err);
    return {
      ok: false,
      message: "Something went wrong on the server; nothing was saved.",
      code: "server_error",
    };
  }
}
