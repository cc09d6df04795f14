"use client";

import { recordControlValuesAction } from "@/app/(app)/jobs/[id]/control/actions";
import { closedSetOptions, SelectField, TextField } from "@/components/ui/field";
import { UNIT_SYSTEM_LABELS, UNIT_SYSTEMS } from "@/lib/domain/units";
import { Form } from "@/components/ui/form";
import {
  CONTROL_VALUE_DEFS,
  CONTROL_VALUE_STAGE_LABELS,
  type ControlValueKey,
  type ControlValueStage,
} from "@/lib/domain/control-values";

/**
 * The engineer types the control's values for one stage, in the control's units: lengths in mm or
 * inch, angles in degrees. An empty field is not recorded. As left, each field shows the value to
 * enter beside it, and the units are the ones recorded as found.
 */
export function ControlValuesForm({
  jobId,
  stage,
  unitSystem,
  lockUnits,
  defaults,
  hints,
}: {
  jobId: string;
  stage: ControlValueStage;
  unitSystem: "metric" | "inch";
  lockUnits: boolean;
  defaults: Partial<Record<ControlValueKey, string>>;
  hints: Partial<Record<ControlValueKey, string>>;
}) {
  const lengthUnit = unitSystem === "inch" ? "in" : "mm";
  return (
    <Form
      action={recordControlValuesAction}
      aria-label={`Record the values ${CONTROL_VALUE_STAGE_LABELS[stage].toLowerCase()}`}
      submitLabel={`Record values ${CONTROL_VALUE_STAGE_LABELS[stage].toLowerCase()}`}
      successMessage="Recorded."
      resetOnSuccess={false}
    >
      <input type="hidden" name="jobId" value={jobId} />
      <input type="hidden" name="stage" value={stage} />
      {lockUnits ? (
        <input type="hidden" name="unitSystem" value={unitSystem} />
      ) : (
        <SelectField
          name="unitSystem"
          label="The control works in"
          hint="Lengths are typed in these units; angles always in degrees."
          defaultValue={unitSystem}
          options={closedSetOptions(UNIT_SYSTEMS, UNIT_SYSTEM_LABELS)}
        />
      )}
      <div className="grid gap-x-4 sm:grid-cols-2">
        {CONTROL_VALUE_DEFS.map((d) => (
          <TextField
            key={d.key}
            name={d.key}
            label={`${d.label} (${d.kind === "angle" ? "°" : lockUnits ? lengthUnit : "mm or in"})`}
            hint={hints[d.key]}
            numeric
            inputMode="decimal"
            autoComplete="off"
            defaultValue={defaults[d.key] ?? ""}
          />
        ))}
      </div>
      <TextField name="note" label="Note (optional)" defaultValue="" />
    </Form>
  );
}
