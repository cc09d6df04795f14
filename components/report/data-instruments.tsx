"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { Card } from "@/components/ui/card";
import { ActionNotice } from "@/components/ui/button";
import type { ActionResult } from "@/lib/actions";
import { DATA_INSTRUMENT_USE_LABELS, DATA_INSTRUMENT_USES } from "@/lib/domain/instruments";

/**
 * The instruments behind the job's measurement data — touch probe, reference sphere (with its
 * calibrated diameter), CMM — listed, and added from the register by the people who measured.
 * The report prints each with its calibration.
 */
export function DataInstruments({
  jobId,
  recorded,
  register,
  run,
}: {
  jobId: string;
  recorded: ReadonlyArray<{ id: string; use: string; serial: string; kind: string; size: string | null }>;
  /** Instruments that may be added; null when the actor may not add. */
  register: ReadonlyArray<{ id: string; label: string }> | null;
  run: (data: Record<string, string>) => Promise<ActionResult<unknown>>;
}) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [notice, setNotice] = useState<{ ok: boolean; text: string } | null>(null);
  const label = (u: string) => DATA_INSTRUMENT_USE_LABELS[u as keyof typeof DATA_INSTRUMENT_USE_LABELS] ?? u;
  return (
    <Card title="Instruments behind the data">
      {recorded.length ? (
        <ul className="mb-3 space-y-1 text-sm">
          {recorded.map((r) => (
            <li key={r.id}>
              <span className="font-medium">{label(r.use)}:</span> {r.kind}{" "}
              <span className="num">{r.serial}</span>
              {r.size ? ` (calibrated diameter ${r.size})` : ""}
            </li>
          ))}
        </ul>
      ) : (
        <p className="mb-3 text-sm text-graphite-600">
          None recorded yet. Add the touch probe, the reference sphere and any CMM used for the data, so the
          report traces their calibration.
        </p>
      )}
      {register ? (
        <form
          aria-label="Add an instrument used for the data"
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            const f = new FormData(e.currentTarget);
            const el = e.currentTarget;
            start(async () => {
              const r = await run({
                jobId,
                instrumentId: String(f.get("instrumentId") ?? ""),
                use: String(f.get("use") ?? ""),
              });
              if (r.ok) {
                el.reset();
                setNotice({ ok: true, text: "Recorded." });
                router.refresh();
              } else {
                const fe = r.fieldErrors ? Object.values(r.fieldErrors).flat().join(" ") : "";
                setNotice({ ok: false, text: `${r.message}${fe ? ` ${fe}` : ""}` });
              }
            });
          }}
        >
          <label className="block space-y-1 text-sm">
            <span className="font-medium">Used as</span>
            <select
              name="use"
              required
              className="block min-h-touch w-full rounded-lg border border-graphite-300 px-2"
            >
              {DATA_INSTRUMENT_USES.map((u) => (
                <option key={u} value={u}>
                  {label(u)}
                </option>
              ))}
            </select>
          </label>
          <label className="block space-y-1 text-sm">
            <span className="font-medium">Instrument</span>
            <select
              name="instrumentId"
              required
              className="block min-h-touch w-full rounded-lg border border-graphite-300 px-2"
            >
              {register.map((i) => (
                <option key={i.id} value={i.id}>
                  {i.label}
                </option>
              ))}
            </select>
          </label>
          <button
            type="submit"
            disabled={pending}
            className="min-h-touch rounded-lg bg-graphite-800 px-4 font-semibold text-white disabled:opacity-60"
          >
            {pending ? "Saving…" : "Add instrument"}
          </button>
          {notice ? <ActionNotice ok={notice.ok}>{notice.text}</ActionNotice> : null}
        </form>
      ) : null}
    </Card>
  );
}
