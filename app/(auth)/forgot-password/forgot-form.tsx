"use client";

import { useState, useTransition } from "react";
import { requestPasswordResetAction } from "./actions";

export function ForgotPasswordForm() {
  const [pending, start] = useTransition();
  const [state, setState] = useState<{ ok: boolean; message: string } | null>(null);
  if (state?.ok)
    return (
      <p role="status" className="rounded-card border border-pass-600/40 bg-pass-50 p-4 text-pass-700">
        {state.message}
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
          const res = await requestPasswordResetAction(data);
          setState(
            res.ok
              ? { ok: true, message: res.data.message }
              : { ok: false, message: res.fieldErrors?.email?.[0] ?? res.message },
          );
        });
      }}
    >
      {state && !state.ok ? (
        <p
          role="alert"
          className="rounded-card border border-fail-600/40 bg-fail-50 px-4 py-3 text-sm text-fail-700"
        >
          {state.message}
        </p>
      ) : null}
      <label className="block space-y-1.5">
        <span className="text-sm font-medium text-graphite-800">E-mail</span>
        <input
          name="email"
          type="email"
          autoComplete="username"
          required
          className="block min-h-touch w-full rounded-lg border border-graphite-300 bg-white px-3 text-base shadow-sm focus:border-accent-500"
        />
      </label>
      <button
        type="submit"
        disabled={pending}
        className="min-h-touch w-full rounded-lg bg-accent-600 px-4 font-semibold text-white hover:bg-accent-700 disabled:opacity-60"
      >
        {pending ? "Sending…" : "Send me a reset link"}
      </button>
    </form>
  );
}
