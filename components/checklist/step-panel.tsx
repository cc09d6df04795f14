"use client";

import { ScrollRegion } from "@/components/ui/scroll-region";
import { useMemo, useState, useTransition } from "react";
import { useForm, useWatch } from "react-hook-form";
import { PHASE_LABELS } from "@/lib/domain/datasets";
import { useRouter } from "next/navigation";
import { recordReadingAction } from "@/app/(app)/jobs/[id]/checklist/actions";
import { DecisionBadge } from "@/components/readings/decision-badge";
import { deriveReading, expandedUncertainty, judge, type StepDecision, type StepRule } from "@/lib/checklist";
import { arcsecToUmPerM, displayUnit, formatValue, UNIT_SYMBOL, type UnitSystem } from "@/lib/units";

export interface PanelStep extends StepRule {
  id: string;
  position: number;
  title: string;
  quantity: string;
}

export interface PanelReading {
  id: string;
  phase: "pre" | "post";
  value: number;
  enteredValue: number;
  enteredUnit: string;
  decision: StepDecision;
  instrumentSerial: string | null;
  takenAt: string;
  note: string | null;
  recordedByName: string | null;
  supersededById: string | null;
}

export interface PanelInstrument {
  id: string;
  kind: string;
  serial: string;
  quantityKind: "length" | "angle";
  calibrationDueOn: string;
  standardUncertainty: number;
}

interface FormValues {
  phase: "pre" | "post";
  value: string;
  travel: string;
  instrumentId: string;
  note: string;
  takenAt: string;
}

function localNow(): string {
  const d = new Date();
  d.setMinutes(d.getMinutes() - d.getTimezoneOffset());
  return d.toISOString().slice(0, 16);
}

/** One checklist step on the tablet: its readings so far and the entry form with live pass/fail. */
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
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [correcting, setCorrecting] = useState<PanelReading | null>(null);
  const [serverError, setServerError] = useState<{
    message: string;
    fields: Record<string, string[]>;
  } | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const isAngleFromReading = step.derivation === "angle_over_distance";
  const entryUnit = isAngleFromReading
    ? displayUnit("length", unitSystem)
    : displayUnit(step.quantityKind, unitSystem);
  const travelUnit = unitSystem === "inch" ? "in" : "mm";
  const defaultTravel =
    step.distanceMm != null ? (unitSystem === "inch" ? step.distanceMm / 25.4 : step.distanceMm) : null;
  const readsKind = isAngleFromReading ? "length" : step.quantityKind;
  const choosable = instruments.filter((i) => i.quantityKind === readsKind);
  const hasPre = readings.some((r) => r.phase === "pre" && !r.supersededById);

  const { register, handleSubmit, control, reset, setValue } = useForm<FormValues>({
    defaultValues: {
      phase: hasPre ? "post" : "pre",
      value: "",
      travel: defaultTravel != null ? String(Number(defaultTravel.toFixed(4))) : "",
      instrumentId: choosable.find((i) => i.calibrationDueOn >= today)?.id ?? "",
      note: "",
      takenAt: localNow(),
    },
  });
  const [value, travel, instrumentId, phase] = useWatch({
    control,
    name: ["value", "travel", "instrumentId", "phase"],
  });
  const instrument = instruments.find((i) => i.id === instrumentId);
  const expired = instrument && instrument.calibrationDueOn < today;

  const live = useMemo(() => {
    const v = Number(String(value).trim().replace(",", "."));
    if (String(value).trim() === "" || !Number.isFinite(v)) return null;
    try {
      const t = Number(String(travel).replace(",", "."));
      const travelMm =
        isAngleFromReading && Number.isFinite(t) && t > 0 ? (travelUnit === "in" ? t * 25.4 : t) : null;
      const d = deriveReading(step, { value: v, unit: entryUnit, travelMm });
      const U = expandedUncertainty(step, instrument?.standardUncertainty);
      return { value: d.value, decision: judge(step, d.value, U), error: null as string | null };
    } catch (err) {
      return {
        value: NaN,
        decision: "not_measured" as StepDecision,
        error: err instanceof Error ? err.message : "Not a usable value.",
      };
    }
  }, [value, travel, instrument, step, entryUnit, isAngleFromReading, travelUnit]);

  const onSubmit = handleSubmit((f) => {
    setServerError(null);
    setSaved(null);
    startTransition(async () => {
      const res = await recordReadingAction({
        jobId,
        stepId: step.id,
        phase: correcting ? correcting.phase : f.phase,
        value: f.value,
        unit: entryUnit,
        ...(isAngleFromReading ? { travel: f.travel, travelUnit } : {}),
        instrumentId: f.instrumentId,
        note: f.note,
        takenAt: f.takenAt ? new Date(f.takenAt).toISOString() : undefined,
        ...(correcting ? { supersedesId: correcting.id } : {}),
      });
      if (!res.ok) {
        setServerError({ message: res.message, fields: res.fieldErrors ?? {} });
        return;
      }
      setSaved(
        `${correcting ? "Correction" : "Reading"} saved: ${res.data.decision === "pass" ? "pass" : res.data.decision === "fail" ? "fail" : res.data.decision.replace("_", " ")}.`,
      );
      setCorrecting(null);
      reset({
        phase: f.phase,
        value: "",
        travel: f.travel,
        instrumentId: f.instrumentId,
        note: "",
        takenAt: localNow(),
      });
      router.refresh();
    });
  });

  const fieldError = (name: string) => serverError?.fields[name]?.[0];
  const inputCls =
    "min-h-touch w-full rounded-md border border-graphite-300 bg-white px-3 text-base focus:border-accent-500 focus:outline-none focus:ring-2 focus:ring-accent-500/40";

  return (
    <div className="space-y-4">
      <ReadingsList
        readings={readings}
        step={step}
        unitSystem={unitSystem}
        canWrite={canWrite}
        onCorrect={(r) => {
          setCorrecting(r);
          setValue("phase", r.phase);
          setSaved(null);
        }}
      />
      {canWrite ? (
        <form
          onSubmit={onSubmit}
          className="space-y-4 rounded-card border border-graphite-200 bg-graphite-50 p-4"
          aria-label={`Record a reading for step ${step.position}`}
          noValidate
        >
          {correcting ? (
            <div className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-accent-300 bg-accent-50 px-3 py-2 text-sm">
              <span>
                Correcting the {PHASE_LABELS[correcting.phase].toLowerCase()} reading of{" "}
                <span className="num">{formatValue(correcting.value, step.quantityKind, unitSystem)}</span>.
                The old reading is kept and marked as corrected.
              </span>
              <button
                type="button"
                className="min-h-touch rounded-md px-3 font-medium text-graphite-700 underline"
                onClick={() => setCorrecting(null)}
              >
                Cancel correction
              </button>
            </div>
          ) : (
            <fieldset>
              <legend className="mb-2 text-sm font-medium text-graphite-700">Phase</legend>
              <div className="grid grid-cols-2 gap-2">
                {(["pre", "post"] as const).map((p) => (
                  <label
                    key={p}
                    className={`flex min-h-touch cursor-pointer items-center justify-center gap-2 rounded-md border-2 px-3 text-base font-medium ${phase === p ? "border-accent-600 bg-white text-graphite-900" : "border-graphite-200 bg-white text-graphite-600"}`}
                  >
                    <input
                      type="radio"
                      value={p}
                      {...register("phase")}
                      className="h-5 w-5 accent-accent-600"
                    />
                    {PHASE_LABELS[p]}
                  </label>
                ))}
              </div>
            </fieldset>
          )}
          <div className="grid gap-4 sm:grid-cols-2">
            <div>
              <label
                htmlFor={`value-${step.id}`}
                className="mb-1 block text-sm font-medium text-graphite-700"
              >
                {isAngleFromReading ? "Change in reading over the travel" : step.quantity} (
                {UNIT_SYMBOL[entryUnit]})
              </label>
              <div className="flex items-center gap-2">
                <input
                  id={`value-${step.id}`}
                  inputMode="decimal"
                  autoComplete="off"
                  className={`${inputCls} num text-right text-lg`}
                  aria-invalid={Boolean(fieldError("value"))}
                  aria-describedby={`live-${step.id}`}
                  {...register("value", { required: true })}
                />
                <span className="num w-10 text-graphite-600">{UNIT_SYMBOL[entryUnit]}</span>
              </div>
              {fieldError("value") ? (
                <p className="mt-1 text-sm text-fail-700">{fieldError("value")}</p>
              ) : null}
            </div>
            {isAngleFromReading ? (
              <div>
                <label
                  htmlFor={`travel-${step.id}`}
                  className="mb-1 block text-sm font-medium text-graphite-700"
                >
                  Z travel ({travelUnit})
                </label>
                <div className="flex items-center gap-2">
                  <input
                    id={`travel-${step.id}`}
                    inputMode="decimal"
                    autoComplete="off"
                    className={`${inputCls} num text-right text-lg`}
                    {...register("travel")}
                  />
                  <span className="num w-10 text-graphite-600">{travelUnit}</span>
                </div>
              </div>
            ) : null}
            <div>
              <label
                htmlFor={`instrument-${step.id}`}
                className="mb-1 block text-sm font-medium text-graphite-700"
              >
                Instrument
              </label>
              <select
                id={`instrument-${step.id}`}
                className={inputCls}
                aria-invalid={Boolean(fieldError("instrumentId"))}
                {...register("instrumentId", { required: true })}
              >
                <option value="">Choose from the register…</option>
                {choosable.map((i) => (
                  <option key={i.id} value={i.id}>
                    {i.serial} · {i.kind} ·{" "}
                    {i.calibrationDueOn < today
                      ? `calibration past due (${i.calibrationDueOn})`
                      : `due ${i.calibrationDueOn}`}
                  </option>
                ))}
              </select>
              {expired && !fieldError("instrumentId") ? (
                <p className="mt-1 text-sm text-fail-700">
                  This instrument&apos;s calibration was due on {instrument.calibrationDueOn}; the reading
                  will be refused.
                </p>
              ) : null}
              {fieldError("instrumentId") ? (
                <p className="mt-1 text-sm text-fail-700" role="alert">
                  {fieldError("instrumentId")}
                </p>
              ) : null}
            </div>
            <div>
              <label
                htmlFor={`taken-${step.id}`}
                className="mb-1 block text-sm font-medium text-graphite-700"
              >
                Taken at (your local time)
              </label>
              <input
                id={`taken-${step.id}`}
                type="datetime-local"
                className={inputCls}
                {...register("takenAt")}
              />
              {fieldError("takenAt") ? (
                <p className="mt-1 text-sm text-fail-700">{fieldError("takenAt")}</p>
              ) : null}
            </div>
            <div className="sm:col-span-2">
              <label htmlFor={`note-${step.id}`} className="mb-1 block text-sm font-medium text-graphite-700">
                Note {correcting ? "(say why it is corrected)" : "(optional)"}
              </label>
              <input id={`note-${step.id}`} className={inputCls} maxLength={2000} {...register("note")} />
            </div>
          </div>
          <div className="flex flex-wrap items-center gap-4">
            <div
              id={`live-${step.id}`}
              aria-live="polite"
              className="flex min-h-touch flex-1 flex-wrap items-center gap-3"
              data-testid={`live-${step.position}`}
            >
              {live?.error ? (
                <span className="text-sm text-fail-700">{live.error}</span>
              ) : live ? (
                <>
                  <DecisionBadge decision={live.decision} size="lg" />
                  {isAngleFromReading ? (
                    <span className="num text-graphite-700">
                      = {formatValue(live.value, "angle", unitSystem)} (
                      {arcsecToUmPerM(live.value).toFixed(1)} µm/m)
                    </span>
                  ) : null}
                </>
              ) : (
                <span className="text-sm text-graphite-500">
                  Enter a value to see pass or fail against the limits.
                </span>
              )}
            </div>
            <button
              type="submit"
              disabled={pending}
              className="min-h-touch min-w-touch rounded-md bg-accent-600 px-6 text-base font-semibold text-white shadow-sm hover:bg-accent-700 disabled:opacity-60"
            >
              {pending ? "Saving…" : correcting ? "Save correction" : "Save reading"}
            </button>
          </div>
          {serverError ? (
            <p
              role="alert"
              className="rounded-md border border-fail-600/40 bg-fail-50 px-3 py-2 text-sm text-fail-700"
            >
              {serverError.message}
            </p>
          ) : null}
          {saved ? (
            <p role="status" className="text-sm font-medium text-pass-700">
              {saved}
            </p>
          ) : null}
        </form>
      ) : null}
    </div>
  );
}

function ReadingsList({
  readings,
  step,
  unitSystem,
  canWrite,
  onCorrect,
}: {
  readings: PanelReading[];
  step: PanelStep;
  unitSystem: UnitSystem;
  canWrite: boolean;
  onCorrect: (r: PanelReading) => void;
}) {
  if (readings.length === 0) return <p className="text-sm text-graphite-500">No readings yet.</p>;
  return (
    <ScrollRegion label={`Readings of step ${step.position}, table`}>
      <table className="w-full text-sm">
        <caption className="sr-only">Readings of step {step.position}</caption>
        <thead className="text-left text-graphite-600">
          <tr className="border-b border-graphite-200">
            <th scope="col" className="py-2 pr-3 font-medium">
              Phase
            </th>
            <th scope="col" className="py-2 pr-3 text-right font-medium">
              Value
            </th>
            <th scope="col" className="py-2 pr-3 font-medium">
              Result
            </th>
            <th scope="col" className="py-2 pr-3 font-medium">
              Instrument
            </th>
            <th scope="col" className="py-2 pr-3 font-medium">
              Taken (UTC)
            </th>
            <th scope="col" className="py-2 pr-3 font-medium">
              Note
            </th>
            {canWrite ? (
              <th scope="col" className="py-2 font-medium">
                <span className="sr-only">Correct</span>
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody className="divide-y divide-graphite-100">
          {readings.map((r) => {
            const old = Boolean(r.supersededById);
            return (
              <tr
                key={r.id}
                className={old ? "text-graphite-500" : ""}
                data-superseded={old ? "true" : undefined}
              >
                <td className="py-2 pr-3">{PHASE_LABELS[r.phase]}</td>
                <td
                  className={`num whitespace-nowrap py-2 pr-3 text-right ${old ? "line-through" : "font-semibold"}`}
                >
                  {formatValue(r.value, step.quantityKind, unitSystem)}
                  {step.derivation === "angle_over_distance" ? (
                    <span className="block text-xs font-normal text-graphite-500">
                      from {r.enteredValue} {r.enteredUnit}
                    </span>
                  ) : null}
                </td>
                <td className="py-2 pr-3">
                  {old ? (
                    <span className="text-xs font-medium uppercase tracking-wide">Corrected</span>
                  ) : (
                    <DecisionBadge decision={r.decision} />
                  )}
                </td>
                <td className="num py-2 pr-3">{r.instrumentSerial ?? "—"}</td>
                <td className="num py-2 pr-3 whitespace-nowrap">
                  {r.takenAt.slice(0, 16).replace("T", " ")}
                </td>
                <td className="py-2 pr-3">
                  {r.note ?? ""}
                  {r.recordedByName ? (
                    <span className="block text-xs text-graphite-500">{r.recordedByName}</span>
                  ) : null}
                </td>
                {canWrite ? (
                  <td className="py-1 text-right">
                    {!old ? (
                      <button
                        type="button"
                        onClick={() => onCorrect(r)}
                        className="min-h-touch rounded-md border border-graphite-300 bg-white px-3 font-medium text-graphite-800 hover:bg-graphite-100"
                      >
                        Correct
                      </button>
                    ) : null}
                  </td>
                ) : null}
              </tr>
            );
          })}
        </tbody>
      </table>
    </ScrollRegion>
  );
}
