import type { JobStatus } from "@/lib/domain/jobs";
import { STATUS_LABELS } from "@/lib/domain/jobs";

const MAIN: JobStatus[] = ["draft", "measuring", "in_review", "approved", "issued"];

/**
 * Where the job stands in its flow, as an ordered list (readable without colour). A job on hold
 * shows where it paused (`heldFrom`); a cancelled one says so instead of a flow.
 */
export function StatusFlow({ status, heldFrom }: { status: JobStatus; heldFrom?: JobStatus | null }) {
  if (status === "cancelled")
    return (
      <p className="text-sm font-medium text-graphite-800">Cancelled: the job is kept for the record.</p>
    );
  const shown = status === "on_hold" ? (heldFrom ?? "draft") : status;
  const finalStep: JobStatus = shown === "rejected" ? "rejected" : "accepted";
  const steps = [...MAIN, finalStep];
  const at = steps.indexOf(shown);
  return (
    <>
      {status === "on_hold" ? (
        <p className="mb-2 text-sm font-medium text-graphite-800">
          On hold at “{STATUS_LABELS[shown].toLowerCase()}”; released, it continues from there.
        </p>
      ) : null}
      <ol className="flex flex-wrap items-center gap-2 text-sm" aria-label="Job status flow">
        {steps.map((s, i) => {
          const state = i < at ? "done" : i === at ? "current" : "todo";
          return (
            <li
              key={s}
              className="flex items-center gap-2"
              aria-current={state === "current" ? "step" : undefined}
            >
              <span
                className={`inline-flex items-center gap-1.5 rounded-full px-3 py-1 font-medium ${
                  state === "current"
                    ? "bg-accent-600 text-white"
                    : state === "done"
                      ? "bg-graphite-200 text-graphite-800"
                      : "border border-dashed border-graphite-300 text-graphite-500"
                }`}
              >
                {state === "done" ? <span aria-hidden="true">✓</span> : null}
                {STATUS_LABELS[s]}
                {state === "current" ? <span className="sr-only"> (current)</span> : null}
              </span>
              {i < steps.length - 1 ? (
                <span aria-hidden="true" className="text-graphite-300">
                  →
                </span>
              ) : null}
            </li>
          );
        })}
      </ol>
    </>
  );
}
