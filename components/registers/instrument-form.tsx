"use client";

import { AddForm } from "@/components/registers/add-form";
import { closedSetOptions } from "@/components/ui/field";
import { QUANTITY_KIND_LABELS, QUANTITY_KINDS } from "@/lib/domain/units";

const QUANTITIES = closedSetOptions(QUANTITY_KINDS, QUANTITY_KIND_LABELS);
const UNITS = [
  { value: "mm", label: "mm" },
  { value: "in", label: "in" },
  { value: "um", label: "µm" },
  { value: "arcsec", label: "arcsec" },
];

export function InstrumentForm() {
  return (
    <AddForm
      to="instrument"
      fields={[
        { name: "kind", label: "Kind", placeholder: "Dial test indicator" },
        { name: "serial", label: "Serial", numeric: true },
        { name: "maker", label: "Maker" },
        { name: "quantityKind", label: "Measures", options: QUANTITIES, defaultValue: "length" },
        { name: "resolution", label: "Resolution", decimal: true },
        { name: "standardUncertainty", label: "Standard uncertainty (k = 1)", decimal: true },
        { name: "unit", label: "Unit of these numbers", options: UNITS, defaultValue: "mm" },
        { name: "rangeMin", label: "Reads from (optional)", decimal: true },
        { name: "rangeMax", label: "Reads to (optional)", decimal: true },
        { name: "certificateRef", label: "Certificate" },
        { name: "calibratedOn", label: "Calibrated on", type: "date" },
        { name: "calibrationDueOn", label: "Calibration due", type: "date" },
      ]}
    />
  );
}
