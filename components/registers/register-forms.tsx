"use client";

import {
  createCustomerAction,
  createHeadAction,
  createMachineAction,
  createSiteAction,
} from "@/app/(app)/registers/actions";
import { Field, inputClass } from "@/components/ui/field";
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
        <Field name="name" label="Customer name">
          <input name="name" className={inputClass} />
        </Field>
        <Field name="contactEmail" label="Contact e-mail">
          <input name="contactEmail" type="email" className={inputClass} />
        </Field>
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
        <Field name="customerId" label="Customer">
          <select name="customerId" className={inputClass} defaultValue="">
            <option value="">Choose…</option>
            {customers.map((c) => (
              <option key={c.id} value={c.id}>
                {c.label}
              </option>
            ))}
          </select>
        </Field>
        <Field name="name" label="Site name">
          <input name="name" className={inputClass} />
        </Field>
        <Field name="address" label="Address">
          <input name="address" className={inputClass} />
        </Field>
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
        <Field name="siteId" label="Site">
          <select name="siteId" className={inputClass} defaultValue="">
            <option value="">Choose…</option>
            {sites.map((s) => (
              <option key={s.id} value={s.id}>
                {s.label}
              </option>
            ))}
          </select>
        </Field>
        <Field name="name" label="Machine name">
          <input name="name" className={inputClass} />
        </Field>
        <Field name="kind" label="Kind">
          <input name="kind" className={inputClass} defaultValue="machining centre" />
        </Field>
        <Field name="serial" label="Serial">
          <input name="serial" className={`${inputClass} num`} />
        </Field>
        <Field name="builder" label="Builder">
          <input name="builder" className={inputClass} />
        </Field>
        <Field name="model" label="Model">
          <input name="model" className={inputClass} />
        </Field>
        <Field name="control" label="Control">
          <input name="control" className={inputClass} />
        </Field>
      </div>
    </Form>
  );
}

export function HeadForm() {
  const axes = ["A", "B", "C"] as const;
  return (
    <Form
      action={createHeadAction}
      schema={headCreateSchema}
      submitLabel="Add head"
      successMessage="Head added; record where it is mounted on its page."
    >
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <Field name="serial" label="Serial">
          <input name="serial" className={`${inputClass} num`} />
        </Field>
        <Field name="maker" label="Maker">
          <input name="maker" className={inputClass} />
        </Field>
        <Field name="model" label="Model">
          <input name="model" className={inputClass} />
        </Field>
        <Field name="massKg" label="Mass (kg)">
          <input name="massKg" inputMode="decimal" className={`${inputClass} num`} />
        </Field>
        <Field name="primaryAxis" label="Primary (rotary) axis letter">
          <select name="primaryAxis" className={inputClass} defaultValue="C">
            {axes.map((a) => (
              <option key={a}>{a}</option>
            ))}
          </select>
        </Field>
        <Field name="secondaryAxis" label="Secondary (tilt) axis letter">
          <select name="secondaryAxis" className={inputClass} defaultValue="A">
            {axes.map((a) => (
              <option key={a}>{a}</option>
            ))}
          </select>
        </Field>
        <Field name="nominalPivotLengthMm" label="Nominal pivot length (mm)">
          <input name="nominalPivotLengthMm" inputMode="decimal" className={`${inputClass} num`} />
        </Field>
        <Field name="toolAxisOffsetMm" label="Tool-axis offset (mm)">
          <input
            name="toolAxisOffsetMm"
            inputMode="decimal"
            defaultValue="0"
            className={`${inputClass} num`}
          />
        </Field>
      </div>
    </Form>
  );
}
