"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { changeStatusAction } from "@/app/(app)/jobs/[id]/checklist/actions";
import { useReadingQueue } from "@/components/readings/queue-provider";
import { ActionNotice, Button } from "@/components/ui/button";

const list = (xs: number[]) => xs.map((x) => `step ${x}`).join(", ");

/**
 * "Submit for review" in two taps: the first shows what the reviewer will find (steps not
 * measured, FAILs, readings still on this tablet); the second submits, and is refused while any
 * reading still waits to send.
 */
export function SubmitForReview({
  jobId,
  unmeasured,
  fails,
  missingPhotos = [],
}: {
  jobId: string;
  unmeasured: number[];
  fails: number[];
  /** Steps whose procedure asks for a photo and that have none on the server yet. */
  missingPhotos?: number[];
}) {
  const router = useRouter();
  const { items } = useReadingQueue();
  const [open, setOpen] = useState(false);
  const [pending, start] = useTransition();
  const [error, setError] = useState<string | null>(null);
  const onTablet = items.length;
  if (!open)
    return (
      <Button variant="dark" size="lg" onClick={() => setOpen(true)}>
        Submit for review
      </Button>
    );
  return (
    <section
      aria-label="Before you submit for review"
      className="w-full space-y-2 rounded-card border border-graphite-300 bg-white p-4 text-sm"
      data-testid="review-summary"
    >
      <h3 className="text-base font-semibold">Before you submit for review</h3>
      <ul className="list-disc space-y-1 pl-5">
        <li>{unmeasured.length ? `Not measured: ${list(unmeasured)}.` : "Every step is measured."}</li>
        <li>{fails.length ? `FAIL: ${list(fails)}.` : "No step fails."}</li>
        {missingPhotos.length ? <li>Photo still needed: {list(missingPhotos)}.</li> : null}
        <li className={onTablet ? "font-semibold text-fail-700" : ""}>
          {onTablet
            ? `${onTablet} ${onTablet === 1 ? "reading is" : "readings are"} still on this tablet (waiting to send or refused): send, correct or discard them first.`
            : "No reading is waiting on this tablet."}
        </li>
      </ul>
      <div className="flex flex-wrap gap-2 pt-1">
        <Button
          variant="dark"
          size="lg"
          pending={pending}
          pendingLabel="Submitting…"
          disabled={onTablet > 0}
          onClick={() =>
            start(async () => {
              setError(null);
              const res = await changeStatusAction({ jobId, to: "in_review" });
              if (!res.ok) setError(res.message);
              else router.refresh();
            })
          }
        >
          Submit now
        </Button>
        <Button variant="secondary" size="lg" onClick={() => setOpen(false)}>
          Not yet
        </Button>
      </div>
      {error ? <ActionNotice ok={false}>{error}</ActionNotice> : null}
    </section>
  );
}
