"use client";

import { useState, useTransition } from "react";
import { useRouter } from "next/navigation";
import { changeStatusAction, setUnitSystemAction } from "@/app/(app)/jobs/[id]/checklist/actions";
import type { JobStatus } from "@/lib/domain/jobs";
import { UNIT_SYSTEM_LABELS, type UnitSystem } from "@/lib/domain/units";

/** Status moves this user may make from the checklist (checked again on the server). */
export function StatusButtons({
  jobId,
  moves,
}: {
  jobId: string;
  moves: ReadonlyArray<{ to: JobStatus; label: string }>;
}) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [error, setError] = useState<string | null>(null);
  if (moves.length === 0) return null;
  return (
    <div className="flex flex-wrap items-center gap-2">
      {moves.map((m) => (
        <button
          key={m.to}
          type="button"
          disabled={pending}
          onClick={() =>
            start(async () => {
              setError(null);
              const res = await changeStatusAction({ jobId, to: m.to });
              if (!res.ok) setError(res.message);
              else router.refresh();
            })
          }
          className="min-h-touch rounded-md bg-graphite-900 px-5 text-base font-semibold text-white hover:bg-graphite-800 disabled:opacity-60"
        >
          {m.label}
        </button>
      ))}
      {error ? (
        <p role="alert" className="text-sm text-fail-700">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** Inch or metric for this user; only the display changes, stored values stay canonical. */
export function UnitToggle({ current, path }: { current: UnitSystem; path: string }) {
  const router = useRouter();
  const [pending, start] = useTransition();
  return (
    <div
      role="group"
      aria-label="Units"
      className="inline-flex rounded-md border border-graphite-300 bg-white p-0.5"
    >
      {(["inch", "metric"] as const).map((u) => (
        <button
          key={u}
          type="button"
          aria-pressed={current === u}
          disabled={pending}
          onClick={() =>
            start(async () => {
              await setUnitSystemAction({ unitSystem: u, path });
              router.refresh();
            })
          }
          className={`min-h-touch rounded px-4 text-sm font-medium ${current === u ? "bg-graphite-900 text-white" : "text-graphite-700 hover:bg-graphite-100"}`}
        >
          {UNIT_SYSTEM_LABELS[u]}
        </button>
      ))}
    </div>
  );
}
