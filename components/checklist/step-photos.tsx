"use client";

import { useEffect, useRef, useState } from "react";
import { PHASE_LABELS } from "@/lib/domain/datasets";
import { LocalTime } from "@/components/readings/local-time";
import { useReadingQueue } from "@/components/readings/queue-provider";
import type { QueuedReading } from "@/lib/readings-queue";
import { newClientId } from "@/lib/readings-sync";

/** Largest photo the tablet sends (the server refuses more): a full-size tablet JPEG fits. */
const MAX_BYTES = 15 * 1024 * 1024;

export interface PanelPhoto {
  id: string;
  url: string;
  thumbUrl: string;
  readingId: string | null;
  phase: "pre" | "post";
  takenAt: string;
  uploadedBy: string | null;
}

/**
 * The step's photos (thumbnails opening the full image) and the button that takes one with the
 * tablet's camera or picks a file. A photo goes into the same queue as the readings, after the
 * reading it belongs to, so it is kept on the tablet while offline and sent in order.
 */
export function StepPhotos({
  jobId,
  stepId,
  position,
  photos,
  required,
  canWrite,
  phase,
  attachTo,
}: {
  jobId: string;
  stepId: string;
  position: number;
  photos: PanelPhoto[];
  required: boolean;
  canWrite: boolean;
  phase: "pre" | "post";
  /** The reading a new photo shows: the step's latest, stored (id) or still on this tablet (clientId). */
  attachTo: { readingId: string } | { readingClientId: string } | null;
}) {
  const queue = useReadingQueue();
  const queued = queue.items.filter((q) => q.photo && q.body.stepId === stepId);
  const waiting = queued.length;
  const input = useRef<HTMLInputElement>(null);
  const [problem, setProblem] = useState<string | null>(null);

  const onFile = async (file: File | undefined) => {
    setProblem(null);
    if (!file) return;
    if (file.size > MAX_BYTES) {
      setProblem(`The photo is ${(file.size / 1048576).toFixed(1)} MiB; the limit is 15 MiB.`);
      return;
    }
    if (file.type && !file.type.startsWith("image/")) {
      setProblem("That file is not a photo.");
      return;
    }
    const clientId = newClientId();
    const takenAt = new Date(file.lastModified || Date.now());
    const at = (takenAt.getTime() > Date.now() ? new Date() : takenAt).toISOString();
    const sent = await queue.enqueue({
      clientId,
      jobId,
      body: { stepId, phase, clientId, takenAt: at, ...(attachTo ?? {}) },
      shown: { value: "Photo", instrument: "—", takenAt: at, note: null, correcting: false },
      photo: file,
    });
    if (sent?.kind === "refused") {
      await queue.discard(clientId);
      setProblem(sent.reason);
    }
    if (input.current) input.current.value = "";
  };

  const none = photos.length === 0 && waiting === 0;
  return (
    <section aria-label={`Photos of step ${position}`} className="space-y-2">
      <div className="flex flex-wrap items-center gap-3">
        <h4 className="text-sm font-semibold text-graphite-800">Photos</h4>
        {required ? (
          <span
            className={`rounded px-2 py-0.5 text-xs font-semibold ${none ? "bg-fail-50 text-fail-700" : "bg-graphite-100 text-graphite-700"}`}
          >
            {none ? "Photo required: none yet" : "Photo required"}
          </span>
        ) : null}
        {canWrite ? (
          <label className="ml-auto flex min-h-touch cursor-pointer items-center rounded-md border border-graphite-300 bg-white px-4 text-sm font-medium hover:bg-graphite-100">
            Add a photo
            <input
              ref={input}
              type="file"
              accept="image/*"
              capture="environment"
              className="sr-only"
              data-testid={`photo-input-${position}`}
              onChange={(e) => void onFile(e.target.files?.[0])}
            />
          </label>
        ) : null}
      </div>
      {canWrite ? (
        <p className="text-xs text-graphite-600">
          Take photos with the spindle stopped and the axes at rest, never reaching in while the machine can
          move; the machine builder&apos;s manual and local rules come first.
        </p>
      ) : null}
      {problem ? (
        <p role="alert" className="text-sm text-fail-700">
          Photo not kept: {problem}
        </p>
      ) : null}
      {queued.length ? (
        <ul className="flex flex-wrap gap-3" data-testid={`queued-photos-${position}`}>
          {queued.map((q) => (
            <QueuedPhoto key={q.clientId} item={q} position={position} />
          ))}
        </ul>
      ) : null}
      {photos.length ? (
        <ul className="flex flex-wrap gap-3" data-testid={`photos-${position}`}>
          {photos.map((p) => (
            <li key={p.id} className="w-36 text-xs text-graphite-600">
              <a href={p.url} target="_blank" rel="noopener" className="block">
                {/* eslint-disable-next-line @next/next/no-img-element -- a stored, access-checked JPEG, not a static asset */}
                <img
                  src={p.thumbUrl}
                  alt={`Photo of step ${position}, ${PHASE_LABELS[p.phase].toLowerCase()}`}
                  className="h-24 w-36 rounded border border-graphite-200 bg-graphite-100 object-cover"
                  loading="lazy"
                />
              </a>
              <span className="mt-1 block">
                {PHASE_LABELS[p.phase]}
                {p.readingId ? ", with the reading" : ""} · <LocalTime at={p.takenAt} />
              </span>
            </li>
          ))}
        </ul>
      ) : !waiting ? (
        <p className="text-xs text-graphite-500">No photos yet.</p>
      ) : null}
    </section>
  );
}

/** A photo still on this tablet (offline, or waiting to be sent): drawn from its own file. */
function QueuedPhoto({ item, position }: { item: QueuedReading; position: number }) {
  const img = useRef<HTMLImageElement>(null);
  useEffect(() => {
    const url = URL.createObjectURL(item.photo!);
    if (img.current) img.current.src = url;
    return () => URL.revokeObjectURL(url);
  }, [item.photo]);
  return (
    <li className="w-36 text-xs text-graphite-600">
      {/* eslint-disable-next-line @next/next/no-img-element -- a local file on the tablet, not yet stored */}
      <img
        ref={img}
        alt={`Photo of step ${position}, ${PHASE_LABELS[item.body.phase].toLowerCase()}, not yet sent`}
        className="h-24 w-36 rounded border border-dashed border-graphite-400 bg-graphite-100 object-cover"
      />
      <span className="mt-1 block">
        {PHASE_LABELS[item.body.phase]} ·{" "}
        {item.state === "refused" ? `refused: ${item.reason ?? ""}` : "on this tablet, not yet sent"}
      </span>
    </li>
  );
}
