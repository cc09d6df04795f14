"use client";

import { mountHeadAction } from "@/app/(app)/registers/actions";
import { Field, inputClass } from "@/components/ui/field";
import { Form } from "@/components/ui/form";

export function MountHeadForm({
  headId,
  current,
  machines,
}: {
  headId: string;
  current: string | null;
  machines: ReadonlyArray<{ id: string; label: string }>;
}) {
  return (
    <Form
      action={mountHeadAction}
      submitLabel="Record the move"
      resetOnSuccess={false}
      successMessage="Recorded in the head's history."
    >
      <input type="hidden" name="headId" value={headId} />
      <Field
        name="machineId"
        label="Mounted on"
        hint="Record where the head is now; the move is kept in its history."
      >
        <select name="machineId" className={inputClass} defaultValue={current ?? ""}>
          <option value="">Not mounted (in the shop or in transit)</option>
          {machines.map((m) => (
            <option key={m.id} value={m.id}>
              {m.label}
            </option>
          ))}
        </select>
      </Field>
    </Form>
  );
}
