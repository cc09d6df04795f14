"use client";

import { AddForm } from "@/components/registers/add-form";
import { optionsOf } from "@/components/ui/field";

type Opt = { id: string; label: string };

export function CustomerForm() {
  return (
    <AddForm
      to="customer"
      fields={[
        { name: "name", label: "Customer name" },
        { name: "contactEmail", label: "Contact e-mail", type: "email" },
      ]}
    />
  );
}

export function SiteForm({ customers }: { customers: Opt[] }) {
  return (
    <AddForm
      to="site"
      fields={[
        { name: "customerId", label: "Customer", placeholder: "Choose…", options: optionsOf(customers) },
        { name: "name", label: "Site name" },
        { name: "address", label: "Address" },
      ]}
    />
  );
}

export function MachineForm({ sites }: { sites: Opt[] }) {
  return (
    <AddForm
      to="machine"
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
  );
}

const AXES = ["A", "B", "C"].map((a) => ({ value: a, label: a }));

export function HeadForm() {
  return (
    <AddForm
      to="head"
      next="record where it is mounted on its page"
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
  );
}
