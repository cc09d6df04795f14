"use client";

import { createJobAction } from "@/app/(app)/registers/actions";
import { optionsOf, SelectField, TextField } from "@/components/ui/field";
import { Form } from "@/components/ui/form";

type Opt = { id: string; label: string };

const KINDS = [
  { value: "installation", label: "Installation" },
  { value: "reverification", label: "Re-verification" },
  { value: "after_crash", label: "Check after a crash" },
];
const RULES = [
  { value: "simple", label: "Simple acceptance" },
  { value: "guarded", label: "Guarded acceptance (ISO 14253-1)" },
];

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
        <TextField name="title" label="Title" placeholder="Head installation on …" />
        <SelectField
          name="machineId"
          label="Host machine"
          placeholder="Choose…"
          options={optionsOf(machines)}
        />
        <SelectField name="headId" label="Head" placeholder="Choose…" options={optionsOf(heads)} />
        <SelectField name="kind" label="Kind" options={KINDS} defaultValue="installation" />
        <SelectField
          name="assignedInstallerId"
          label="Installer"
          placeholder="Not assigned yet"
          options={optionsOf(installers)}
        />
        <SelectField name="decisionRule" label="Decision rule" options={RULES} defaultValue="simple" />
      </div>
    </Form>
  );
}
