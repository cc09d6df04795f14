"use client";

/** Loads the 3D view in the browser only (three.js needs a DOM and WebGL). */
import dynamic from "next/dynamic";

export const HeadViewerLoader = dynamic(() => import("./head-viewer").then((m) => m.HeadViewer), {
  ssr: false,
  loading: () => (
    <div className="flex h-[30rem] items-center justify-center rounded-card border border-graphite-200 bg-graphite-50 text-sm text-graphite-600">
      Loading the 3D view…
    </div>
  ),
});
