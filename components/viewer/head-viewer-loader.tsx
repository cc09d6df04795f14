"use client";

/**
 * Loads the 3D view in the browser only (three.js needs a DOM and WebGL), as its own chunk after
 * the page has painted. Until then a placeholder of the scene's size holds its place, with its
 * text at the top so it shows even when the box starts low on the screen.
 */
import dynamic from "next/dynamic";

export const HeadViewerLoader = dynamic(() => import("./head-viewer").then((m) => m.HeadViewer), {
  ssr: false,
  loading: () => (
    <div
      data-testid="head-viewer-placeholder"
      className="h-[30rem] rounded-card border border-graphite-200 bg-graphite-50 p-6 text-sm text-graphite-600"
    >
      <p role="status">Loading the 3D view…</p>
    </div>
  ),
});
