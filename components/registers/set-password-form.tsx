"use client";

import { useState, useTransition } from "react";
import { setPasswordAction } from "@/app/(auth)/set-password/actions";

/** `signInHref`: where "Sign in" goes once the password is set (the page makes it from a checked callbackUrl). */
export function SetPasswordForm({ token, signInHref = "/login" }: { token: string; signInHref?: string }) {
  const [pending, start] = useTransition();
  const [state, setState] = useState<{
    ok: boolean;
    message: string;
    fields?: Record<string, string[]>;
  } | null>(null);
  const cls =
    "block min-h-touch w-full rounded-lg border border-graphite-300 bg-white px-3 text-base shadow-sm focus:border-accent-500";
  if (state?.ok)
    return (
      <p role="status" className="rounded-card border border-pass-600/40 bg-pass-50 p-4 text-pass-700">
        {state.message}{" "}
        <a href={signInHref} className="font-semibold underline">
          Sign in
        </a>
      </p>
    );
  return (
    <form
      className="space-y-5"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        const data = new FormData(e.currentTarget);
        start(async () => {
          const res = await setPasswordAction(data);
          setState(
            res.ok
              ? { ok: true, message: "Your password is set." }
              : { ok: false, message: res.message, ...(res.fieldErrors ? { fields: res.fieldErrors } : {}) },
          );
        });
      }}
    >
      <input type="hidden" name="token" value={token} />
      {state && !state.ok ? (
        <p
          role="alert"
          className="rounded-card border border-fail-600/40 bg-fail-50 px-4 py-3 text-sm text-fail-700"
        >
          {state.message}
        </p>
      ) : null}
      <label className="block space-y-1.5">
        <span className="text-sm font-medium">New password (at least 10 characters)</span>
        <input name="password" type="password" autoComplete="new-password" className={cls} />
        {state?.fields?.password ? (
          <span className="text-sm text-fail-700">{state.fields.password[0]}</span>
        ) : null}
      </label>
      <label className="block space-y-1.5">
        <span className="text-sm font-medium">Repeat it</span>
        <input name="confirm" type="password" autoComplete="new-password" className={cls} />
        {state?.fields?.confirm ? (
          <span className="text-sm text-fail-700">{state.fields.confirm[0]}</span>
        ) : null}
      </label>
      <button
        type="submit"
        disabled={pending}
        className="min-h-touch w-full rounded-lg bg-accent-600 px-4 font-semibold text-white hover:bg-accent-700 disabled:opacity-60"
      >
        {pending ? "Saving…" : "Set password"}
      </button>
    </form>
  );
}
