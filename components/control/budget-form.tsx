"use client";

import { recordBudgetInputsAction } from "@/app/(app)/jobs/[id]/control/actions";
import { SelectField, TextField } from "@/components/ui/field";
import { Form } from "@/components/ui/form";

/** The engineer picks the budget's Type B inputs from the register: probe, reference sphere, presetter, temperature. */
export function BudgetInputsForm({
  jobId,
  analysisId,
  instruments,
  current,
}: {
  jobId: string;
  analysisId: string;
  instruments: ReadonlyArray<{ id: string; label: string }>;
  current: { probe: string; sphere: string; presetter: string; deltaTK: string; alphaPpmPerK: string };
}) {
  const options = instruments.map((i) => ({ value: i.id, label: i.label }));
  return (
    <Form
      action={recordBudgetInputsAction}
      aria-label="Choose the budget's inputs"
      submitLabel="Use these inputs"
      successMessage="Budget inputs recorded."
      resetOnSuccess={false}
      variant="secondary"
    >
      <input type="hidden" name="jobId" value={jobId} />
      <input type="hidden" name="analysisId" value={analysisId} />
      <div className="grid gap-x-4 sm:grid-cols-3">
        <SelectField
          name="probeInstrumentId"
          label="Probe"
          hint="Its calibration uncertainty, not the scatter the fit already sees."
          placeholder="None"
          options={options}
          defaultValue={current.probe}
        />
        <SelectField
          name="sphereInstrumentId"
          label="Reference sphere"
          placeholder="None"
          options={options}
          defaultValue={current.sphere}
        />
        <SelectField
          name="presetterInstrumentId"
          label="Tool-length presetter"
          placeholder="None"
          options={options}
          defaultValue={current.presetter}
        />
        <TextField
          name="deltaTK"
          label="Temperature half-range ΔT (K)"
          inputMode="decimal"
          numeric
          defaultValue={current.deltaTK}
        />
        <TextField
          name="alphaPpmPerK"
          label="Expansion coefficient α (10⁻⁶/K)"
          hint="Empty: steel, 11.5."
          inputMode="decimal"
          numeric
          defaultValue={current.alphaPpmPerK}
        />
      </div>
    </Form>
  );
}
