"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
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
      const fe = res.fieldErrors ? Object.values(res.fieldErrors).flat().join(" ") : "";
      setError(`${res.message}${fe ? ` ${fe}` : ""}`);
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
      <label className="block space-y-1">
        <span className="text-sm font-medium">Result</span>
        <select
          name="subject"
          required
          className="block min-h-touch w-full rounded-lg border border-graphite-300 bg-white px-3 text-sm"
        >
          {results.map((r) => (
            <option key={r.subject} value={r.subject}>
              {r.label} — {r.decision === "fail" ? "FAIL" : "undecided"}
            </option>
          ))}
        </select>
      </label>
      <label className="block space-y-1">
        <span className="text-sm font-medium">Justification</span>
        <textarea
          name="justification"
          required
          minLength={10}
          rows={3}
          className="block w-full rounded-lg border border-graphite-300 p-2 text-sm"
        />
      </label>
      {error ? (
        <p role="alert" className="text-sm text-fail-700">
          {error}
        </p>
      ) : null}
      <button
        disabled={pending}
        className="min-h-touch rounded-lg bg-accent-600 px-4 font-semibold text-white hover:bg-accent-700 disabled:opacity-60"
      >
        {pending ? "Recording…" : "Record deviation"}
      </button>
    </form>
  );
}
