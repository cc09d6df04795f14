"use client";

import { recordCalibrationAction, retireRegisterRowAction } from "@/app/(app)/registers/actions";
import { Field, inputClass } from "@/components/ui/field";
import { Form } from "@/components/ui/form";
import { calibrationFormSchema, retireFormSchema, RETIRABLE_REGISTERS } from "@/lib/validations/registers";

/**
 * Retire a register row (it stays on the jobs that name it and leaves the pickers for new work),
 * or bring it back. One small button per row.
 */
export function RetireButton({
  register,
  id,
  retired,
  label,
}: {
  register: (typeof RETIRABLE_REGISTERS)[number];
  id: string;
  retired: boolean;
  /** What the row is, for the button's accessible name: "Retire head TH-1907". */
  label: string;
}) {
  return (
    <Form
      action={retireRegisterRowAction}
      schema={retireFormSchema}
      submitLabel={retired ? "Bring back" : "Retire"}
      aria-label={`${retired ? "Bring back" : "Retire"} ${label}`}
      variant="secondary"
      resetOnSuccess={false}
      successMessage={retired ? "Back in use." : "Retired."}
      className="space-y-0"
    >
      <input type="hidden" name="register" value={register} />
      <input type="hidden" name="id" value={id} />
      <input type="hidden" name="retired" value={retired ? "false" : "true"} />
    </Form>
  );
}

/** A recalibration as its certificate states it; the instrument's history keeps every one. */
export function CalibrationForm({ instruments }: { instruments: { id: string; label: string }[] }) {
  return (
    <Form
      action={recordCalibrationAction}
      schema={calibrationFormSchema}
      submitLabel="Record calibration"
      successMessage="Calibration recorded; the instrument is in use."
    >
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-5">
        <Field name="instrumentId" label="Instrument">
          <select name="instrumentId" className={inputClass} defaultValue="">
            <option value="">Choose…</option>
            {instruments.map((i) => (
              <option key={i.id} value={i.id}>
                {i.label}
              </option>
            ))}
          </select>
        </Field>
        <Field name="calibratedOn" label="Calibrated on">
          <input name="calibratedOn" type="date" className={inputClass} />
        </Field>
        <Field name="dueOn" label="Due on">
          <input name="dueOn" type="date" className={inputClass} />
        </Field>
        <Field name="certificateRef" label="Certificate number">
          <input name="certificateRef" className={inputClass} />
        </Field>
        <Field name="laboratory" label="Laboratory">
          <input name="laboratory" className={inputClass} />
        </Field>
      </div>
    </Form>
  );
}
