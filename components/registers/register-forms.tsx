"use client";

import { AddForm } from "@/components/registers/add-form";
import { pickField, type FieldSpec } from "@/components/ui/form-fields";

type Opt = { id: string; label: string };

const CUSTOMER_FIELDS: readonly FieldSpec[] = [
  { name: "name", label: "Customer name" },
  { name: "contactEmail", label: "Contact e-mail", type: "email" },
];

/** A site's own fields, after the customer it belongs to. */
const SITE_FIELDS: readonly FieldSpec[] = [
  { name: "name", label: "Site name" },
  { name: "address", label: "Address" },
];

/** A host machine's own fields, after the site it stands at. */
const MACHINE_FIELDS: readonly FieldSpec[] = [
  { name: "name", label: "Machine name" },
  { name: "kind", label: "Kind", defaultValue: "machining centre" },
  { name: "serial", label: "Serial", numeric: true },
  { name: "builder", label: "Builder" },
  { name: "model", label: "Model" },
  { name: "control", label: "Control" },
];

const AXES = ["A", "B", "C"].map((a) => ({ value: a, label: a }));

const HEAD_FIELDS: readonly FieldSpec[] = [
  { name: "serial", label: "Serial", numeric: true },
  { name: "maker", label: "Maker" },
  { name: "model", label: "Model" },
  { name: "massKg", label: "Mass (kg)", decimal: true },
  { name: "primaryAxis", label: "Primary (rotary) axis letter", options: AXES, defaultValue: "C" },
  { name: "secondaryAxis", label: "Secondary (tilt) axis letter", options: AXES, defaultValue: "A" },
  { name: "nominalPivotLengthMm", label: "Nominal pivot length (mm)", decimal: true },
  { name: "toolAxisOffsetMm", label: "Tool-axis offset (mm)", decimal: true, defaultValue: "0" },
];

export function CustomerForm() {
  return <AddForm to="customer" fields={CUSTOMER_FIELDS} />;
}

export function SiteForm({ customers }: { customers: Opt[] }) {
  return <AddForm to="site" fields={[pickField("customerId", "Customer", customers), ...SITE_FIELDS]} />;
}

export function MachineForm({ sites }: { sites: Opt[] }) {
  return <AddForm to="machine" fields={[pickField("siteId", "Site", sites), ...MACHINE_FIELDS]} />;
}

export function HeadForm() {
  return <AddForm to="head" next="record where it is mounted on its page" fields={HEAD_FIELDS} />;
}
