"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ActionNotice, Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { refusalText } from "@/components/ui/form-errors";
import type { ActionResult } from "@/lib/actions";

/**
 * The engineer carries a FAIL or undecided result into the report as a deviation: which result,
 * and a written justification. The engineer's name is recorded with it.
 */
export function DeviationForm({
  jobId,
  results,
  run,
}: {
  jobId: string;
  results: ReadonlyArray<{ subject: string; label: string; decision: string }>;
  run: (data: Record<string, string>) => Promise<ActionResult<unknown>>;
}) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const formEl = e.currentTarget;
    const form = new FormData(formEl);
    setPending(true);
    setError(null);
    const res = await run({
      jobId,
      subject: String(form.get("subject") ?? ""),
      justification: String(form.get("justification") ?? ""),
    });
    setPending(false);
    if (res.ok) {
      formEl.reset();
      router.refresh();
    } else {
      setError(refusalText(res));
    }
  }

  return (
    <form
      onSubmit={onSubmit}
      aria-label="Record a deviation"
      className="space-y-3 rounded-card border border-graphite-200 bg-white p-4"
    >
      <p className="font-semibold">Record a deviation</p>
      <p className="text-sm text-graphite-600">
        The result stays as measured and is printed under &ldquo;Deviations&rdquo; with your justification and
        your name. Measure it again instead if the cause can be corrected.
      </p>
      <Field name="subject" label="Result">
        <select required className={inputClass}>
          {results.map((r) => (
            <option key={r.subject} value={r.subject}>
              {r.label} — {r.decision === "fail" ? "FAIL" : "undecided"}
            </option>
          ))}
        </select>
      </Field>
      <Field name="justification" label="Justification">
        <textarea required minLength={10} rows={3} className={`${inputClass} py-2`} />
      </Field>
      {error ? <ActionNotice ok={false}>{error}</ActionNotice> : null}
      <Button type="submit" pending={pending} pendingLabel="Recording…">
        Record deviation
      </Button>
    </form>
  );
}
