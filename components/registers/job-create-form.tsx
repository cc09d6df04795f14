"use client";

import { createJobAction } from "@/app/(app)/registers/actions";
import { Field, inputClass } from "@/components/ui/field";
import { Form } from "@/components/ui/form";

type Opt = { id: string; label: string };

/** Opens a job from the current version of a procedure; the job keeps that version. */
export function JobCreateForm({
  templateId,
  machines,
  heads,
  installers,
}: {
  templateId: string;
  machines: Opt[];
  heads: Opt[];
  installers: Opt[];
}) {
  return (
    <Form
      action={createJobAction}
      submitLabel="Open the job"
      successMessage="Job opened as a draft; it is on the jobs list."
    >
      <input type="hidden" name="templateId" value={templateId} />
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <Field name="title" label="Title">
          <input name="title" className={inputClass} placeholder="Head installation on …" />
        </Field>
        <Field name="machineId" label="Host machine">
          <select name="machineId" className={inputClass} defaultValue="">
            <option value="">Choose…</option>
            {machines.map((m) => (
              <option key={m.id} value={m.id}>
                {m.label}
              </option>
            ))}
          </select>
        </Field>
        <Field name="headId" label="Head">
          <select name="headId" className={inputClass} defaultValue="">
            <option value="">Choose…</option>
            {heads.map((h) => (
              <option key={h.id} value={h.id}>
                {h.label}
              </option>
            ))}
          </select>
        </Field>
        <Field name="kind" label="Kind">
          <select name="kind" className={inputClass} defaultValue="installation">
            <option value="installation">Installation</option>
            <option value="reverification">Re-verification</option>
            <option value="after_crash">Check after a crash</option>
          </select>
        </Field>
        <Field name="assignedInstallerId" label="Installer">
          <select name="assignedInstallerId" className={inputClass} defaultValue="">
            <option value="">Not assigned yet</option>
            {installers.map((u) => (
              <option key={u.id} value={u.id}>
                {u.label}
              </option>
            ))}
          </select>
        </Field>
        <Field name="decisionRule" label="Decision rule">
          <select name="decisionRule" className={inputClass} defaultValue="simple">
            <option value="simple">Simple acceptance</option>
            <option value="guarded">Guarded acceptance (ISO 14253-1)</option>
          </select>
        </Field>
      </div>
    </Form>
  );
}
