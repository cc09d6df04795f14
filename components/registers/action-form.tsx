"use client";

import { useRef, useState, useTransition } from "react";
import { useRouter } from "next/navigation";
import type { ActionResult } from "@/lib/actions";

/**
 * A register form posted to a server action as FormData. Field errors from the server are shown
 * beside the field they name (an element with data-error-for="<name>") and listed at the top.
 */
export function ActionForm<T>({
  action,
  children,
  submitLabel,
  className = "",
  resetOnSuccess = true,
  successMessage,
  variant = "primary",
}: {
  action: (raw: unknown) => Promise<ActionResult<T>>;
  children: React.ReactNode;
  submitLabel: string;
  className?: string;
  resetOnSuccess?: boolean;
  successMessage?: string;
  variant?: "primary" | "secondary";
}) {
  const router = useRouter();
  const ref = useRef<HTMLFormElement>(null);
  const [pending, start] = useTransition();
  const [result, setResult] = useState<{
    ok: boolean;
    message: string;
    fields?: Record<string, string[]>;
  } | null>(null);

  function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const data = new FormData(e.currentTarget);
    start(async () => {
      const res = await action(data);
      if (res.ok) {
        setResult({ ok: true, message: successMessage ?? "Saved." });
        if (resetOnSuccess) ref.current?.reset();
        router.refresh();
      } else {
        setResult({
          ok: false,
          message: res.message,
          ...(res.fieldErrors ? { fields: res.fieldErrors } : {}),
        });
      }
      // Put each field's message beside its field.
      ref.current?.querySelectorAll<HTMLElement>("[data-error-for]").forEach((el) => {
        const msg = !res.ok ? res.fieldErrors?.[el.dataset.errorFor!]?.[0] : undefined;
        el.textContent = msg ?? "";
      });
    });
  }

  return (
    <form ref={ref} onSubmit={onSubmit} className={`space-y-4 ${className}`} noValidate>
      {children}
      <div className="flex flex-wrap items-center gap-3">
        <button
          type="submit"
          disabled={pending}
          className={`min-h-touch rounded-md px-5 text-sm font-semibold disabled:opacity-60 ${variant === "primary" ? "bg-accent-600 text-white hover:bg-accent-700" : "border border-graphite-300 bg-white text-graphite-800 hover:bg-graphite-100"}`}
        >
          {pending ? "Saving…" : submitLabel}
        </button>
        {result ? (
          <p
            role={result.ok ? "status" : "alert"}
            className={`text-sm ${result.ok ? "text-pass-700" : "text-fail-700"}`}
          >
            {result.message}
          </p>
        ) : null}
      </div>
    </form>
  );
}

export function Field({
  name,
  label,
  children,
  hint,
}: {
  name: string;
  label: string;
  children: React.ReactNode;
  hint?: string;
}) {
  return (
    <label className="block space-y-1">
      <span className="text-sm font-medium text-graphite-700">{label}</span>
      {children}
      {hint ? <span className="block text-xs text-graphite-500">{hint}</span> : null}
      <span data-error-for={name} className="block text-sm text-fail-700" />
    </label>
  );
}

export const inputClass =
  "block min-h-touch w-full rounded-md border border-graphite-300 bg-white px-3 text-base focus:border-accent-500 focus:outline-none focus:ring-2 focus:ring-accent-500/40";
