"use client";

import { useRouter } from "next/navigation";
import { createContext, useCallback, useContext, useEffect, useMemo, useRef, useState } from "react";
import { listQueued, putQueued, removeQueued, sendQueued, type QueuedReading } from "@/lib/readings-queue";
import { backoffMs, type SendOutcome } from "@/lib/readings-sync";

interface QueueApi {
  /** The job's readings still on this tablet, in the order they were entered. */
  items: QueuedReading[];
  /** Keeps the reading on the device, then tries to send everything waiting, in order. */
  enqueue: (
    item: Omit<QueuedReading, "seq" | "state" | "reason" | "attempts" | "nextAttemptAt" | "userId">,
  ) => Promise<SendOutcome | null>;
  discard: (clientId: string) => Promise<void>;
  sendNow: () => Promise<void>;
  /** Sending is paused until the user signs in again. */
  signedOut: boolean;
}

const QueueContext = createContext<QueueApi | null>(null);

export function useReadingQueue(): QueueApi {
  const q = useContext(QueueContext);
  if (!q) throw new Error("useReadingQueue needs a ReadingQueueProvider");
  return q;
}

/**
 * Holds the job's queue of readings made on this tablet and sends them when it can: at once, when
 * the browser says the connection is back, and after a failed try with a growing wait. A reading
 * the server refuses stays in the queue with the reason until the installer edits or discards it.
 */
export function ReadingQueueProvider({
  jobId,
  userId,
  children,
}: {
  jobId: string;
  /** The signed-in user: readings typed under another sign-in on this tablet are neither shown nor sent. */
  userId: string;
  children: React.ReactNode;
}) {
  const router = useRouter();
  const [items, setItems] = useState<QueuedReading[]>([]);
  const [signedOut, setSignedOut] = useState(false);
  const running = useRef<Promise<Map<string, SendOutcome>> | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const flushRef = useRef<() => Promise<Map<string, SendOutcome>>>(async () => new Map());

  const reload = useCallback(async () => setItems(await listQueued(jobId, userId)), [jobId, userId]);

  const flush = useCallback(async (): Promise<Map<string, SendOutcome>> => {
    while (running.current) await running.current;
    const run = (async () => {
      const outcomes = new Map<string, SendOutcome>();
      let sent = false;
      for (const item of await listQueued(jobId, userId)) {
        if (item.state === "refused") continue;
        // In order: a reading waiting for its next try holds back the ones entered after it.
        if (item.nextAttemptAt > Date.now()) break;
        const o = await sendQueued(item);
        outcomes.set(item.clientId, o);
        if (o.kind === "sent") {
          await removeQueued(item.clientId);
          sent = true;
        } else if (o.kind === "refused") {
          await putQueued({ ...item, state: "refused", reason: o.reason });
        } else {
          const attempts = item.attempts + 1;
          const wait = o.kind === "signed_out" ? 60_000 : backoffMs(attempts);
          await putQueued({ ...item, attempts, reason: o.reason, nextAttemptAt: Date.now() + wait });
          setSignedOut(o.kind === "signed_out");
          break;
        }
        setSignedOut(false);
      }
      const left = await listQueued(jobId, userId);
      setItems(left);
      if (sent) router.refresh();
      const next = left.filter((i) => i.state === "waiting").map((i) => i.nextAttemptAt);
      if (timer.current) clearTimeout(timer.current);
      if (next.length)
        timer.current = setTimeout(
          () => void flushRef.current(),
          Math.max(500, Math.min(...next) - Date.now()),
        );
      return outcomes;
    })();
    running.current = run;
    try {
      return await run;
    } finally {
      if (running.current === run) running.current = null;
    }
  }, [jobId, userId, router]);

  useEffect(() => {
    flushRef.current = flush;
  }, [flush]);

  /** Everything waiting becomes due now (the connection is back, or the user asked). */
  const sendNow = useCallback(async () => {
    for (const i of await listQueued(jobId, userId))
      if (i.state === "waiting") await putQueued({ ...i, nextAttemptAt: 0 });
    await flush();
  }, [jobId, userId, flush]);

  useEffect(() => {
    // Read what this tablet kept (the state is set in the read's callback), then try to send it.
    let live = true;
    void listQueued(jobId, userId)
      .then((kept) => {
        if (live) setItems(kept);
      })
      .then(() => (live ? flush() : undefined));
    const online = () => void sendNow();
    window.addEventListener("online", online);
    return () => {
      live = false;
      window.removeEventListener("online", online);
      if (timer.current) clearTimeout(timer.current);
    };
  }, [jobId, userId, flush, sendNow]);

  const enqueue = useCallback<QueueApi["enqueue"]>(
    async (item) => {
      const all = await listQueued(jobId, userId);
      const seq = Math.max(Date.now(), ...all.map((i) => i.seq + 1));
      await putQueued({
        ...item,
        userId,
        seq,
        state: "waiting",
        reason: null,
        attempts: 0,
        nextAttemptAt: 0,
      });
      await reload();
      const outcomes = await flush();
      return outcomes.get(item.clientId) ?? null;
    },
    [jobId, userId, reload, flush],
  );

  const discard = useCallback(
    async (clientId: string) => {
      await removeQueued(clientId);
      await reload();
    },
    [reload],
  );

  const api = useMemo(
    () => ({ items, enqueue, discard, sendNow, signedOut }),
    [items, enqueue, discard, sendNow, signedOut],
  );
  return <QueueContext.Provider value={api}>{children}</QueueContext.Provider>;
}
