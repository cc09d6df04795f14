"use client";

import { createInstrumentAction } from "@/app/(app)/registers/actions";
import { Field, inputClass } from "@/components/ui/field";
import { Form } from "@/components/ui/form";
import { instrumentCreateSchema } from "@/lib/validations/registers";

export function InstrumentForm() {
  return (
    <Form
      action={createInstrumentAction}
      schema={instrumentCreateSchema}
      submitLabel="Add instrument"
      successMessage="Instrument added to the register."
    >
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <Field name="kind" label="Kind">
          <input name="kind" className={inputClass} placeholder="Dial test indicator" />
        </Field>
        <Field name="serial" label="Serial">
          <input name="serial" className={`${inputClass} num`} />
        </Field>
        <Field name="maker" label="Maker">
          <input name="maker" className={inputClass} />
        </Field>
        <Field name="quantityKind" label="Measures">
          <select name="quantityKind" className={inputClass} defaultValue="length">
            <option value="length">Length</option>
            <option value="angle">Angle</option>
          </select>
        </Field>
        <Field name="resolution" label="Resolution">
          <input name="resolution" inputMode="decimal" className={`${inputClass} num`} />
        </Field>
        <Field name="standardUncertainty" label="Standard uncertainty (k = 1)">
          <input name="standardUncertainty" inputMode="decimal" className={`${inputClass} num`} />
        </Field>
        <Field name="unit" label="Unit of both">
          <select name="unit" className={inputClass} defaultValue="mm">
            <option value="mm">mm</option>
            <option value="in">in</option>
            <option value="um">µm</option>
            <option value="arcsec">arcsec</option>
          </select>
        </Field>
        <Field name="certificateRef" label="Certificate">
          <input name="certificateRef" className={inputClass} />
        </Field>
        <Field name="calibratedOn" label="Calibrated on">
          <input name="calibratedOn" type="date" className={inputClass} />
        </Field>
        <Field name="calibrationDueOn" label="Calibration due">
          <input name="calibrationDueOn" type="date" className={inputClass} />
        </Field>
      </div>
    </Form>
  );
}
