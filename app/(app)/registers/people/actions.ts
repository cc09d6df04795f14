"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { clearSignInDelay, sendResetLink } from "@/db/queries/users-admin";
import { action } from "@/lib/actions";
import { zUuid } from "@/lib/domain/uuid";

const person = z.object({ userId: zUuid() });

/** The administrator lifts the sign-in delay on an account (lib/policy/account-recovery decides who may). */
export const clearSignInDelayAction = action({ schema: person }, async ({ userId }, actor) => {
  const { cleared } = await clearSignInDelay(actor, userId);
  revalidatePath("/registers/people");
  return { cleared };
});

/** The administrator e-mails a person a one-hour, single-use reset link. */
export const sendResetLinkAction = action({ schema: person }, async ({ userId }, actor) => {
  await sendResetLink(actor, userId);
  revalidatePath("/registers/outbox");
  return { sent: true };
});
