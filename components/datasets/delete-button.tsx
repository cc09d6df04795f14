"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ActionNotice, Button } from "@/components/ui/button";

/** Marks a dataset deleted (kept for the record) after the person confirms in place. */
export function DeleteDatasetButton({ datasetId, jobId }: { datasetId: string; jobId: string }) {
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  async function remove() {
    setPending(true);
    const res = await fetch(`/api/datasets/${datasetId}`, { method: "DELETE" });
    setPending(false);
    if (res.ok) {
      router.push(`/jobs/${jobId}/data`);
      router.refresh();
      return;
    }
    const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
    setError(body?.error?.message ?? "The dataset could not be deleted.");
  }
  if (!confirming) {
    return (
      <button
        type="button"
        onClick={() => setConfirming(true)}
        className="min-h-touch rounded-lg border border-fail-600/50 px-4 text-sm font-semibold text-fail-700 hover:bg-fail-50"
      >
        Delete this dataset…
      </button>
    );
  }
  return (
    <div className="space-y-2 rounded-lg border border-fail-600/50 bg-fail-50 p-3 text-sm">
      <p>
        It stays in the record as deleted (with who and when) and no longer counts for this job. The original
        file is kept.
      </p>
      <div className="flex gap-2">
        <Button variant="danger" pending={pending} pendingLabel="Deleting…" onClick={remove}>
          Delete
        </Button>
        <Button variant="secondary" onClick={() => setConfirming(false)}>
          Keep it
        </Button>
      </div>
      {error ? <ActionNotice ok={false}>{error}</ActionNotice> : null}
    </div>
  );
}
