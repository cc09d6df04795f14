"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import type { ActionResult } from "@/lib/actions";

export type ActionNoticeState = { ok: boolean; message: string };

/**
 * A button that calls a server action directly (no form around it): pending while the action runs,
 * the last notice cleared first, the server's message on a refusal, and on success the words
 * `said` gives for the result, then the page's data refreshed.
 */
export function useActionButton() {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [notice, setNotice] = useState<ActionNoticeState | null>(null);

  function run<T>(call: () => Promise<ActionResult<T>>, said: (data: T) => string) {
    start(async () => {
      setNotice(null);
      const res = await call();
      if (!res.ok) {
        setNotice({ ok: false, message: res.message });
        return;
      }
      setNotice({ ok: true, message: said(res.data) });
      router.refresh();
    });
  }

  return { pending, notice, run };
}
