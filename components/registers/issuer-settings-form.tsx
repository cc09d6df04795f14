"use client";

import { updateIssuerSettingsAction } from "@/app/(app)/registers/settings/actions";
import { FieldsForm, type FieldsFormDefinition } from "@/components/ui/form-fields";
import { issuerSettingsSchema, type IssuerSettingsInput } from "@/lib/validations/issuer";

const ISSUER_FORM: FieldsFormDefinition<unknown> = {
  action: updateIssuerSettingsAction,
  schema: issuerSettingsSchema,
  submitLabel: "Save issuer details",
  successMessage: "Saved. Reports issued from now on print these details; issued reports keep theirs.",
  resetOnSuccess: false,
  columns: 2,
  fields: [
    {
      name: "name",
      label: "Company name",
      hint: "Required before a report can be issued.",
    },
    {
      name: "contactEmail",
      label: "Contact e-mail",
      type: "email",
    },
    {
      name: "address",
      label: "Postal address",
      hint: "Required before a report can be issued.",
      rows: 3,
    },
    { name: "contactPhone", label: "Contact phone", numeric: true },
    {
      name: "accreditation",
      label: "Accreditation (if any)",
      hint: "Body, number and scope as your certificate states them; leave empty if not accredited.",
      rows: 2,
    },
    {
      name: "reproductionStatement",
      label: "Statement about partial reproduction",
      hint: "Printed at the end of every report.",
      rows: 3,
    },
  ],
};

/** The issuer's details (administrator): printed at the head of every report issued from now on. */
export function IssuerSettingsForm({ current }: { current: IssuerSettingsInput }) {
  return <FieldsForm {...ISSUER_FORM} values={current} />;
}
