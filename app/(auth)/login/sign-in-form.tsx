"use client";

import { signIn } from "next-auth/react";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";

const INPUT =
  "block min-h-touch w-full rounded-lg border border-graphite-300 bg-white px-3 text-base text-graphite-900 shadow-sm focus:border-accent-500";

const MESSAGES: Record<string, string> = {
  CredentialsSignin: "That e-mail and password do not match an active account.",
  RateLimited:
    "Too many failed sign-ins for this account or from this address. Wait 15 minutes and try again, or ask your administrator to reset the password.",
  SessionRequired: "Sign in to continue.",
};

export function SignInForm({ callbackUrl, initialError }: { callbackUrl: string; initialError?: string }) {
  const [error, setError] = useState<string | null>(
    initialError ? (MESSAGES[initialError] ?? MESSAGES.CredentialsSignin!) : null,
  );
  const [pending, setPending] = useState(false);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setPending(true);
    setError(null);
    const res = await signIn("credentials", {
      email: String(form.get("email") ?? ""),
      password: String(form.get("password") ?? ""),
      redirect: false,
      callbackUrl,
    });
    if (res?.ok && !res.error) {
      window.location.assign(callbackUrl);
      return;
    }
    setPending(false);
    setError(res?.status === 429 ? MESSAGES.RateLimited! : MESSAGES.CredentialsSignin!);
  }

  return (
    <form onSubmit={onSubmit} className="space-y-5" noValidate>
      {error ? (
        <p
          role="alert"
          data-testid="sign-in-error"
          className="rounded-card border border-fail-600/40 bg-fail-50 px-4 py-3 text-sm text-fail-700"
        >
          {error}
        </p>
      ) : null}
      <Field name="email" label="E-mail">
        <input type="email" autoComplete="username" required className={INPUT} />
      </Field>
      <Field name="password" label="Password">
        <input type="password" autoComplete="current-password" required className={INPUT} />
      </Field>
      <Button type="submit" pending={pending} pendingLabel="Signing in…" size="lg" className="w-full">
        Sign in
      </Button>
    </form>
  );
}
