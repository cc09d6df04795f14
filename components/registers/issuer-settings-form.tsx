"use client";

import { updateIssuerSettingsAction } from "@/app/(app)/registers/settings/actions";
import { Field, inputClass, TextField } from "@/components/ui/field";
import { Form } from "@/components/ui/form";
import { issuerSettingsSchema, type IssuerSettingsInput } from "@/lib/validations/issuer";

/** The issuer's details (administrator): printed at the head of every report issued from now on. */
export function IssuerSettingsForm({ current }: { current: IssuerSettingsInput }) {
  return (
    <Form
      action={updateIssuerSettingsAction}
      schema={issuerSettingsSchema}
      submitLabel="Save issuer details"
      successMessage="Saved. Reports issued from now on print these details; issued reports keep theirs."
      resetOnSuccess={false}
    >
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          name="name"
          label="Company name"
          defaultValue={current.name}
          hint="Required before a report can be issued."
        />
        <TextField
          name="contactEmail"
          label="Contact e-mail"
          type="email"
          defaultValue={current.contactEmail}
        />
        <Field name="address" label="Postal address" hint="Required before a report can be issued.">
          <textarea className={inputClass} rows={3} defaultValue={current.address} />
        </Field>
        <TextField name="contactPhone" label="Contact phone" defaultValue={current.contactPhone} numeric />
        <Field
          name="accreditation"
          label="Accreditation (if any)"
          hint="Body, number and scope as your certificate states them; leave empty if not accredited."
        >
          <textarea className={inputClass} rows={2} defaultValue={current.accreditation} />
        </Field>
        <Field
          name="reproductionStatement"
          label="Statement about partial reproduction"
          hint="Printed at the end of every report."
        >
          <textarea className={inputClass} rows={3} defaultValue={current.reproductionStatement} />
        </Field>
      </div>
    </Form>
  );
}
