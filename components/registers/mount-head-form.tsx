"use client";

import { mountHeadAction } from "@/app/(app)/registers/actions";
import { optionsOf, SelectField } from "@/components/ui/field";
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
      <SelectField
        name="machineId"
        label="Mounted on"
        hint="Record where the head is now; the move is kept in its history."
        placeholder="Not mounted (in the shop or in transit)"
        options={optionsOf(machines)}
        defaultValue={current ?? ""}
      />
    </Form>
  );
}
