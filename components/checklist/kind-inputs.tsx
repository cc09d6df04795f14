"use client";

import type { UseFormReturn } from "react-hook-form";
import type { EntryValues } from "@/lib/reading-entry";
import type { PanelStep } from "@/components/checklist/step-panel";
import { UNIT_SYMBOL, type EntryUnit } from "@/lib/units";
import { inputCls, labelCls, ValueWithUnit } from "@/components/checklist/entry-fields";

/** The readings of a multi-point step, one small field per point in the procedure's order. */
export function PointGrid({
  form,
  step,
  entryUnit,
  pointProblems,
}: {
  form: UseFormReturn<EntryValues>;
  step: PanelStep;
  entryUnit: EntryUnit;
  pointProblems: Record<string, string>;
}) {
  const names = step.points ?? [];
  return (
    <fieldset className="sm:col-span-2">
      <legend className={labelCls}>
        {step.quantity}: reading at each point ({UNIT_SYMBOL[entryUnit]})
      </legend>
      <div className="grid grid-cols-2 gap-2 sm:grid-cols-4">
        {names.map((p, i) => {
          const id = `point-${step.id}-${i}`;
          const problem = pointProblems[p];
          return (
            <div key={p} className="min-w-0">
              <label htmlFor={id} className="mb-0.5 block text-xs font-semibold text-graphite-600">
                At {p}
              </label>
              <input
                id={id}
                inputMode="decimal"
                autoComplete="off"
                aria-invalid={Boolean(problem)}
                aria-describedby={problem ? `${id}-problem` : undefined}
                data-testid={`point-${step.position}-${p}`}
                className={`${inputCls} num text-right text-lg ${problem ? "border-fail-600" : ""}`}
                {...form.register(`pointValues.${i}` as const)}
              />
              {problem ? (
                <p id={`${id}-problem`} className="mt-0.5 text-xs text-fail-700">
                  {problem}
                </p>
              ) : null}
            </div>
          );
        })}
      </div>
    </fieldset>
  );
}

/** Two large buttons for a yes/no check, easy to hit with gloves on. */
export function YesNo({ form, step }: { form: UseFormReturn<EntryValues>; step: PanelStep }) {
  const answer = form.watch("answer");
  return (
    <fieldset className="sm:col-span-2">
      <legend className={labelCls}>{step.quantity}</legend>
      <div className="grid grid-cols-2 gap-3">
        {(["yes", "no"] as const).map((a) => (
          <label
            key={a}
            className={`flex min-h-[4rem] cursor-pointer items-center justify-center gap-3 rounded-md border-2 text-xl font-semibold ${answer === a ? (a === "yes" ? "border-pass-700 bg-pass-50 text-pass-700" : "border-fail-600 bg-fail-50 text-fail-700") : "border-graphite-300 bg-white text-graphite-700"}`}
          >
            <input type="radio" value={a} {...form.register("answer")} className="h-6 w-6" />
            {a === "yes" ? "Yes" : "No"}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/** A value for the record in the step's own unit, and where it applies (shim positions). */
export function RecordInputs({
  form,
  step,
  problem,
}: {
  form: UseFormReturn<EntryValues>;
  step: PanelStep;
  problem: string | null;
}) {
  const id = (what: string) => `${what}-${step.id}`;
  return (
    <>
      <ValueWithUnit
        id={id("value")}
        label={`${step.quantity} (${step.recordUnit ?? "as written"})`}
        unit={step.recordUnit ?? ""}
        wideUnit
        input={{ "aria-invalid": Boolean(problem), ...form.register("value") }}
      >
        <p className="mt-1 text-sm text-fail-700" data-testid={`problem-${step.position}`}>
          {problem ?? ""}
        </p>
      </ValueWithUnit>
      <div>
        <label htmlFor={id("where")} className={labelCls}>
          Where (optional, e.g. shims at 3 and 9 o&apos;clock)
        </label>
        <input id={id("where")} className={inputCls} maxLength={2000} {...form.register("text")} />
      </div>
    </>
  );
}

/** The text of a note step. */
export function NoteInput({ form, step }: { form: UseFormReturn<EntryValues>; step: PanelStep }) {
  return (
    <div className="sm:col-span-2">
      <label htmlFor={`text-${step.id}`} className={labelCls}>
        {step.quantity}
      </label>
      <textarea
        id={`text-${step.id}`}
        rows={3}
        maxLength={2000}
        className={`${inputCls} py-2`}
        {...form.register("text")}
      />
    </div>
  );
}
