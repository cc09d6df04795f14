"use client";

import { useState } from "react";
import { setPasswordAction } from "@/app/(auth)/set-password/actions";
import { Field } from "@/components/ui/field";
import { Form } from "@/components/ui/form";
import { setPasswordSchema } from "@/lib/validations/registers";

const cls =
  "block min-h-touch w-full rounded-lg border border-graphite-300 bg-white px-3 text-base shadow-sm focus:border-accent-500";

/** `signInHref`: where "Sign in" goes once the password is set (the page makes it from a checked callbackUrl). */
export function SetPasswordForm({ token, signInHref = "/login" }: { token: string; signInHref?: string }) {
  const [done, setDone] = useState(false);
  if (done)
    return (
      <p role="status" className="rounded-card border border-pass-600/40 bg-pass-50 p-4 text-pass-700">
        Your password is set.{" "}
        <a href={signInHref} className="font-semibold underline">
          Sign in
        </a>
      </p>
    );
  return (
    <Form
      action={setPasswordAction}
      schema={setPasswordSchema}
      submitLabel="Set password"
      resetOnSuccess={false}
      onSuccess={() => setDone(true)}
      className="space-y-5"
      submitClassName="w-full"
    >
      <input type="hidden" name="token" value={token} />
      <Field name="password" label="New password (at least 10 characters)">
        <input type="password" autoComplete="new-password" className={cls} />
      </Field>
      <Field name="confirm" label="Repeat it">
        <input type="password" autoComplete="new-password" className={cls} />
      </Field>
    </Form>
  );
}
