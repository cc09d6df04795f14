"use client";

import { useState, useTransition } from "react";
import { clearSignInDelayAction, sendResetLinkAction } from "@/app/(app)/registers/people/actions";

/** The administrator's two ways to help someone back in: lift the sign-in delay, or e-mail a reset link. */
export function AccountRecoveryButtons({ userId, disabled }: { userId: string; disabled: boolean }) {
  const [pending, start] = useTransition();
  const [note, setNote] = useState<string | null>(null);
  const cls =
    "min-h-touch rounded-lg border border-graphite-300 bg-white px-3 text-sm font-medium hover:bg-graphite-100 disabled:opacity-60";
  return (
    <div className="flex flex-wrap items-center gap-2">
      <button
        type="button"
        className={cls}
        disabled={pending}
        onClick={() =>
          start(async () => {
            const r = await clearSignInDelayAction({ userId });
            setNote(r.ok ? `Sign-in delay cleared (${r.data.cleared} failures forgotten).` : r.message);
          })
        }
      >
        Clear sign-in delay
      </button>
      <button
        type="button"
        className={cls}
        disabled={pending || disabled}
        onClick={() =>
          start(async () => {
            const r = await sendResetLinkAction({ userId });
            setNote(r.ok ? "Reset link queued for e-mail." : r.message);
          })
        }
      >
        Send reset link
      </button>
      {note ? (
        <span role="status" className="text-xs text-graphite-700">
          {note}
        </span>
      ) : null}
    </div>
  );
}
