"use client";

import {
  createCustomerAction,
  createHeadAction,
  createInstrumentAction,
  createMachineAction,
  createSiteAction,
} from "@/app/(app)/registers/actions";
import { FieldsForm, type FieldSpec } from "@/components/ui/form-fields";
import type { ActionResult } from "@/lib/actions";
import {
  customerCreateSchema,
  headCreateSchema,
  instrumentCreateSchema,
  machineCreateSchema,
  siteCreateSchema,
} from "@/lib/validations/registers";

/**
 * What each register's "Add" form sends (its server action and the schema both sides check) and
 * what it adds, so every such form words its button and its confirmation the same way.
 */
const ADD = {
  customer: { action: createCustomerAction, schema: customerCreateSchema, thing: "customer" },
  site: { action: createSiteAction, schema: siteCreateSchema, thing: "site" },
  machine: { action: createMachineAction, schema: machineCreateSchema, thing: "host machine" },
  head: { action: createHeadAction, schema: headCreateSchema, thing: "head" },
  instrument: { action: createInstrumentAction, schema: instrumentCreateSchema, thing: "instrument" },
} satisfies Record<
  string,
  { action: (raw: unknown) => Promise<ActionResult<unknown>>; schema: unknown; thing: string }
>;

/** "Add customer" … "Customer added." and, where the new row needs a next step, what it is. */
export function AddForm({
  to,
  fields,
  next,
}: {
  to: keyof typeof ADD;
  fields: readonly FieldSpec[];
  /** What to do next, said after the confirmation ("record where it is mounted on its page"). */
  next?: string;
}) {
  const { action, schema, thing } = ADD[to];
  const added = `${thing.charAt(0).toUpperCase()}${thing.slice(1)} added`;
  return (
    <FieldsForm<unknown>
      action={action}
      schema={schema}
      submitLabel={`Add ${thing}`}
      successMessage={next ? `${added}; ${next}.` : `${added}.`}
      fields={fields}
    />
  );
}
