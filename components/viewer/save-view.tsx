"use client";

/** "Save view for the report": the picture as shown goes to POST /api/analyses/{id}/views with an optional caption. */
import { useRouter } from "next/navigation";
import { useState } from "react";
import type { HeadErrors } from "@/geometry";
import { formatFactor } from "./factor";
import type { ViewerFitLabel } from "./palette";
import { viewPicture } from "./picture";

export function SaveView({
  captureRef,
  k,
  shown,
  other,
}: {
  captureRef: React.RefObject<(() => HTMLCanvasElement) | null>;
  k: number;
  shown: ViewerFitLabel;
  other: (ViewerFitLabel & { errors: HeadErrors }) | null;
}) {
  const router = useRouter();
  const [caption, setCaption] = useState("");
  const [state, setState] = useState<{ kind: "idle" | "saving" | "saved" | "error"; message?: string }>({
    kind: "idle",
  });
  async function save() {
    const capture = captureRef.current;
    if (!capture) return;
    setState({ kind: "saving" });
    try {
      const blob = await viewPicture(capture(), k, shown, other);
      const form = new FormData();
      form.set("factor", String(k));
      if (other) form.set("overlayAnalysisId", other.analysisId);
      if (caption.trim()) form.set("caption", caption.trim());
      form.set("file", blob, "view.png");
      const res = await fetch(`/api/analyses/${shown.analysisId}/views`, { method: "POST", body: form });
      const body = await res.json().catch(() => null);
      if (!res.ok) throw new Error(body?.error?.message ?? `The server answered ${res.status}.`);
      setState({
        kind: "saved",
        message: `Saved at ×${formatFactor(k)}. It is listed under "Saved views" below.`,
      });
      setCaption("");
      router.refresh();
    } catch (e) {
      setState({ kind: "error", message: e instanceof Error ? e.message : "The view could not be saved." });
    }
  }
  return (
    <div className="flex flex-wrap items-end gap-3 border-t border-graphite-100 pt-3">
      <label className="flex min-w-[16rem] flex-1 flex-col gap-1 text-sm font-medium text-graphite-800">
        Caption (optional)
        <input
          type="text"
          value={caption}
          maxLength={200}
          onChange={(e) => setCaption(e.target.value)}
          placeholder="e.g. Tilt axis squareness before and after shimming"
          className="min-h-touch rounded-md border border-graphite-300 px-3 font-normal"
        />
      </label>
      <button
        type="button"
        onClick={save}
        disabled={state.kind === "saving"}
        className="min-h-touch rounded-md bg-accent-600 px-4 text-sm font-semibold text-white hover:bg-accent-700 disabled:opacity-60"
      >
        {state.kind === "saving" ? "Saving…" : "Save view for the report"}
      </button>
      <p
        role="status"
        className={`w-full text-sm ${state.kind === "error" ? "text-fail-700" : "text-graphite-700"}`}
      >
        {state.message ??
          "Saves the picture as shown, with the factor printed on it, for the acceptance report."}
      </p>
    </div>
  );
}
