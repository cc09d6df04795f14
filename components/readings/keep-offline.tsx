"use client";

import { useEffect, useState } from "react";

/**
 * Registers the service worker (public/sw.js) and asks it to keep this job on the tablet: its
 * checklist and comparison pages, its JSON and readings, its photos' thumbnails, and the scripts
 * this page has loaded.
 * Says so once the worker has kept them, so the installer knows the job works without signal.
 */
export function KeepJobOffline({ jobId, photoThumbs = [] }: { jobId: string; photoThumbs?: string[] }) {
  const [kept, setKept] = useState(false);
  // The thumbnails as one value, so a new photo (not a new array) asks for the job to be kept again.
  const thumbs = photoThumbs.join(" ");
  useEffect(() => {
    if (!("serviceWorker" in navigator)) return;
    let cancelled = false;
    const onMessage = (e: MessageEvent) => {
      if (e.data?.type === "job-kept" && !cancelled) setKept(true);
    };
    navigator.serviceWorker.addEventListener("message", onMessage);
    void (async () => {
      try {
        await navigator.serviceWorker.register("/sw.js", { scope: "/" });
        const reg = await navigator.serviceWorker.ready;
        if (cancelled || !reg.active) return;
        const assets = performance
          .getEntriesByType("resource")
          .map((e) => e.name)
          .filter((u) => u.startsWith(`${location.origin}/_next/static/`));
        reg.active.postMessage({
          type: "keep-job",
          urls: [
            `/jobs/${jobId}/checklist`,
            `/jobs/${jobId}/compare`,
            `/api/jobs/${jobId}`,
            `/api/jobs/${jobId}/readings`,
            ...(thumbs ? thumbs.split(" ") : []),
            ...assets,
          ],
        });
      } catch {
        // No service worker (private window, old browser): the queue in IndexedDB still keeps readings.
      }
    })();
    return () => {
      cancelled = true;
      navigator.serviceWorker.removeEventListener("message", onMessage);
    };
  }, [jobId, thumbs]);
  return kept ? (
    <p className="text-sm text-graphite-600" data-testid="offline-ready">
      This job is kept on this tablet: it opens without signal.
    </p>
  ) : null;
}
