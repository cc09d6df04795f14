"use client";

import { useState } from "react";
import { moveJobAction, updateJobAction } from "@/app/(app)/jobs/actions";
import { Field, inputClass, SelectField, TextField } from "@/components/ui/field";
import { Form } from "@/components/ui/form";
import { FormFields, HiddenFields } from "@/components/ui/form-fields";
import { jobMoveFormSchema, jobRecordFormSchema } from "@/lib/validations/jobs";

export interface JobRecordValues {
  jobId: string;
  title: string;
  orderReference: string;
  customerContactName: string;
  customerContactEmail: string;
  scheduledDate: string;
  scheduledTime: string;
  timeZone: string;
  notes: string;
  conditionAsFound: string;
  nextRecheckOn: string;
}

/** The office edits the job's record: title, order, contact, schedule (with its zone), notes, condition as found, next re-check. */
export function JobRecordForm({ v }: { v: JobRecordValues }) {
  return (
    <Form
      action={updateJobAction}
      schema={jobRecordFormSchema}
      submitLabel="Save the record"
      successMessage="Saved."
      resetOnSuccess={false}
      aria-label="Edit the job's record"
    >
      <input type="hidden" name="jobId" value={v.jobId} />
      <FormFields
        columns={2}
        fields={[
          { name: "title", label: "Title", defaultValue: v.title },
          { name: "orderReference", label: "Order reference", defaultValue: v.orderReference, numeric: true },
          { name: "customerContactName", label: "Customer contact", defaultValue: v.customerContactName },
          {
            name: "customerContactEmail",
            label: "Contact e-mail",
            type: "email",
            defaultValue: v.customerContactEmail,
          },
        ]}
      />
      <div className="grid gap-4 sm:grid-cols-3">
        <TextField name="scheduledDate" label="Date" type="date" defaultValue={v.scheduledDate} />
        <TextField name="scheduledTime" label="Time (24 h)" type="time" defaultValue={v.scheduledTime} />
        <TextField
          name="timeZone"
          label="Time zone"
          defaultValue={v.timeZone}
          hint="Where the machine stands, e.g. Europe/Berlin."
          spellCheck={false}
        />
      </div>
      <Field name="conditionAsFound" label="Condition as found" hint="Printed on the report.">
        <textarea className={`${inputClass} py-2`} rows={2} defaultValue={v.conditionAsFound} />
      </Field>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField name="nextRecheckOn" label="Next re-check" type="date" defaultValue={v.nextRecheckOn} />
      </div>
      <Field name="notes" label="Notes for the installer">
        <textarea className={`${inputClass} py-2`} rows={3} defaultValue={v.notes} />
      </Field>
    </Form>
  );
}

/** Assign or change the installer; both the new and the previous installer are e-mailed. */
export function AssignInstallerForm({
  jobId,
  current,
  installers,
}: {
  jobId: string;
  current: string | null;
  installers: { id: string; name: string }[];
}) {
  return (
    <Form
      action={updateJobAction}
      submitLabel={current ? "Change the installer" : "Assign"}
      successMessage="Saved; the installer is e-mailed."
      resetOnSuccess={false}
      variant="secondary"
      aria-label="Assign the installer"
    >
      <input type="hidden" name="jobId" value={jobId} />
      <SelectField
        name="assignedInstallerId"
        label="Installer"
        placeholder="Not assigned"
        defaultValue={current ?? ""}
        options={installers.map((i) => ({ value: i.id, label: i.name }))}
      />
    </Form>
  );
}

/** The two moves that ask for a reason first, in a form opened below the buttons; cancelling is final. */
const REASONED_MOVES = [
  {
    move: "hold",
    opener: "Put on hold…",
    tone: "text-graphite-800 ring-graphite-300",
    submitLabel: "Put on hold",
    successMessage: "On hold.",
    variant: "secondary",
    reasonLabel: "Why (optional)",
    placeholder: "Crane out of service until …",
    note: null,
  },
  {
    move: "cancel",
    opener: "Cancel the job…",
    tone: "text-fail-700 ring-fail-600/40",
    submitLabel: "Cancel the job",
    successMessage: "Cancelled.",
    variant: "danger",
    reasonLabel: "Reason (required)",
    placeholder: "Customer postponed the machine move",
    note: "A cancelled job is kept and stays readable, with its readings; it takes no more changes.",
  },
] as const;

/** Put on hold (reason optional), release, or cancel (reason required; final). */
export function JobMoveControls({
  jobId,
  mayHold,
  mayRelease,
  mayCancel,
}: {
  jobId: string;
  mayHold: boolean;
  mayRelease: boolean;
  mayCancel: boolean;
}) {
  const [open, setOpen] = useState<"hold" | "cancel" | null>(null);
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-2">
        {mayRelease ? (
          <Form
            action={moveJobAction}
            submitLabel="Release from hold"
            successMessage="Released."
            aria-label="Release from hold"
          >
            <HiddenFields values={{ jobId, action: "release" }} />
          </Form>
        ) : null}
        {REASONED_MOVES.filter((o) => (o.move === "hold" ? mayHold : mayCancel)).map((o) => (
          <button
            key={o.move}
            type="button"
            className={`min-h-touch rounded-md px-3 text-sm font-medium ring-1 ${o.tone}`}
            aria-expanded={open === o.move}
            onClick={() => setOpen(open === o.move ? null : o.move)}
          >
            {o.opener}
          </button>
        ))}
      </div>
      {REASONED_MOVES.filter((o) => o.move === open).map((o) => (
        <Form
          key={o.move}
          action={moveJobAction}
          schema={jobMoveFormSchema}
          submitLabel={o.submitLabel}
          successMessage={o.successMessage}
          variant={o.variant}
          aria-label={o.submitLabel}
        >
          <HiddenFields values={{ jobId, action: o.move }} />
          <TextField name="reason" label={o.reasonLabel} placeholder={o.placeholder} />
          {o.note ? <p className="text-sm text-graphite-600">{o.note}</p> : null}
        </Form>
      ))}
    </div>
  );
}
