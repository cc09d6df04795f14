"use client";

import { useState, useTransition } from "react";
import { useRouter } from "next/navigation";
import { ActionNotice } from "@/components/ui/button";
import { chooseReportViewAction } from "./actions";

/**
 * "In the report" tick box of one saved view (application engineers). A view that may not go into
 * the report (another fit, too small) shows why instead; the server checks the same rule.
 */
export function ReportViewToggle({
  jobId,
  viewId,
  included,
  refusal,
}: {
  jobId: string;
  viewId: string;
  included: boolean;
  refusal: string | null;
}) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [error, setError] = useState<string | null>(null);
  const id = `report-view-${viewId}`;
  const blocked = Boolean(refusal) && !included;
  return (
    <div className="pt-1">
      <label htmlFor={id} className="flex min-h-touch items-center gap-2 text-sm font-medium">
        <input
          id={id}
          type="checkbox"
          className="h-5 w-5 accent-accent-600"
          checked={included}
          disabled={pending || blocked}
          aria-describedby={blocked ? `${id}-why` : undefined}
          onChange={(e) => {
            const include = e.currentTarget.checked;
            setError(null);
            start(async () => {
              const r = await chooseReportViewAction({ jobId, viewId, include });
              if (!r.ok) setError(r.message);
              router.refresh();
            });
          }}
        />
        In the report
      </label>
      {blocked ? (
        <p id={`${id}-why`} className="text-xs text-graphite-600">
          {refusal}
        </p>
      ) : null}
      {error ? <ActionNotice ok={false}>{error}</ActionNotice> : null}
    </div>
  );
}
