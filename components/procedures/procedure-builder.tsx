"use client";

/**
 * The procedure builder: a procedure's name, the jobs it applies to, and its steps, each with its
 * kind and what that kind needs. Steps are added, reordered with Up / Down buttons (focus follows
 * the step), and removed in the browser; nothing is stored until the whole version is saved, and
 * the server checks it again with the same schema (lib/validations/procedures.ts).
 */
import { useState, useTransition } from "react";
import { useRouter } from "next/navigation";
import { FormProvider, useFieldArray, useForm, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { EMPTY_STEP, type BuilderValues, type HeadModelAxes } from "@/components/procedures/builder-values";
import { HeadJudgingFields } from "@/components/procedures/head-judging-fields";
import { StepCard } from "@/components/procedures/step-card";
import { Button } from "@/components/ui/button";
import { Field, FieldError, inputClass } from "@/components/ui/field";
import { SubmitRow } from "@/components/ui/form";
import { INVALID_MESSAGE, mapActionErrors } from "@/components/ui/form-errors";
import type { ActionResult } from "@/lib/actions";
import { JOB_KIND_LABELS, JOB_KINDS } from "@/lib/domain/jobs";
import { procedureSchema, procedureVersionSchema } from "@/lib/validations/procedures";

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
        <SubmitRow
          label={submitLabel}
          pending={pending}
          notice={notice}
          className="border-t border-graphite-200 pt-4"
        />
      </form>
    </FormProvider>
  );
}
