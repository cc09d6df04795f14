"use client";

import { updateIssuerSettingsAction } from "@/app/(app)/registers/settings/actions";
import { FormFields } from "@/components/ui/form-fields";
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
      <FormFields
        columns={2}
        fields={[
          {
            name: "name",
            label: "Company name",
            defaultValue: current.name,
            hint: "Required before a report can be issued.",
          },
          {
            name: "contactEmail",
            label: "Contact e-mail",
            type: "email",
            defaultValue: current.contactEmail,
          },
          {
            name: "address",
            label: "Postal address",
            hint: "Required before a report can be issued.",
            rows: 3,
            defaultValue: current.address,
          },
          { name: "contactPhone", label: "Contact phone", defaultValue: current.contactPhone, numeric: true },
          {
            name: "accreditation",
            label: "Accreditation (if any)",
            hint: "Body, number and scope as your certificate states them; leave empty if not accredited.",
            rows: 2,
            defaultValue: current.accreditation,
          },
          {
            name: "reproductionStatement",
            label: "Statement about partial reproduction",
            hint: "Printed at the end of every report.",
            rows: 3,
            defaultValue: current.reproductionStatement,
          },
        ]}
      />
    </Form>
  );
}
