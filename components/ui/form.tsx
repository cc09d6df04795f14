"use client";

import { useState, useTransition } from "react";
import { useRouter } from "next/navigation";
import { FormProvider, useForm, type FieldValues, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import type { ActionResult } from "@/lib/actions";
import { ActionNotice, Button, type ButtonVariant } from "./button";
import { INVALID_MESSAGE, mapActionErrors } from "./form-errors";

type Notice = { ok: boolean; message: string };

/** What every form of the kit takes besides its fields. */
export type FormProps<T> = {
  action: (raw: unknown) => Promise<ActionResult<T>>;
  /** The action's own input schema; without one only the server checks. */
  schema?: z.ZodType;
  submitLabel: string;
  successMessage?: string;
  resetOnSuccess?: boolean;
  variant?: ButtonVariant;
  className?: string;
  submitClassName?: string;
  onSuccess?: (data: T) => void;
  "aria-label"?: string;
};

/**
 * The one form pattern: react-hook-form checks the fields with the same zod schema the server
 * action parses, then the form's values go to the action as FormData. The server's field errors
 * land beside their fields, its message is shown once next to the submit button, and the button
 * says "Saving…" while the action runs.
 */
export function Form<T>({
  action,
  schema,
  children,
  submitLabel,
  successMessage = "Saved.",
  resetOnSuccess = true,
  variant = "primary",
  className = "",
  submitClassName = "",
  onSuccess,
  "aria-label": ariaLabel,
}: FormProps<T> & { children: React.ReactNode }) {
  const router = useRouter();
  const form = useForm<FieldValues>({
    resolver: schema ? (zodResolver(schema as never) as Resolver<FieldValues>) : undefined,
  });
  const [pending, start] = useTransition();
  const [notice, setNotice] = useState<Notice | null>(null);

  function send(el: HTMLFormElement, data: FormData) {
    start(async () => {
      const res = await action(data);
      if (res.ok) {
        setNotice({ ok: true, message: successMessage });
        form.clearErrors();
        if (resetOnSuccess) el.reset();
        router.refresh();
        onSuccess?.(res.data);
        return;
      }
      const mapped = mapActionErrors(res, (name) => el.elements.namedItem(name) !== null);
      for (const [name, message] of mapped.fields) form.setError(name, { type: "server", message });
      setNotice({ ok: false, message: mapped.message });
    });
  }

  function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const el = e.currentTarget;
    const data = new FormData(el);
    // The page's inputs are the truth (hidden inputs, a reset after saving): copy them in first.
    for (const name of new Set(data.keys())) form.setValue(name, data.get(name));
    void form.handleSubmit(
      () => send(el, data),
      () => setNotice({ ok: false, message: INVALID_MESSAGE }),
    )();
  }

  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} aria-label={ariaLabel} className={`space-y-4 ${className}`} noValidate>
        {children}
        <SubmitRow
          label={submitLabel}
          pending={pending}
          notice={notice}
          variant={variant}
          buttonClassName={submitClassName}
        />
      </form>
    </FormProvider>
  );
}

/** A form's footer: the submit button ("Saving…" while pending) and the action's notice beside it. */
export function SubmitRow({
  label,
  pending,
  notice,
  variant = "primary",
  buttonClassName = "",
  className = "",
}: {
  label: string;
  pending: boolean;
  notice: Notice | null;
  variant?: ButtonVariant;
  buttonClassName?: string;
  className?: string;
}) {
  return (
    <div className={`flex flex-wrap items-center gap-3 ${className}`}>
      <Button type="submit" variant={variant} pending={pending} className={buttonClassName}>
        {label}
      </Button>
      {notice ? <ActionNotice ok={notice.ok}>{notice.message}</ActionNotice> : null}
    </div>
  );
}
