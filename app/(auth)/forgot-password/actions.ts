"use server";

import { z } from "zod";
import { requestPasswordReset } from "@/db/queries/users-admin";
import type { ActionResult } from "@/lib/actions";

const schema = z.object({
  email: z.string().trim().email("Enter the e-mail address of your account.").max(254),
});

/** The same answer whether or not the address has an account, so the form tells nobody who is registered. */
const RESET_REQUESTED_MESSAGE =
  "If that address belongs to an active account, a link to choose a new password is on its way. It works once, for one hour.";

/** Anonymous by design: asks for a reset link by e-mail. */
export async function requestPasswordResetAction(raw: unknown): Promise<ActionResult<{ message: string }>> {
  const input = raw instanceof FormData ? Object.fromEntries(raw.entries()) : raw;
  const parsed = schema.safeParse(input);
  if (!parsed.success)
    return {
      ok: false,
      message: "Some fields need attention.",
      code: "invalid",
      fieldErrors: { email: parsed.error.issues.map((i) => i.message) },
    };
  try {
    await requestPasswordReset(parsed.data.email);
    return { ok: true, data: { message: RESET_REQUESTED_MESSAGE } };
  } catch (err) {
    console.error("[forgot-password] unexpected error", err);
    return {
      ok: false,
      message: "Something went wrong on the server; try again in a moment.",
      code: "server_error",
    };
  }
}
