"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { ActionNotice, Button } from "@/components/ui/button";
import { approveFitAction, runFitAction } from "@/app/(app)/jobs/[id]/analysis/actions";

export function RunFitButton({
  jobId,
  datasetId,
  label = "Run fit",
}: {
  jobId: string;
  datasetId: string;
  label?: string;
}) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [msg, setMsg] = useState<{ ok: boolean; text: string } | null>(null);
  return (
    <div className="flex flex-col items-end gap-1">
      <Button
        pending={pending}
        pendingLabel="Fitting…"
        onClick={() =>
          start(async () => {
            setMsg(null);
            const r = await runFitAction({ jobId, datasetId });
            if (!r.ok) setMsg({ ok: false, text: r.message });
            else {
              setMsg({
                ok: true,
                text: r.data.reused ? "Same input as a stored fit: that fit is shown." : "Fit stored.",
              });
              router.refresh();
            }
          })
        }
        variant="amber"
        className="px-5"
      >
        {label}
      </Button>
      {msg ? (
        <ActionNotice ok={msg.ok} className={msg.ok ? "text-graphite-700" : ""}>
          {msg.text}
        </ActionNotice>
      ) : null}
    </div>
  );
}

export function ApproveButton({
  jobId,
  analysisId,
  refusal,
}: {
  jobId: string;
  analysisId: string;
  refusal: string | null;
}) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [error, setError] = useState<string | null>(null);
  return (
    <div className="space-y-2">
      <button
        type="button"
        disabled={pending || refusal !== null}
        aria-describedby={refusal ? "approve-refusal" : undefined}
        onClick={() =>
          start(async () => {
            setError(null);
            const r = await approveFitAction({ jobId, analysisId });
            if (!r.ok) setError(r.message);
            else router.refresh();
          })
        }
        className="min-h-touch rounded-md bg-graphite-900 px-5 font-semibold text-white hover:bg-graphite-800 disabled:cursor-not-allowed disabled:bg-graphite-300 disabled:text-graphite-700"
      >
        {pending ? "Approving…" : "Approve these parameters"}
      </button>
      {refusal ? (
        <p id="approve-refusal" className="text-sm text-graphite-700">
          {refusal}
        </p>
      ) : null}
      {error ? <ActionNotice ok={false}>{error}</ActionNotice> : null}
    </div>
  );
}
