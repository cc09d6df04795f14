"use client";

/**
 * One step of the procedure builder: its title, kind and instructions, and the fields its kind
 * needs (limits and their unit, the travel of an angle, the points of a multi-point reading, the
 * unit of a recorded value, where a judged limit comes from), with Up / Down / Remove.
 */
import { useFormContext, useWatch } from "react-hook-form";
import type { BuilderStep, BuilderValues } from "@/components/procedures/builder-values";
import { SourceSelect } from "@/components/procedures/limit-cells";
import { PointsFields } from "@/components/procedures/points-fields";
import { Button } from "@/components/ui/button";
import {
  closedSetOptions,
  Field,
  inputClass,
  OptionList,
  TextField,
  type Option,
} from "@/components/ui/field";
import { DECISION_RULE_LABELS, DECISION_RULES } from "@/lib/domain/decisions";
import { STEP_KIND_LABELS, STEP_KINDS } from "@/lib/domain/procedures";

const UNIT_OPTIONS: readonly Option[] = [
  { value: "mm", label: "mm" },
  { value: "um", label: "µm" },
  { value: "in", label: "in" },
  { value: "arcsec", label: "″ (arc seconds)" },
];
const RULE_OPTIONS = closedSetOptions(DECISION_RULES, DECISION_RULE_LABELS);
const STEP_KIND_OPTIONS = closedSetOptions(STEP_KINDS, STEP_KIND_LABELS);

const MEASURED = new Set(["direct", "angle_over_distance", "sweep_flatness", "multi_point"]);
const JUDGED = new Set([...MEASURED, "check"]);

export function StepCard({
  index: i,
  count,
  onMove,
  onRemove,
}: {
  index: number;
  count: number;
  onMove: (by: -1 | 1) => void;
  onRemove: () => void;
}) {
  const form = useFormContext<BuilderValues>();
  const kind = useWatch({ name: `steps.${i}.kind` }) as string;
  const title = (useWatch({ name: `steps.${i}.title` }) as string) || "New step";
  const at = (f: keyof BuilderStep) => `steps.${i}.${f}`;
  return (
    <li
      className="rounded-card border border-graphite-200 bg-white p-4 shadow-sm"
      aria-label={`Step ${i + 1}: ${title}`}
    >
      <div className="mb-3 flex flex-wrap items-center gap-2">
        <span className="num rounded bg-graphite-100 px-2 py-1 text-sm font-semibold">{i + 1}</span>
        <span className="grow font-medium">{title}</span>
        <Button
          type="button"
          variant="secondary"
          id={`step-${i}-up`}
          disabled={i === 0}
          onClick={() => onMove(-1)}
          aria-label={`Move step ${i + 1} up`}
        >
          Up
        </Button>
        <Button
          type="button"
          variant="secondary"
          id={`step-${i}-down`}
          disabled={i === count - 1}
          onClick={() => onMove(1)}
          aria-label={`Move step ${i + 1} down`}
        >
          Down
        </Button>
        <Button
          type="button"
          variant="danger"
          disabled={count === 1}
          onClick={onRemove}
          aria-label={`Remove step ${i + 1}`}
        >
          Remove
        </Button>
      </div>
      <div className="grid gap-4 md:grid-cols-2">
        <Field name={at("title")} label="Title">
          <input id={`step-${i}-title`} className={inputClass} autoComplete="off" />
        </Field>
        <Field name={at("kind")} label="Kind of step">
          <select className={inputClass}>
            <OptionList options={STEP_KIND_OPTIONS} />
          </select>
        </Field>
        <Field name={at("instructions")} label="Instructions" className="md:col-span-2">
          <textarea className={`${inputClass} py-2`} rows={2} />
        </Field>
        {MEASURED.has(kind) ? (
          <>
            <TextField
              name={at("quantity")}
              label="What is measured"
              hint="Shown on the checklist and the report."
              autoComplete="off"
            />
            <Field name={at("unit")} label="Unit of the limits">
              <select className={inputClass}>
                <OptionList options={UNIT_OPTIONS} />
              </select>
            </Field>
            <TextField name={at("lower")} label="Lower limit" hint="Empty: no lower limit." decimal />
            <TextField name={at("upper")} label="Upper limit" hint="Empty: no upper limit." decimal />
            <Field name={at("decisionRule")} label="Decision rule">
              <select className={inputClass}>
                <OptionList options={RULE_OPTIONS} />
              </select>
            </Field>
          </>
        ) : null}
        {kind === "angle_over_distance" ? (
          <TextField name={at("distanceMm")} label="Distance the reading is taken over (mm)" decimal />
        ) : null}
        {kind === "multi_point" ? <PointsFields index={i} /> : null}
        {kind === "record" ? (
          <TextField
            name={at("recordUnit")}
            label="Unit of the recorded value"
            hint="N·m, mm, °, min …"
            autoComplete="off"
          />
        ) : null}
        {JUDGED.has(kind) ? (
          <>
            <Field name={at("limitSource")} label="Where the limit comes from">
              <SourceSelect className={inputClass} />
            </Field>
            <TextField
              name={at("limitSourceNote")}
              label="Source note"
              hint="The standard and clause, the maker's document, or why it is common practice."
              autoComplete="off"
            />
          </>
        ) : null}
        <Field
          name={at("safety")}
          label="Safety note"
          hint="Where hands or loads are at risk. Defer to the builder's manual and local codes."
          className="md:col-span-2"
        >
          <textarea className={`${inputClass} py-2`} rows={2} />
        </Field>
        <label className="flex min-h-touch items-center gap-2 text-sm">
          <input type="checkbox" className="size-5" {...form.register(at("photoRequired") as never)} />
          Photo required
        </label>
      </div>
    </li>
  );
}
