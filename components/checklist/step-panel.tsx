"use client";

import { useMemo, useState } from "react";
import { useForm } from "react-hook-form";
import { EntryForm, type PanelInstrument } from "@/components/checklist/entry-form";
import {
  ReadingsTable,
  type CorrectionTarget,
  type PanelReading,
} from "@/components/checklist/readings-table";
import { StepPhotos, type PanelPhoto } from "@/components/checklist/step-photos";
import { useEntryChecks } from "@/components/checklist/use-entry-checks";
import { useReadingQueue } from "@/components/readings/queue-provider";
import { DECISION_LABELS, type StepDecision } from "@/lib/checklist";
import {
  clearedEntry,
  entryFromQueued,
  localNow,
  readingRequestBody,
  type EntryValues,
} from "@/lib/reading-entry";
import { needsInstrument, shownValue, type KindStep } from "@/lib/step-kinds";
import type { QueuedReading } from "@/lib/readings-queue";
import { newClientId } from "@/lib/readings-sync";
import { displayUnit, type UnitSystem } from "@/lib/units";

export type { PanelInstrument } from "@/components/checklist/entry-form";
export type { PanelReading } from "@/components/checklist/readings-table";

export interface PanelStep extends KindStep {
  id: string;
  photoRequired: boolean;
  position: number;
  title: string;
  quantity: string;
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
  const checks = useEntryChecks({
    form,
    step,
    instruments: choosable,
    withInstrument,
    entryUnit,
    travelUnit,
  });
  const { instrument, pointsTyped, outcome, blocked } = checks;

  const onSubmit = form.handleSubmit(async (f) => {
    if (blocked || pending) return;
    setRefusal(null);
    setSaved(null);
    setPending(true);
    const clientId = newClientId();
    const phase = correcting ? correcting.phase : f.phase;
    const body = readingRequestBody({
      stepId: step.id,
      kind,
      values: f,
      phase,
      unit: entryUnit,
      travelUnit,
      points: pointsTyped,
      withInstrument,
      clientId,
      supersedes:
        correcting?.kind === "stored"
          ? { id: correcting.id }
          : correcting?.kind === "queued"
            ? { clientId: correcting.clientId }
            : null,
    });
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
    form.reset(clearedEntry(f, pointNames));
  });

  const edit = (q: QueuedReading) => {
    form.reset(entryFromQueued(q.body, pointNames, form.getValues("travel")));
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
          units={{ entryUnit, travelUnit, unitSystem }}
          instruments={choosable}
          today={today}
          correction={{ target: correcting, cancel: () => setCorrecting(null) }}
          checks={checks}
          sending={{ pending, refusal, saved }}
        />
      ) : null}
    </div>
  );
}
