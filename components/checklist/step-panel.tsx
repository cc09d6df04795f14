"use client";

import { useMemo, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { EntryForm, type EntryValues, type PanelInstrument } from "@/components/checklist/entry-form";
import {
  ReadingsTable,
  type CorrectionTarget,
  type PanelReading,
} from "@/components/checklist/readings-table";
import { StepPhotos, type PanelPhoto } from "@/components/checklist/step-photos";
import { useReadingQueue } from "@/components/readings/queue-provider";
import {
  DECISION_LABELS,
  entryProblem,
  expandedUncertainty,
  judge,
  resolutionDecimals,
  type StepDecision,
} from "@/lib/checklist";
import { needsInstrument, rangeProblem, shownValue, stepEntry, type KindStep } from "@/lib/step-kinds";
import type { QueuedReading } from "@/lib/readings-queue";
import { newClientId } from "@/lib/readings-sync";
import { displayUnit, fromCanonical, type UnitSystem } from "@/lib/units";

export type { PanelInstrument } from "@/components/checklist/entry-form";
export type { PanelReading } from "@/components/checklist/readings-table";

export interface PanelStep extends KindStep {
  id: string;
  photoRequired: boolean;
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
  photos,
  unitSystem,
  instruments,
  canWrite,
  today,
}: {
  jobId: string;
  step: PanelStep;
  readings: PanelReading[];
  photos: PanelPhoto[];
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
  const kind = step.derivation;
  const withInstrument = needsInstrument(kind);
  const pointNames = useMemo(() => step.points ?? [], [step.points]);
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
      answer: "",
      pointValues: pointNames.map(() => ""),
      text: "",
      travel: defaultTravel != null ? String(Number(defaultTravel.toFixed(4))) : "",
      instrumentId: defaultInstrument,
      note: "",
      takenAt: localNow(),
    },
  });
  const [value, travel, instrumentId, takenAtText, answer, pointValues, text] = useWatch({
    control: form.control,
    name: ["value", "travel", "instrumentId", "takenAt", "answer", "pointValues", "text"],
  });
  const takenAt = parseLocal(takenAtText);
  const instrument = withInstrument ? choosable.find((i) => i.id === instrumentId) : undefined;
  const pointsTyped = useMemo(
    () => Object.fromEntries(pointNames.map((p, i) => [p, String(pointValues?.[i] ?? "")])),
    [pointNames, pointValues],
  );

  // What is wrong as it is typed: not a number, or finer than the instrument reads.
  const decimals = instrument
    ? resolutionDecimals(fromCanonical(instrument.resolution, entryUnit))
    : Infinity;
  const pointProblems = useMemo(() => {
    const out: Record<string, string> = {};
    if (kind !== "multi_point") return out;
    for (const p of pointNames) {
      const m = entryProblem(pointsTyped[p] ?? "", decimals, instrument?.serial);
      if (m) out[p] = m;
    }
    return out;
  }, [kind, pointNames, pointsTyped, decimals, instrument]);
  const problem = useMemo(() => {
    if (kind === "check" || kind === "note") return null;
    if (kind === "multi_point") {
      const first = pointNames.find((p) => pointProblems[p]);
      return first ? `At ${first}: ${pointProblems[first]}` : null;
    }
    return entryProblem(String(value), kind === "record" ? Infinity : decimals, instrument?.serial);
  }, [kind, pointNames, pointProblems, value, decimals, instrument]);

  // The same per-kind check the server makes, so what the tablet accepts the server stores.
  const outcome = useMemo(() => {
    const t = Number(String(travel).trim().replace(",", "."));
    const travelMm =
      isAngleFromReading && Number.isFinite(t) && t > 0 ? (travelUnit === "in" ? t * 25.4 : t) : null;
    return stepEntry(step, { value, unit: entryUnit, travelMm, answer, points: pointsTyped, text });
  }, [step, value, entryUnit, travel, isAngleFromReading, travelUnit, answer, pointsTyped, text]);

  const outside =
    outcome.ok && instrument
      ? rangeProblem(
          instrument,
          outcome.stored.instrumentReadings,
          kind === "multi_point" ? pointNames : null,
        )
      : null;
  const live = useMemo(() => {
    if (problem || !outcome.ok) return null;
    const U = expandedUncertainty(step, instrument?.standardUncertainty);
    const v = outcome.stored.value;
    return { value: v, decision: judge(step, v, U), error: null as string | null };
  }, [problem, outcome, step, instrument]);

  const blocked =
    withInstrument && !instrument
      ? "Choose the instrument used."
      : !takenAt
        ? "Write the time taken as YYYY-MM-DD HH:MM (24-hour)."
        : (problem ?? outside?.message ?? (outcome.ok ? null : outcome.problems[0]!.message));

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
      unit: entryUnit,
      ...(kind === "check" ? { answer: f.answer } : {}),
      ...(kind === "note" || kind === "record" ? { text: f.text } : {}),
      ...(kind === "multi_point" ? { points: pointsTyped } : {}),
      ...(kind !== "check" && kind !== "note" && kind !== "multi_point"
        ? { value: f.value.trim().replace(",", ".") }
        : {}),
      ...(isAngleFromReading ? { travel: f.travel, travelUnit } : {}),
      ...(withInstrument ? { instrumentId: f.instrumentId } : {}),
      note: f.note,
      takenAt: (parseLocal(f.takenAt) ?? new Date()).toISOString(),
      clientId,
      deviceTime: new Date().toISOString(),
      ...(correcting?.kind === "stored" ? { supersedesId: correcting.id } : {}),
      ...(correcting?.kind === "queued" ? { supersedesClientId: correcting.clientId } : {}),
    };
    const shown = {
      value: outcome.ok ? shownValue(step, outcome.stored, unitSystem) : "",
      instrument: instrument?.serial ?? "—",
      takenAt: body.takenAt,
      note: f.note.trim() || null,
      correcting: Boolean(correcting),
    };
    const sent = await queue.enqueue({ clientId, jobId, body, shown });
    setPending(false);
    if (sent?.kind === "refused") {
      // Refused while the installer is here: the value stays in the form with the reason.
      await queue.discard(clientId);
      setRefusal(sent.reason);
      return;
    }
    if (replacing) await queue.discard(replacing);
    const what = correcting ? "Correction" : "Reading";
    setSaved(
      sent?.kind === "sent"
        ? `${what} saved: ${DECISION_LABELS[(sent.decision ?? "not_measured") as StepDecision].toLowerCase()}.`
        : `${what} kept on this tablet, waiting to send. ${sent && "reason" in sent ? sent.reason : "Earlier readings go first."}`,
    );
    setCorrecting(null);
    setReplacing(null);
    form.reset({
      ...f,
      value: "",
      answer: "",
      text: "",
      pointValues: pointNames.map(() => ""),
      note: "",
      takenAt: localNow(),
    });
  });

  const edit = (q: QueuedReading) => {
    const b = q.body as Record<string, string>;
    const pts = (q.body.points ?? {}) as Record<string, string>;
    form.reset({
      phase: q.body.phase,
      value: b.value ?? "",
      answer: b.answer === "yes" || b.answer === "no" ? b.answer : "",
      text: b.text ?? "",
      pointValues: pointNames.map((p) => String(pts[p] ?? "")),
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

  // A new photo shows the step's latest reading: one still on this tablet, else the latest stored.
  const lastQueued = [...queued].reverse().find((q) => !q.photo);
  const lastStored = [...readings].reverse().find((r) => !r.supersededById);
  const attachTo = lastQueued
    ? { readingClientId: lastQueued.clientId }
    : lastStored
      ? { readingId: lastStored.id }
      : null;
  const photoPhase = lastQueued?.body.phase ?? lastStored?.phase ?? form.getValues("phase");

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
      <StepPhotos
        jobId={jobId}
        stepId={step.id}
        position={step.position}
        photos={photos}
        required={step.photoRequired}
        canWrite={canWrite}
        phase={photoPhase}
        attachTo={attachTo}
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
          pointProblems={pointProblems}
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
