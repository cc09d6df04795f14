/**
 * The tablet's queue of readings not yet stored on the server, in IndexedDB (through idb) so that
 * it survives a reload, a closed tab or a flat battery. An entry is written before the first
 * send and removed only when the server has answered that it stored it.
 */
import { openDB, type DBSchema, type IDBPDatabase } from "idb";
import { classifyAnswer, NO_CONNECTION, type SendOutcome } from "@/lib/readings-sync";

export interface QueuedReading {
  clientId: string;
  jobId: string;
  /** Who typed it: only their own sign-in ever sends it, so the server records the right person. */
  userId: string;
  /** Order of entry on this device; the queue is sent in this order. */
  seq: number;
  /** The body of POST /api/jobs/{jobId}/readings, clientId and deviceTime included. */
  body: Record<string, unknown> & { stepId: string; phase: "pre" | "post" };
  /** What the list shows while it waits. */
  shown: { value: string; instrument: string; takenAt: string; note: string | null; correcting: boolean };
  /** A photo of the step (body: stepId, phase, clientId, takenAt, readingId or readingClientId). */
  photo?: Blob;
  /** Where it is sent when it is not a reading: the temperature records (body without a step). */
  endpoint?: "environment";
  state: "waiting" | "refused";
  reason: string | null;
  attempts: number;
  nextAttemptAt: number;
}

interface QueueSchema extends DBSchema {
  readings: { key: string; value: QueuedReading; indexes: { byJob: [string, number] } };
}

let opened: Promise<IDBPDatabase<QueueSchema>> | null = null;
function database() {
  opened ??= openDB<QueueSchema>("trammel-tablet", 1, {
    upgrade(db) {
      db.createObjectStore("readings", { keyPath: "clientId" }).createIndex("byJob", ["jobId", "seq"]);
    },
  });
  return opened;
}

/** The job's readings queued by this user, in the order they were entered. */
export async function listQueued(jobId: string, userId: string): Promise<QueuedReading[]> {
  const range = IDBKeyRange.bound([jobId, -Infinity], [jobId, Infinity]);
  return (await (await database()).getAllFromIndex("readings", "byJob", range)).filter(
    (i) => i.userId === userId,
  );
}

export async function putQueued(item: QueuedReading): Promise<void> {
  await (await database()).put("readings", item);
}

export async function removeQueued(clientId: string): Promise<void> {
  await (await database()).delete("readings", clientId);
}

/** The multipart body of a queued photo: its fields, then the image. */
function photoForm(item: QueuedReading): FormData {
  const form = new FormData();
  for (const [k, v] of Object.entries(item.body)) if (v != null && v !== "") form.set(k, String(v));
  form.set("file", item.photo!, "photo");
  return form;
}

/** One send of a queued reading or photo; never throws (no connection is an outcome like any other). */
export async function sendQueued(item: QueuedReading): Promise<SendOutcome> {
  let res: Response;
  try {
    res = item.photo
      ? await fetch(`/api/jobs/${item.jobId}/photos`, {
          method: "POST",
          body: photoForm(item),
          credentials: "same-origin",
          cache: "no-store",
        })
      : await fetch(`/api/jobs/${item.jobId}/${item.endpoint ?? "readings"}`, {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: JSON.stringify(item.body),
          credentials: "same-origin",
          cache: "no-store",
        });
  } catch {
    return { kind: "retry", reason: NO_CONNECTION };
  }
  const json = (await res.json().catch(() => null)) as {
    error?: { message?: string };
    reading?: { decision?: string };
  } | null;
  return classifyAnswer(res.status, json?.error?.message ?? null, json?.reading?.decision ?? null);
}
