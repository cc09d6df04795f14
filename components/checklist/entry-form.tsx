"use client";

import type { UseFormReturn } from "react-hook-form";
import type { EntryValues } from "@/lib/reading-entry";
import { LiveResult } from "@/components/checklist/live-result";
import type { CorrectionTarget } from "@/components/checklist/readings-table";
import { PHASE_LABELS } from "@/lib/domain/datasets";
import { UNIT_SYMBOL, type EntryUnit, type UnitSystem } from "@/lib/units";
import type { PanelStep } from "@/components/checklist/step-panel";
import { NoteInput, PointGrid, RecordInputs, YesNo } from "@/components/checklist/kind-inputs";
import { InstrumentSelect, inputCls, labelCls, ValueWithUnit } from "@/components/checklist/entry-fields";
import { needsInstrument } from "@/lib/step-kinds";
import type { EntryChecks } from "@/components/checklist/use-entry-checks";

export interface PanelInstrument {
  id: string;
  kind: string;
  serial: string;
  quantityKind: "length" | "angle";
  calibrationDueOn: string;
  standardUncertainty: number;
  /** Smallest step the instrument reads, canonical (mm or arcsec). */
  resolution: number;
  /** The span it reads over, canonical; null = not stated. */
  rangeMin: number | null;
  rangeMax: number | null;
}

export type { EntryValues } from "@/lib/reading-entry";

/** What the form shows as it is typed (from `useEntryChecks`). */
export type EntryFormChecks = Pick<EntryChecks, "problem" | "pointProblems" | "live" | "blocked">;

/** Where the last send stands: sending, refused with a reason, or saved with a message. */
export interface EntrySending {
  pending: boolean;
  refusal: string | null;
  saved: string | null;
}

/** The entry form of one step: phase, value with its checks as you type, instrument, time, note. */
export function EntryForm({
  form,
  onSubmit,
  step,
  units: { entryUnit, travelUnit, unitSystem },
  instruments,
  today,
  correction: { target: correcting, cancel: onCancelCorrection },
  checks: { problem, pointProblems, live, blocked },
  sending: { pending, refusal, saved },
}: {
  form: UseFormReturn<EntryValues>;
  onSubmit: (e?: React.BaseSyntheticEvent) => Promise<void>;
  step: PanelStep;
  units: { entryUnit: EntryUnit; travelUnit: "in" | "mm"; unitSystem: UnitSystem };
  instruments: PanelInstrument[];
  today: string;
  /** The reading being corrected, if any, and how to stop correcting it. */
  correction: { target: CorrectionTarget | null; cancel: () => void };
  checks: EntryFormChecks;
  sending: EntrySending;
}) {
  const { register, watch } = form;
  const [phase, value] = watch(["phase", "value"]);
  const isAngleFromReading = step.derivation === "angle_over_distance";
  const kind = step.derivation;
  const single = kind === "direct" || kind === "angle_over_distance" || kind === "sweep_flatness";
  const id = (what: string) => `${what}-${step.id}`;
  return (
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
            <span className="num">{correcting.shown}</span>. The old reading is kept and marked as replaced.
          </span>
          <button
            type="button"
            className="min-h-touch rounded-md px-3 font-medium text-graphite-700 underline"
            onClick={onCancelCorrection}
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
                <input type="radio" value={p} {...register("phase")} className="h-5 w-5 accent-accent-600" />
                {PHASE_LABELS[p]}
              </label>
            ))}
          </div>
        </fieldset>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        {kind === "multi_point" ? (
          <PointGrid form={form} step={step} entryUnit={entryUnit} pointProblems={pointProblems} />
        ) : null}
        {kind === "check" ? <YesNo form={form} step={step} /> : null}
        {kind === "record" ? <RecordInputs form={form} step={step} problem={problem} /> : null}
        {kind === "note" ? <NoteInput form={form} step={step} /> : null}
        {single ? (
          <ValueWithUnit
            id={id("value")}
            label={`${isAngleFromReading ? "Change in reading over the travel" : step.quantity} (${UNIT_SYMBOL[entryUnit]})`}
            unit={UNIT_SYMBOL[entryUnit]}
            input={{
              "aria-invalid": Boolean(problem),
              "aria-describedby": `${id("problem")} ${id("live")}`,
              ...register("value"),
            }}
          >
            <p
              id={id("problem")}
              className="mt-1 text-sm text-fail-700"
              data-testid={`problem-${step.position}`}
            >
              {problem ?? ""}
            </p>
          </ValueWithUnit>
        ) : null}
        {isAngleFromReading ? (
          <ValueWithUnit
            id={id("travel")}
            label={`Z travel (${travelUnit})`}
            unit={travelUnit}
            input={register("travel")}
          />
        ) : null}
        {needsInstrument(kind) ? (
          <InstrumentSelect
            id={id("instrument")}
            instruments={instruments}
            today={today}
            input={register("instrumentId")}
          />
        ) : null}
        <div>
          <label htmlFor={id("taken")} className={labelCls}>
            Taken at (24-hour, this tablet&apos;s time)
          </label>
          <input
            id={id("taken")}
            inputMode="numeric"
            autoComplete="off"
            placeholder="YYYY-MM-DD HH:MM"
            className={`${inputCls} num`}
            {...register("takenAt")}
          />
        </div>
        <div className="sm:col-span-2">
          <label htmlFor={id("note")} className={labelCls}>
            Note {correcting ? "(say why it is corrected)" : "(optional)"}
          </label>
          <input id={id("note")} className={inputCls} maxLength={2000} {...register("note")} />
        </div>
      </div>
      <div className="flex flex-wrap items-center gap-4">
        <LiveResult
          id={id("live")}
          step={step}
          live={live}
          blocked={blocked}
          typed={Boolean(String(value).trim())}
          unitSystem={unitSystem}
        />
        <button
          type="submit"
          disabled={pending || Boolean(blocked)}
          title={blocked ?? undefined}
          className="min-h-touch min-w-touch rounded-md bg-accent-600 px-6 text-base font-semibold text-white shadow-sm hover:bg-accent-700 disabled:cursor-not-allowed disabled:bg-graphite-400"
        >
          {pending
            ? "Saving…"
            : correcting
              ? "Save correction"
              : kind === "note"
                ? "Save note"
                : kind === "check"
                  ? "Save answer"
                  : "Save reading"}
        </button>
      </div>
      {refusal ? (
        <p
          role="alert"
          className="rounded-md border border-fail-600/40 bg-fail-50 px-3 py-2 text-sm text-fail-700"
        >
          Not saved: {refusal} Your value is still in the form.
        </p>
      ) : null}
      {saved ? (
        <p role="status" className="text-sm font-medium text-pass-700">
          {saved}
        </p>
      ) : null}
    </form>
  );
}
