"use client";

/**
 * The procedure builder: a procedure's name, the jobs it applies to, and its steps, each with its
 * kind and what that kind needs. Steps are added, reordered with Up / Down buttons (focus follows
 * the step), and removed in the browser; nothing is stored until the whole version is saved, and
 * the server checks it again with the same schema (lib/validations/procedures.ts).
 */
import { useState, useTransition } from "react";
import { useRouter } from "next/navigation";
import {
  FormProvider,
  useFieldArray,
  useForm,
  useFormContext,
  useWatch,
  type Resolver,
} from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import {
  EMPTY_STEP,
  type BuilderStep,
  type BuilderValues,
  type HeadModelAxes,
} from "@/components/procedures/builder-values";
import { HeadJudgingFields } from "@/components/procedures/head-judging-fields";
import { SourceSelect } from "@/components/procedures/limit-cells";
import { ActionNotice, Button } from "@/components/ui/button";
import { Field, FieldError, inputClass } from "@/components/ui/field";
import { INVALID_MESSAGE, mapActionErrors } from "@/components/ui/form-errors";
import type { ActionResult } from "@/lib/actions";
import { JOB_KIND_LABELS, JOB_KINDS } from "@/lib/domain/jobs";
import {
  CLOCK_POINTS_4,
  CLOCK_POINTS_8,
  MULTI_POINT_RESULT_LABELS,
  MULTI_POINT_RESULTS,
  STEP_KIND_LABELS,
  STEP_KINDS,
} from "@/lib/domain/procedures";
import { equalPoints, procedureSchema, procedureVersionSchema } from "@/lib/validations/procedures";

const UNIT_OPTIONS = [
  ["mm", "mm"],
  ["um", "µm"],
  ["in", "in"],
  ["arcsec", "″ (arc seconds)"],
] as const;

const MEASURED = new Set(["direct", "angle_over_distance", "sweep_flatness", "multi_point"]);
const JUDGED = new Set([...MEASURED, "check"]);

type Saved = { id: string; version: number; replaced?: boolean };

export function ProcedureBuilder({
  mode,
  procedureId,
  initial,
  submitLabel,
  action,
  headAxes = [],
}: {
  mode: "new" | "version";
  procedureId?: string;
  initial: BuilderValues;
  submitLabel: string;
  action: (raw: unknown) => Promise<ActionResult<Saved>>;
  /** The register's heads' axis letters per model, to name the rotary axes of the head model. */
  headAxes?: readonly HeadModelAxes[];
}) {
  const router = useRouter();
  const form = useForm<BuilderValues>({
    defaultValues: initial,
    resolver: zodResolver(
      (mode === "new" ? procedureSchema : procedureVersionSchema) as never,
    ) as Resolver<BuilderValues>,
  });
  const steps = useFieldArray({ control: form.control, name: "steps" });
  const [pending, start] = useTransition();
  const [notice, setNotice] = useState<{ ok: boolean; message: string } | null>(null);
  const [moved, setMoved] = useState("");

  function move(index: number, by: -1 | 1) {
    const to = index + by;
    if (to < 0 || to >= steps.fields.length) return;
    steps.swap(index, to);
    setMoved(`Step moved to position ${to + 1}.`);
    // Keep the keyboard where it was: on the same button of the step that moved.
    requestAnimationFrame(() => {
      const el = document.getElementById(`step-${to}-${by < 0 ? "up" : "down"}`) as HTMLButtonElement | null;
      (el && !el.disabled ? el : document.getElementById(`step-${to}-title`))?.focus();
    });
  }

  function remove(index: number) {
    steps.remove(index);
    setMoved(`Step ${index + 1} removed.`);
  }

  const onValid = (parsed: unknown) =>
    start(async () => {
      const res = await action(mode === "new" ? parsed : { ...(parsed as object), id: procedureId });
      if (res.ok) {
        setNotice({
          ok: true,
          message:
            mode === "new"
              ? "Procedure created."
              : res.data.replaced
                ? `Version ${res.data.version} saved.`
                : `Version ${res.data.version} published; jobs on earlier versions keep theirs.`,
        });
        router.push(`/registers/procedures/${res.data.id}`);
        router.refresh();
        return;
      }
      const known = (name: string) =>
        ["name", "description", "headModel", "jobKinds"].includes(name) ||
        /^tcp\w+$/.test(name) ||
        /^(steps|parameterLimits|positioningLimits)\.\d+\.\w+$/.test(name);
      const mapped = mapActionErrors(res, known);
      for (const [name, message] of mapped.fields) form.setError(name as never, { type: "server", message });
      setNotice({ ok: false, message: mapped.message });
    });

  return (
    <FormProvider {...form}>
      <form
        aria-label={mode === "new" ? "New procedure" : "Edit procedure"}
        noValidate
        className="space-y-6"
        onSubmit={form.handleSubmit(onValid as never, () =>
          setNotice({ ok: false, message: INVALID_MESSAGE }),
        )}
      >
        <fieldset className="grid gap-4 md:grid-cols-2">
          <legend className="sr-only">The procedure</legend>
          {mode === "new" ? (
            <Field name="name" label="Name">
              <input className={inputClass} autoComplete="off" />
            </Field>
          ) : null}
          <Field name="headModel" label="Head model" hint="Leave empty when it applies to every model.">
            <input className={inputClass} autoComplete="off" />
          </Field>
          <Field name="description" label="What it is for" className="md:col-span-2">
            <textarea className={`${inputClass} py-2`} rows={2} />
          </Field>
          <div className="md:col-span-2">
            <p className="text-sm font-medium text-graphite-700">Job kinds</p>
            <div className="mt-1 flex flex-wrap gap-4">
              {JOB_KINDS.map((k) => (
                <label key={k} className="flex min-h-touch items-center gap-2 text-sm">
                  <input type="checkbox" value={k} {...form.register("jobKinds")} className="size-5" />
                  {JOB_KIND_LABELS[k]}
                </label>
              ))}
            </div>
            <span className="block text-xs text-graphite-500">None ticked: every kind of job.</span>
            <FieldError name="jobKinds" />
          </div>
        </fieldset>

        <div>
          <h2 className="text-lg font-semibold">Steps</h2>
          <p className="text-sm text-graphite-600">
            Limits are written in each step&apos;s own unit. Every judged step says where its limit comes
            from.
          </p>
          <p aria-live="polite" className="sr-only">
            {moved}
          </p>
          <FieldError name="steps" />
        </div>
        <ol className="space-y-4">
          {steps.fields.map((f, i) => (
            <StepCard
              key={f.id}
              index={i}
              count={steps.fields.length}
              onMove={(by) => move(i, by)}
              onRemove={() => remove(i)}
            />
          ))}
        </ol>
        <Button type="button" variant="secondary" onClick={() => steps.append({ ...EMPTY_STEP })}>
          Add a step
        </Button>
        <HeadJudgingFields headAxes={headAxes} />
        <div className="flex flex-wrap items-center gap-3 border-t border-graphite-200 pt-4">
          <Button type="submit" pending={pending}>
            {submitLabel}
          </Button>
          {notice ? <ActionNotice ok={notice.ok}>{notice.message}</ActionNotice> : null}
        </div>
      </form>
    </FormProvider>
  );
}

function StepCard({
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
            {STEP_KINDS.map((k) => (
              <option key={k} value={k}>
                {STEP_KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </Field>
        <Field name={at("instructions")} label="Instructions" className="md:col-span-2">
          <textarea className={`${inputClass} py-2`} rows={2} />
        </Field>
        {MEASURED.has(kind) ? (
          <>
            <Field
              name={at("quantity")}
              label="What is measured"
              hint="Shown on the checklist and the report."
            >
              <input className={inputClass} autoComplete="off" />
            </Field>
            <Field name={at("unit")} label="Unit of the limits">
              <select className={inputClass}>
                {UNIT_OPTIONS.map(([v, l]) => (
                  <option key={v} value={v}>
                    {l}
                  </option>
                ))}
              </select>
            </Field>
            <Field name={at("lower")} label="Lower limit" hint="Empty: no lower limit.">
              <input className={`${inputClass} num`} inputMode="decimal" autoComplete="off" />
            </Field>
            <Field name={at("upper")} label="Upper limit" hint="Empty: no upper limit.">
              <input className={`${inputClass} num`} inputMode="decimal" autoComplete="off" />
            </Field>
            <Field name={at("decisionRule")} label="Decision rule">
              <select className={inputClass}>
                <option value="simple">Simple acceptance (uncertainty shown)</option>
                <option value="guarded">Guarded acceptance (ISO 14253-1)</option>
              </select>
            </Field>
          </>
        ) : null}
        {kind === "angle_over_distance" ? (
          <Field name={at("distanceMm")} label="Distance the reading is taken over (mm)">
            <input className={`${inputClass} num`} inputMode="decimal" autoComplete="off" />
          </Field>
        ) : null}
        {kind === "multi_point" ? <PointsFields index={i} /> : null}
        {kind === "record" ? (
          <Field name={at("recordUnit")} label="Unit of the recorded value" hint="N·m, mm, °, min …">
            <input className={inputClass} autoComplete="off" />
          </Field>
        ) : null}
        {JUDGED.has(kind) ? (
          <>
            <Field name={at("limitSource")} label="Where the limit comes from">
              <SourceSelect className={inputClass} />
            </Field>
            <Field
              name={at("limitSourceNote")}
              label="Source note"
              hint="The standard and clause, the maker's document, or why it is common practice."
            >
              <input className={inputClass} autoComplete="off" />
            </Field>
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

function PointsFields({ index: i }: { index: number }) {
  const form = useFormContext<BuilderValues>();
  const [n, setN] = useState("6");
  const set = (pts: readonly string[]) =>
    form.setValue(`steps.${i}.points`, pts.join(", "), { shouldDirty: true, shouldValidate: true });
  return (
    <>
      <div className="space-y-2 md:col-span-2">
        <Field
          name={`steps.${i}.points`}
          label="Points, in the order they are read"
          hint="Clock positions seen from the front of the machine, or equal points P1 … PN."
        >
          <input className={inputClass} autoComplete="off" />
        </Field>
        <div className="flex flex-wrap items-end gap-2">
          <Button type="button" variant="secondary" onClick={() => set(CLOCK_POINTS_4)}>
            12 · 3 · 6 · 9
          </Button>
          <Button type="button" variant="secondary" onClick={() => set(CLOCK_POINTS_8)}>
            Eight clock positions
          </Button>
          <label className="text-sm">
            <span className="block text-graphite-700">Equal points</span>
            <input
              className={`${inputClass} num w-24`}
              inputMode="numeric"
              value={n}
              onChange={(e) => setN(e.target.value)}
              aria-label={`Number of equal points for step ${i + 1}`}
            />
          </label>
          <Button
            type="button"
            variant="secondary"
            onClick={() => {
              const k = Math.round(Number(n));
              if (k >= 2 && k <= 24) set(equalPoints(k));
            }}
          >
            Use equal points
          </Button>
        </div>
      </div>
      <Field name={`steps.${i}.pointResult`} label="Value judged from the points">
        <select className={inputClass}>
          {MULTI_POINT_RESULTS.map((r) => (
            <option key={r} value={r}>
              {MULTI_POINT_RESULT_LABELS[r]}
            </option>
          ))}
        </select>
      </Field>
    </>
  );
}
