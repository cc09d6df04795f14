"use client";

import { useReadingQueue } from "@/components/readings/queue-provider";

/**
 * The job's readings still on this tablet: how many wait to send, how many the server refused,
 * and a button to try now. Silent when nothing waits.
 */
export function QueueStatus() {
  const { items, sendNow, signedOut } = useReadingQueue();
  const waiting = items.filter((i) => i.state === "waiting");
  const refused = items.filter((i) => i.state === "refused");
  if (items.length === 0)
    return (
      <p className="text-sm text-graphite-600" data-testid="queue-status" role="status">
        Every reading is stored on the server.
      </p>
    );
  const reason = waiting[0]?.reason;
  return (
    <div
      className="flex flex-wrap items-center gap-3 rounded-md border border-accent-300 bg-accent-50 px-4 py-2 text-sm"
      data-testid="queue-status"
      role="status"
    >
      {waiting.length ? (
        <span className="font-semibold text-graphite-900">
          <span className="num" data-testid="queue-count">
            {waiting.length}
          </span>{" "}
          {waiting.every((i) => i.photo)
            ? waiting.length === 1
              ? "photo"
              : "photos"
            : waiting.some((i) => i.photo)
              ? "readings and photos"
              : waiting.length === 1
                ? "reading"
                : "readings"}{" "}
          waiting to send
        </span>
      ) : null}
      {refused.length ? (
        <span className="font-semibold text-fail-700" data-testid="queue-refused">
          <span className="num">{refused.length}</span> refused: correct or discard
        </span>
      ) : null}
      {reason ? (
        <span className="text-graphite-700">
          {signedOut ? "Signed out. " : ""}
          {reason}
        </span>
      ) : null}
      {waiting.length ? (
        <button
          type="button"
          onClick={() => void sendNow()}
          className="ml-auto min-h-touch rounded-md border border-graphite-300 bg-white px-4 font-medium hover:bg-graphite-100"
        >
          Send now
        </button>
      ) : null}
    </div>
  );
}
