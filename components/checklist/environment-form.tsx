"use client";

import { useState } from "react";
import { closedSetOptions, OptionList } from "@/components/ui/field";
import { PHASE_LABELS, PHASES, type Phase } from "@/lib/domain/datasets";
import { LocalTime } from "@/components/readings/local-time";
import { useReadingQueue } from "@/components/readings/queue-provider";
import { newClientId } from "@/lib/readings-sync";
import { environmentCreateSchema } from "@/lib/validations/environment";

export interface PanelEnvironment {
  id: string;
  phase: "pre" | "post";
  airTempC: number | null;
  machineTempC: number | null;
  takenAt: string;
  recordedBy: string | null;
}

const fieldCls =
  "min-h-touch w-full rounded-md border border-graphite-300 bg-white px-3 text-base focus:border-accent-500 focus:outline-none focus:ring-2 focus:ring-accent-500/40";
const inputCls = `${fieldCls} text-right`;
function TemperatureInput({
  label,
  value,
  onChange,
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
}) {
  return (
    <label className="text-sm font-medium text-graphite-700">
      {label}
      <input
        inputMode="decimal"
        autoComplete="off"
        className={`${inputCls} num mt-1`}
        value={value}
        onChange={(e) => onChange(e.target.value)}
      />
    </label>
  );
}

const deg = (t: number | null) => (t == null ? "—" : `${t.toFixed(1)} °C`);

/**
 * The air and machine temperature at the machine, entered beside the readings and sent through
 * the same queue (kept on the tablet while offline). The latest records are listed.
 */
export function EnvironmentPanel({
  jobId,
  records,
  canWrite,
}: {
  jobId: string;
  records: PanelEnvironment[];
  canWrite: boolean;
}) {
  const queue = useReadingQueue();
  const waiting = queue.items.filter((q) => q.endpoint === "environment");
  const [air, setAir] = useState("");
  const [machine, setMachine] = useState("");
  const [phase, setPhase] = useState<"pre" | "post">("pre");
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);

  const save = async (e: React.FormEvent) => {
    e.preventDefault();
    const clientId = newClientId();
    const takenAt = new Date().toISOString();
    const parsed = environmentCreateSchema.safeParse({
      phase,
      airTempC: air,
      machineTempC: machine,
      clientId,
      takenAt,
    });
    if (!parsed.success) {
      setMessage({ ok: false, text: parsed.error.issues[0]!.message });
      return;
    }
    const body = { stepId: "", phase, airTempC: air, machineTempC: machine, clientId, takenAt };
    const shown = `${air ? `air ${air} °C` : ""}${air && machine ? ", " : ""}${machine ? `machine ${machine} °C` : ""}`;
    const sent = await queue.enqueue({
      clientId,
      jobId,
      body,
      endpoint: "environment",
      shown: { value: shown, instrument: "—", takenAt, note: null, correcting: false },
    });
    if (sent?.kind === "refused") {
      await queue.discard(clientId);
      setMessage({ ok: false, text: `Not saved: ${sent.reason}` });
      return;
    }
    setMessage({
      ok: true,
      text:
        sent?.kind === "sent" ? "Temperatures saved." : "Temperatures kept on this tablet, waiting to send.",
    });
    setAir("");
    setMachine("");
  };

  const latest = records[0];
  return (
    <section
      aria-label="Temperatures at the machine"
      className="rounded-card border border-graphite-200 bg-white p-4"
      data-testid="environment"
    >
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-base font-semibold">Temperatures at the machine</h3>
        <p className="text-sm text-graphite-600">
          {latest ? (
            <>
              Latest: air <span className="num">{deg(latest.airTempC)}</span>, machine{" "}
              <span className="num">{deg(latest.machineTempC)}</span> · <LocalTime at={latest.takenAt} />
            </>
          ) : (
            "None recorded yet. Readings are best taken once the machine and the air have settled."
          )}
          {waiting.some((q) => q.state === "waiting")
            ? ` · ${waiting.filter((q) => q.state === "waiting").length} waiting to send`
            : ""}
        </p>
      </div>
      {canWrite ? (
        <form onSubmit={save} className="mt-3 grid grid-cols-2 items-end gap-3 lg:grid-cols-4" noValidate>
          <TemperatureInput label="Air (°C)" value={air} onChange={setAir} />
          <TemperatureInput label="Machine (°C)" value={machine} onChange={setMachine} />
          <label className="text-sm font-medium text-graphite-700">
            Phase
            <select
              className={`${fieldCls} mt-1`}
              value={phase}
              onChange={(e) => setPhase(e.target.value as Phase)}
            >
              <OptionList options={closedSetOptions(PHASES, PHASE_LABELS)} />
            </select>
          </label>
          <button
            type="submit"
            className="min-h-touch rounded-md border border-graphite-300 bg-white px-4 font-semibold hover:bg-graphite-100"
          >
            Save temperatures
          </button>
        </form>
      ) : null}
      {waiting.some((q) => q.state === "refused") ? (
        <ul className="mt-2 space-y-1 text-sm">
          {waiting
            .filter((q) => q.state === "refused")
            .map((q) => (
              <li key={q.clientId} className="flex flex-wrap items-center gap-2 text-fail-700" role="alert">
                Refused: {q.shown.value}. {q.reason}
                <button
                  type="button"
                  className="min-h-touch rounded-md border border-graphite-300 bg-white px-3 font-medium text-graphite-800"
                  onClick={() => void queue.discard(q.clientId)}
                >
                  Discard
                </button>
              </li>
            ))}
        </ul>
      ) : null}
      {message ? (
        <p
          role={message.ok ? "status" : "alert"}
          className={`mt-2 text-sm ${message.ok ? "text-pass-700" : "text-fail-700"}`}
        >
          {message.text}
        </p>
      ) : null}
    </section>
  );
}
