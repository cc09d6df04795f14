"use client";

import {
  createCustomerAction,
  createHeadAction,
  createMachineAction,
  createSiteAction,
} from "@/app/(app)/registers/actions";
import { optionsOf, SelectField, TextField } from "@/components/ui/field";
import { Form } from "@/components/ui/form";
import {
  customerCreateSchema,
  headCreateSchema,
  machineCreateSchema,
  siteCreateSchema,
} from "@/lib/validations/registers";

type Opt = { id: string; label: string };

export function CustomerForm() {
  return (
    <Form
      action={createCustomerAction}
      schema={customerCreateSchema}
      submitLabel="Add customer"
      successMessage="Customer added."
    >
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField name="name" label="Customer name" />
        <TextField name="contactEmail" label="Contact e-mail" type="email" />
      </div>
    </Form>
  );
}

export function SiteForm({ customers }: { customers: Opt[] }) {
  return (
    <Form
      action={createSiteAction}
      schema={siteCreateSchema}
      submitLabel="Add site"
      successMessage="Site added."
    >
      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField
          name="customerId"
          label="Customer"
          placeholder="Choose…"
          options={optionsOf(customers)}
        />
        <TextField name="name" label="Site name" />
        <TextField name="address" label="Address" />
      </div>
    </Form>
  );
}

export function MachineForm({ sites }: { sites: Opt[] }) {
  return (
    <Form
      action={createMachineAction}
      schema={machineCreateSchema}
      submitLabel="Add host machine"
      successMessage="Machine added."
    >
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <SelectField name="siteId" label="Site" placeholder="Choose…" options={optionsOf(sites)} />
        <TextField name="name" label="Machine name" />
        <TextField name="kind" label="Kind" defaultValue="machining centre" />
        <TextField name="serial" label="Serial" numeric />
        <TextField name="builder" label="Builder" />
        <TextField name="model" label="Model" />
        <TextField name="control" label="Control" />
      </div>
    </Form>
  );
}

const AXES = ["A", "B", "C"].map((a) => ({ value: a, label: a }));

export function HeadForm() {
  return (
    <Form
      action={createHeadAction}
      schema={headCreateSchema}
      submitLabel="Add head"
      successMessage="Head added; record where it is mounted on its page."
    >
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <TextField name="serial" label="Serial" numeric />
        <TextField name="maker" label="Maker" />
        <TextField name="model" label="Model" />
        <TextField name="massKg" label="Mass (kg)" inputMode="decimal" numeric />
        <SelectField
          name="primaryAxis"
          label="Primary (rotary) axis letter"
          options={AXES}
          defaultValue="C"
        />
        <SelectField
          name="secondaryAxis"
          label="Secondary (tilt) axis letter"
          options={AXES}
          defaultValue="A"
        />
        <TextField
          name="nominalPivotLengthMm"
          label="Nominal pivot length (mm)"
          inputMode="decimal"
          numeric
        />
        <TextField
          name="toolAxisOffsetMm"
          label="Tool-axis offset (mm)"
          inputMode="decimal"
          numeric
          defaultValue="0"
        />
      </div>
    </Form>
  );
}
