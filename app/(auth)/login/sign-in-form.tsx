"use client";

import { signIn } from "next-auth/react";
import Link from "next/link";
import { rateLimitMessage } from "@/lib/auth/throttle";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { useFormSubmit } from "@/components/ui/use-form-submit";

const INPUT =
  "block min-h-touch w-full rounded-lg border border-graphite-300 bg-white px-3 text-base text-graphite-900 shadow-sm focus:border-accent-500";

const MESSAGES: Record<string, string> = {
  CredentialsSignin: "That e-mail and password do not match an active account.",
  SessionRequired: "Sign in to continue.",
  SessionEnded:
    "Your session has ended (signed out, the account changed, or 12 hours passed). Sign in again.",
};

/** Seconds to wait named by a 429's redirect URL (`wait=`), or the counting window when it does not say. */
function waitFrom(url: string | null | undefined): number {
  const n = Number(url ? new URL(url, "http://x").searchParams.get("wait") : NaN);
  return Number.isFinite(n) && n > 0 ? n : 900;
}

function messageFor(code: string, waitS?: number): string {
  if (code === "RateLimited") return rateLimitMessage(waitS ?? 900);
  return MESSAGES[code] ?? MESSAGES.CredentialsSignin!;
}

export function SignInForm({
  callbackUrl,
  initialError,
  initialWaitS,
}: {
  callbackUrl: string;
  initialError?: string;
  initialWaitS?: number;
}) {
  const { pending, error, onSubmit } = useFormSubmit(
    async (form) => {
      const res = await signIn("credentials", {
        email: String(form.get("email") ?? ""),
        password: String(form.get("password") ?? ""),
        redirect: false,
        callbackUrl,
      });
      if (res?.ok && !res.error) {
        window.location.assign(callbackUrl);
        return null;
      }
      return res?.status === 429 ? messageFor("RateLimited", waitFrom(res.url)) : MESSAGES.CredentialsSignin!;
    },
    initialError ? messageFor(initialError, initialWaitS) : null,
  );

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
      <p className="text-sm">
        <Link href="/forgot-password" className="text-accent-700 underline">
          Forgot your password?
        </Link>
      </p>
    </form>
  );
}
