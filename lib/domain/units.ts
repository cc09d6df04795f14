/** Units: the system a person or a control works in, and what a reading or an instrument measures. */
import { closedSet } from "./closed-set";

/** Metric: lengths in mm; inch: lengths in inch. Angles are in arc seconds (or degrees) in both. */
export const { values: UNIT_SYSTEMS, labels: UNIT_SYSTEM_LABELS } = closedSet({
  metric: "Metric",
  inch: "Inch",
});
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

/** What is measured; fixes the canonical unit a value is stored in (mm or arc seconds). */
export const { values: QUANTITY_KINDS, labels: QUANTITY_KIND_LABELS } = closedSet({
  length: "Length",
  angle: "Angle",
});
export type QuantityKind = (typeof QUANTITY_KINDS)[number];
