"use client";

import { useState } from "react";
import type { VerificationResult } from "@/lib/domain/reports";
import { VerificationResultView } from "@/components/report/verification-result";

export function VerifyUpload() {
  const [result, setResult] = useState<VerificationResult | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function check(file: File) {
    setBusy(true);
    setError(null);
    setResult(null);
    const body = new FormData();
    body.set("file", file);
    const res = await fetch("/api/verify", { method: "POST", body });
    const json = await res.json();
    setBusy(false);
    if (!res.ok) setError(json.error?.message ?? "The file could not be checked.");
    else setResult(json as VerificationResult);
  }

  return (
    <div className="space-y-4">
      <label
        className="flex min-h-32 cursor-pointer flex-col items-center justify-center gap-2 rounded-card border-2 border-dashed border-graphite-300 bg-white p-6 text-center hover:border-accent-500"
        onDragOver={(e) => e.preventDefault()}
        onDrop={(e) => {
          e.preventDefault();
          const f = e.dataTransfer.files[0];
          if (f) void check(f);
        }}
      >
        <span className="font-semibold">Choose the report PDF, or drop it here</span>
        <span className="text-sm text-graphite-600">{busy ? "Checking…" : "PDF, up to 20 MB"}</span>
        <input
          type="file"
          accept="application/pdf,.pdf"
          className="sr-only"
          aria-label="Report PDF"
          onChange={(e) => {
            const f = e.target.files?.[0];
            if (f) void check(f);
          }}
        />
      </label>
      {error ? (
        <p role="alert" className="rounded-card border border-fail-600/40 bg-fail-50 p-3 text-fail-700">
          {error}
        </p>
      ) : null}
      {result ? <VerificationResultView result={result} /> : null}
    </div>
  );
}
