"use client";

import { useState } from "react";
import { ActionNotice, Button } from "@/components/ui/button";
import { useActionButton } from "@/components/ui/use-action-button";
import { SignForm } from "@/components/report/sign-form";
import { approveFitAction, runFitAction } from "@/app/(app)/jobs/[id]/analysis/actions";
import type { NonConformingParameter } from "@/lib/fit-display";
import { SIGNING_WORDS } from "@/lib/domain/signatures";

export function RunFitButton({
  jobId,
  datasetId,
  label = "Run fit",
}: {
  jobId: string;
  datasetId: string;
  label?: string;
}) {
  const { pending, notice, run } = useActionButton();
  return (
    <div className="flex flex-col items-end gap-1">
      <Button
        pending={pending}
        pendingLabel="Fitting…"
        onClick={() =>
          run(
            () => runFitAction({ jobId, datasetId }),
            (fit) => (fit.reused ? "Same input as a stored fit: that fit is shown." : "Fit stored."),
          )
        }
        variant="amber"
        className="px-5"
      >
        {label}
      </Button>
      {notice ? (
        <ActionNotice ok={notice.ok} className={notice.ok ? "text-graphite-700" : ""}>
          {notice.message}
        </ActionNotice>
      ) : null}
    </div>
  );
}

/** A parameter the engineer is about to approve although it is FAIL or undecided, in words. */
export function ApproveButton({
  jobId,
  analysisId,
  refusal,
  nonConforming,
}: {
  jobId: string;
  analysisId: string;
  refusal: string | null;
  nonConforming: readonly NonConformingParameter[];
}) {
  const [open, setOpen] = useState(false);
  return (
    <div className="space-y-3">
      <button
        type="button"
        disabled={refusal !== null || open}
        aria-describedby={refusal ? "approve-refusal" : undefined}
        aria-expanded={open}
        onClick={() => setOpen(true)}
        className="min-h-touch rounded-md bg-graphite-900 px-5 font-semibold text-white hover:bg-graphite-800 disabled:cursor-not-allowed disabled:bg-graphite-300 disabled:text-graphite-700"
      >
        Approve these parameters
      </button>
      {refusal ? (
        <p id="approve-refusal" className="text-sm text-graphite-700">
          {refusal}
        </p>
      ) : null}
      {open ? (
        <SignForm
          {...SIGNING_WORDS.parameters_approved}
          hidden={{ jobId, analysisId }}
          run={approveFitAction}
        >
          {nonConforming.length > 0 ? (
            <div
              role="note"
              aria-label="Results that do not conform"
              className="rounded-card border border-fail-600/40 bg-fail-50 p-3 text-sm text-fail-700"
            >
              <p className="font-semibold">
                {nonConforming.length === 1
                  ? "One parameter does not conform:"
                  : `${nonConforming.length} parameters do not conform:`}
              </p>
              <ul className="mt-1 list-disc pl-5">
                {nonConforming.map((p) => (
                  <li key={p.key}>
                    {p.label}: {p.decisionText.toUpperCase()}, {p.valueText}
                    {p.toleranceText ? ` against ${p.toleranceText}` : ""}
                  </li>
                ))}
              </ul>
              <p className="mt-1">
                Approving does not make them conform: before the report is issued each is measured again or
                carried as a deviation with a written justification.
              </p>
              <label className="mt-2 flex min-h-touch items-center gap-2 font-semibold">
                <input
                  type="checkbox"
                  name="acknowledged"
                  value={nonConforming.map((p) => p.key).join(",")}
                  required
                  className="size-5"
                />
                I have read {nonConforming.length === 1 ? "this result" : "these results"} and approve
                nonetheless
              </label>
            </div>
          ) : (
            <p className="text-sm text-graphite-700">Every parameter with a limit is within it.</p>
          )}
        </SignForm>
      ) : null}
    </div>
  );
}
