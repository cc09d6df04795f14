"use client";

import { createInstrumentAction } from "@/app/(app)/registers/actions";
import { SelectField, TextField } from "@/components/ui/field";
import { Form } from "@/components/ui/form";
import { instrumentCreateSchema } from "@/lib/validations/registers";

const QUANTITIES = [
  { value: "length", label: "Length" },
  { value: "angle", label: "Angle" },
];
const UNITS = [
  { value: "mm", label: "mm" },
  { value: "in", label: "in" },
  { value: "um", label: "µm" },
  { value: "arcsec", label: "arcsec" },
];

export function InstrumentForm() {
  return (
    <Form
      action={createInstrumentAction}
      schema={instrumentCreateSchema}
      submitLabel="Add instrument"
      successMessage="Instrument added to the register."
    >
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <TextField name="kind" label="Kind" placeholder="Dial test indicator" />
        <TextField name="serial" label="Serial" numeric />
        <TextField name="maker" label="Maker" />
        <SelectField name="quantityKind" label="Measures" options={QUANTITIES} defaultValue="length" />
        <TextField name="resolution" label="Resolution" inputMode="decimal" numeric />
        <TextField
          name="standardUncertainty"
          label="Standard uncertainty (k = 1)"
          inputMode="decimal"
          numeric
        />
        <SelectField name="unit" label="Unit of these numbers" options={UNITS} defaultValue="mm" />
        <TextField name="rangeMin" label="Reads from (optional)" inputMode="decimal" numeric />
        <TextField name="rangeMax" label="Reads to (optional)" inputMode="decimal" numeric />
        <TextField name="certificateRef" label="Certificate" />
        <TextField name="calibratedOn" label="Calibrated on" type="date" />
        <TextField name="calibrationDueOn" label="Calibration due" type="date" />
      </div>
    </Form>
  );
}
