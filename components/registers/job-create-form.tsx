"use client";

import { openJobAction } from "@/app/(app)/jobs/actions";
import { closedSetOptions, optionsOf, SelectField, TextField } from "@/components/ui/field";
import { Form } from "@/components/ui/form";
import { DECISION_RULE_LABELS, DECISION_RULES } from "@/lib/domain/decisions";
import { JOB_KIND_LABELS, JOB_KINDS } from "@/lib/domain/jobs";
import { jobOpenSchema } from "@/lib/validations/jobs";

type Opt = { id: string; label: string };

const KINDS = closedSetOptions(JOB_KINDS, JOB_KIND_LABELS);
const RULES = closedSetOptions(DECISION_RULES, DECISION_RULE_LABELS);

/**
 * Opens a job from the current version of a procedure; the job keeps that version. A shortcut to
 * the jobs list's "New job": the same action and the same checks (the procedure fits the kind and
 * the head's model, the head is not mounted on another machine).
 */
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
      action={openJobAction}
      schema={jobOpenSchema}
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
