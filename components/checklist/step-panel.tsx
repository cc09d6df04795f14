"use client";

import { useMemo, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { EntryForm, type EntryValues, type PanelInstrument } from "@/components/checklist/entry-form";
import {
  ReadingsTable,
  type CorrectionTarget,
  type PanelReading,
} from "@/components/checklist/readings-table";
import { useReadingQueue } from "@/components/readings/queue-provider";
import {
  deriveReading,
  DECISION_LABELS,
  entryProblem,
  expandedUncertainty,
  judge,
  resolutionDecimals,
  type StepDecision,
  type StepRule,
} from "@/lib/checklist";
import type { QueuedReading } from "@/lib/readings-queue";
import { newClientId } from "@/lib/readings-sync";
import { displayUnit, fromCanonical, UNIT_SYMBOL, type UnitSystem } from "@/lib/units";

export type { PanelInstrument } from "@/components/checklist/entry-form";
export type { PanelReading } from "@/components/checklist/readings-table";

export interface PanelStep extends StepRule {
  id: string;
  position: number;
  title: string;
  quantity: string;
}

/** This tablet's time now as "YYYY-MM-DD HH:MM" (24-hour), the one format the app writes times in. */
function localNow(): string {
  const d = new Date();
  d.setMinutes(d.getMinutes() - d.getTimezoneOffset());
  return d.toISOString().slice(0, 16).replace("T", " ");
}

/** "YYYY-MM-DD HH:MM" in this tablet's zone → the instant, or null when it is not such a time. */
function parseLocal(text: string): Date | null {
  const t = text.trim();
  if (!/^\d{4}-\d{2}-\d{2}[ T]\d{2}:\d{2}$/.test(t)) return null;
  const d = new Date(t.replace(" ", "T"));
  return Number.isNaN(d.getTime()) ? null : d;
}

const num = (s: string) => Number(String(s).trim().replace(",", "."));

/**
 * One checklist step on the tablet: its readings (stored and still on this tablet) and the entry
 * form with live checks. A save goes into the tablet's queue first and is then sent; a value the
 * server refuses stays in the form with the reason, and one that cannot be sent yet waits in the
 * queue, so nothing typed is dropped.
 */
export function StepPanel({
  jobId,
  step,
  readings,
  unitSystem,
  instruments,
  canWrite,
  today,
}: {
  jobId: string;
  step: PanelStep;
  readings: PanelReading[];
  unitSystem: UnitSystem;
  instruments: PanelInstrument[];
  canWrite: boolean;
  today: string;
}) {
  const queue = useReadingQueue();
  const queued = queue.items.filter((q) => q.body.stepId === step.id);
  const [pending, setPending] = useState(false);
  const [correcting, setCorrecting] = useState<CorrectionTarget | null>(null);
  const [replacing, setReplacing] = useState<string | null>(null);
  const [refusal, setRefusal] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const isAngleFromReading = step.derivation === "angle_over_distance";
  const entryUnit = displayUnit(isAngleFromReading ? "length" : step.quantityKind, unitSystem);
  const travelUnit = unitSystem === "inch" ? "in" : "mm";
  const defaultTravel =
    step.distanceMm != null ? (unitSystem === "inch" ? step.distanceMm / 25.4 : step.distanceMm) : null;
  const readsKind = isAngleFromReading ? "length" : step.quantityKind;
  const choosable = instruments.filter((i) => i.quantityKind === readsKind);
  const usable = choosable.filter((i) => i.calibrationDueOn >= today);
  // The instrument last used on this step, else the only usable one: never a guess between kinds.
  const lastUsed = [...readings].reverse().find((r) => usable.some((i) => i.id === r.instrumentId));
  const defaultInstrument = lastUsed?.instrumentId ?? (usable.length === 1 ? usable[0]!.id : "");
  const hasPre = readings.some((r) => r.phase === "pre" && !r.supersededById);

  const form = useForm<EntryValues>({
    defaultValues: {
      phase: hasPre ? "post" : "pre",
      value: "",
      travel: defaultTravel != null ? String(Number(defaultTravel.toFixed(4))) : "",
      instrumentId: defaultInstrument,
      note: "",
      takenAt: localNow(),
    },
  });
  const [value, travel, instrumentId, takenAtText] = useWatch({
    control: form.control,
    name: ["value", "travel", "instrumentId", "takenAt"],
  });
  const takenAt = parseLocal(takenAtText);
  const instrument = choosable.find((i) => i.id === instrumentId);

  const problem = useMemo(() => {
    const decimals = instrument
      ? resolutionDecimals(fromCanonical(instrument.resolution, entryUnit))
      : Infinity;
    return entryProblem(String(value), decimals, instrument?.serial);
  }, [value, instrument, entryUnit]);

  const live = useMemo(() => {
    if (problem || String(value).trim() === "") return null;
    try {
      const t = num(travel);
      const travelMm =
        isAngleFromReading && Number.isFinite(t) && t > 0 ? (travelUnit === "in" ? t * 25.4 : t) : null;
      const d = deriveReading(step, { value: num(value), unit: entryUnit, travelMm });
      const U = expandedUncertainty(step, instrument?.standardUncertainty);
      return { value: d.value, decision: judge(step, d.value, U), error: null as string | null };
    } catch (err) {
      const error = err instanceof Error ? err.message : "Not a usable value.";
      return { value: NaN, decision: "not_measured" as StepDecision, error };
    }
  }, [problem, value, travel, instrument, step, entryUnit, isAngleFromReading, travelUnit]);

  const blocked = !instrument
    ? "Choose the instrument used."
    : !takenAt
      ? "Write the time taken as YYYY-MM-DD HH:MM (24-hour)."
      : (problem ?? live?.error ?? (live ? null : "Enter the value read."));

  const onSubmit = form.handleSubmit(async (f) => {
    if (blocked || pending) return;
    setRefusal(null);
    setSaved(null);
    setPending(true);
    const clientId = newClientId();
    const phase = correcting ? correcting.phase : f.phase;
    const body = {
      stepId: step.id,
      phase,
      value: f.value.trim().replace(",", "."),
      unit: entryUnit,
      ...(isAngleFromReading ? { travel: f.travel, travelUnit } : {}),
      instrumentId: f.instrumentId,
      note: f.note,
      takenAt: (parseLocal(f.takenAt) ?? new Date()).toISOString(),
      clientId,
      deviceTime: new Date().toISOString(),
      ...(correcting?.kind === "stored" ? { supersedesId: correcting.id } : {}),
      ...(correcting?.kind === "queued" ? { supersedesClientId: correcting.clientId } : {}),
    };
    const shown = {
      value: `${body.value} ${UNIT_SYMBOL[entryUnit]}`,
      instrument: instrument!.serial,
      takenAt: body.takenAt,
      note: f.note.trim() || null,
      correcting: Boolean(correcting),
    };
    const outcome = await queue.enqueue({ clientId, jobId, body, shown });
    setPending(false);
    if (outcome?.kind === "refused") {
      // Refused while the installer is here: the value stays in the form with the reason.
      await queue.discard(clientId);
      setRefusal(outcome.reason);
      return;
    }
    if (replacing) await queue.discard(replacing);
    const what = correcting ? "Correction" : "Reading";
    setSaved(
      outcome?.kind === "sent"
        ? `${what} saved: ${DECISION_LABELS[(outcome.decision ?? "not_measured") as StepDecision].toLowerCase()}.`
        : `${what} kept on this tablet, waiting to send. ${outcome && "reason" in outcome ? outcome.reason : "Earlier readings go first."}`,
    );
    setCorrecting(null);
    setReplacing(null);
    form.reset({ ...f, value: "", note: "", takenAt: localNow() });
  });

  const edit = (q: QueuedReading) => {
    const b = q.body as Record<string, string>;
    form.reset({
      phase: q.body.phase,
      value: b.value ?? "",
      travel: b.travel ?? form.getValues("travel"),
      instrumentId: b.instrumentId ?? "",
      note: b.note ?? "",
      takenAt: localNow(),
    });
    setReplacing(q.clientId);
    setCorrecting(null);
    setRefusal(q.reason);
    setSaved(null);
  };

  return (
    <div className="space-y-4">
      <ReadingsTable
        readings={readings}
        queued={queued}
        step={step}
        position={step.position}
        unitSystem={unitSystem}
        canWrite={canWrite}
        onCorrect={(t) => {
          setCorrecting(t);
          form.setValue("phase", t.phase);
          setSaved(null);
        }}
        onEdit={edit}
        onDiscard={(q) => {
          if (window.confirm(`Discard the reading ${q.shown.value}? It has not reached the server.`))
            void queue.discard(q.clientId);
        }}
      />
      {canWrite ? (
        <EntryForm
          form={form}
          onSubmit={onSubmit}
          step={step}
          entryUnit={entryUnit}
          travelUnit={travelUnit}
          instruments={choosable}
          today={today}
          correcting={correcting}
          onCancelCorrection={() => setCorrecting(null)}
          problem={problem}
          live={live}
          blocked={blocked}
          pending={pending}
          refusal={refusal}
          saved={saved}
          unitSystem={unitSystem}
        />
      ) : null}
    </div>
  );
}
