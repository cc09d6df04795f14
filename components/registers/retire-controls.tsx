"use client";

import { recordCalibrationAction, retireRegisterRowAction } from "@/app/(app)/registers/actions";
import { FieldsForm, HiddenFields, pickField } from "@/components/ui/form-fields";
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
      <HiddenFields values={{ register, id, retired: retired ? "false" : "true" }} />
    </Form>
  );
}

/** A recalibration as its certificate states it; the instrument's history keeps every one. */
export function CalibrationForm({ instruments }: { instruments: { id: string; label: string }[] }) {
  return (
    <FieldsForm
      action={recordCalibrationAction}
      schema={calibrationFormSchema}
      submitLabel="Record calibration"
      successMessage="Calibration recorded; the instrument is in use."
      fields={[
        pickField("instrumentId", "Instrument", instruments),
        { name: "calibratedOn", label: "Calibrated on", type: "date" },
        { name: "dueOn", label: "Due on", type: "date" },
        { name: "certificateRef", label: "Certificate number" },
        { name: "laboratory", label: "Laboratory" },
      ]}
    />
  );
}
