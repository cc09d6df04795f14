"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ActionNotice, Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { refusalText } from "@/components/ui/form-errors";
import { useFormSubmit } from "@/components/ui/use-form-submit";
import type { ActionResult } from "@/lib/actions";

/**
 * A signing form: the signer sees what the signature means and re-enters their password
 * (21 CFR 11.200). Optional comment (required to reject) and amendment reason.
 */
export function SignForm({
  title,
  meaning,
  submitLabel,
  hidden,
  withComment,
  commentLabel,
  commentRequired,
  tone = "accent",
  run,
  children,
}: {
  title: string;
  meaning: string;
  submitLabel: string;
  hidden: Record<string, string>;
  withComment?: "comment" | "amendmentReason";
  commentLabel?: string;
  commentRequired?: boolean;
  tone?: "accent" | "danger";
  run: (data: Record<string, string>) => Promise<ActionResult<unknown>>;
  /** What the signer must see before signing (e.g. the results that do not conform). */
  children?: React.ReactNode;
}) {
  const router = useRouter();
  const [done, setDone] = useState(false);
  const { pending, error, onSubmit } = useFormSubmit(async (form) => {
    const data: Record<string, string> = { ...hidden };
    for (const [k, v] of form.entries()) if (typeof v === "string" && v !== "") data[k] = v;
    const res = await run(data);
    if (!res.ok) return refusalText(res);
    setDone(true);
    router.refresh();
    return null;
  });

  if (done)
    return (
      <p className="rounded-card border border-pass-600/40 bg-pass-50 p-3 text-sm text-pass-700">✓ Signed.</p>
    );
  return (
    <form
      onSubmit={onSubmit}
      className="space-y-3 rounded-card border border-graphite-200 bg-white p-4"
      aria-label={title}
    >
      <p className="font-semibold">{title}</p>
      <p className="text-sm text-graphite-600">{meaning}</p>
      {children}
      {withComment ? (
        <Field name={withComment} label={commentLabel ?? "Comment"}>
          <textarea required={commentRequired} rows={3} className={`${inputClass} py-2`} />
        </Field>
      ) : null}
      <Field name="password" label="Your password">
        <input type="password" autoComplete="current-password" required className={inputClass} />
      </Field>
      {error ? <ActionNotice ok={false}>{error}</ActionNotice> : null}
      <Button
        type="submit"
        pending={pending}
        pendingLabel="Signing…"
        variant={tone === "danger" ? "danger" : "primary"}
      >
        {submitLabel}
      </Button>
    </form>
  );
}
