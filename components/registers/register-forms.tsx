"use client";

import {
  createCustomerAction,
  createHeadAction,
  createMachineAction,
  createSiteAction,
} from "@/app/(app)/registers/actions";
import { optionsOf } from "@/components/ui/field";
import { FormFields } from "@/components/ui/form-fields";
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
      <FormFields
        columns={2}
        fields={[
          { name: "name", label: "Customer name" },
          { name: "contactEmail", label: "Contact e-mail", type: "email" },
        ]}
      />
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
      <FormFields
        columns={3}
        fields={[
          { name: "customerId", label: "Customer", placeholder: "Choose…", options: optionsOf(customers) },
          { name: "name", label: "Site name" },
          { name: "address", label: "Address" },
        ]}
      />
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
      <FormFields
        columns={4}
        fields={[
          { name: "siteId", label: "Site", placeholder: "Choose…", options: optionsOf(sites) },
          { name: "name", label: "Machine name" },
          { name: "kind", label: "Kind", defaultValue: "machining centre" },
          { name: "serial", label: "Serial", numeric: true },
          { name: "builder", label: "Builder" },
          { name: "model", label: "Model" },
          { name: "control", label: "Control" },
        ]}
      />
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
      <FormFields
        columns={4}
        fields={[
          { name: "serial", label: "Serial", numeric: true },
          { name: "maker", label: "Maker" },
          { name: "model", label: "Model" },
          { name: "massKg", label: "Mass (kg)", decimal: true },
          { name: "primaryAxis", label: "Primary (rotary) axis letter", options: AXES, defaultValue: "C" },
          { name: "secondaryAxis", label: "Secondary (tilt) axis letter", options: AXES, defaultValue: "A" },
          { name: "nominalPivotLengthMm", label: "Nominal pivot length (mm)", decimal: true },
          { name: "toolAxisOffsetMm", label: "Tool-axis offset (mm)", decimal: true, defaultValue: "0" },
        ]}
      />
    </Form>
  );
}
