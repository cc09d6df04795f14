"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
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
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const [pending, setPending] = useState(false);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setPending(true);
    setError(null);
    const data: Record<string, string> = { ...hidden };
    for (const [k, v] of form.entries()) if (typeof v === "string" && v !== "") data[k] = v;
    const res = await run(data);
    setPending(false);
    if (res.ok) {
      setDone(true);
      router.refresh();
    } else {
      const fe = res.fieldErrors ? Object.values(res.fieldErrors).flat().join(" ") : "";
      setError(`${res.message}${fe ? ` ${fe}` : ""}`);
    }
  }

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
        <label className="block space-y-1">
          <span className="text-sm font-medium">{commentLabel}</span>
          <textarea
            name={withComment}
            required={commentRequired}
            rows={3}
            className="block w-full rounded-lg border border-graphite-300 p-2 text-sm"
          />
        </label>
      ) : null}
      <label className="block space-y-1">
        <span className="text-sm font-medium">Your password</span>
        <input
          name="password"
          type="password"
          autoComplete="current-password"
          required
          className="block min-h-touch w-full rounded-lg border border-graphite-300 px-3"
        />
      </label>
      {error ? (
        <p role="alert" className="text-sm text-fail-700">
          {error}
        </p>
      ) : null}
      <button
        disabled={pending}
        className={`min-h-touch rounded-lg px-4 font-semibold text-white disabled:opacity-60 ${tone === "danger" ? "bg-fail-600 hover:bg-fail-700" : "bg-accent-600 hover:bg-accent-700"}`}
      >
        {pending ? "Signing…" : submitLabel}
      </button>
    </form>
  );
}
