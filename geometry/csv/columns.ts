/**
 * The columns of the dataset CSV formats, as the readers check them: header name, number or
 * text, required or optional. The one list: the upload form (components/datasets/kinds.ts) takes
 * its columns from here and adds only labels and header aliases. Formats: geometry/README.md.
 */
import type { ColumnSpec } from "./table";

export const SPHERE_PROBE_COLUMNS: readonly ColumnSpec[] = [
  { name: "primary_deg", kind: "number", required: true },
  { name: "secondary_deg", kind: "number", required: true },
  { name: "x", kind: "number", required: true },
  { name: "y", kind: "number", required: true },
  { name: "z", kind: "number", required: true },
  { name: "point", kind: "number", required: false },
  { name: "repeat", kind: "number", required: false },
  { name: "temp_c", kind: "number", required: false },
  { name: "tool_mm", kind: "number", required: false },
];

export const TRAM_COLUMNS: readonly ColumnSpec[] = [
  { name: "travel", kind: "number", required: true },
  { name: "reading", kind: "number", required: true },
  { name: "note", kind: "text", required: false },
  { name: "plane", kind: "text", required: false },
  { name: "bar_deg", kind: "number", required: false },
];

export const SWEEP_COLUMNS: readonly ColumnSpec[] = [
  { name: "angle_deg", kind: "number", required: true },
  { name: "reading", kind: "number", required: true },
];

export const TEST_PART_COLUMNS: readonly ColumnSpec[] = [
  { name: "feature", kind: "text", required: true },
  { name: "characteristic", kind: "text", required: true },
  { name: "nominal", kind: "number", required: true },
  { name: "measured", kind: "number", required: true },
  { name: "lower_tol", kind: "number", required: true, allowEmpty: true },
  { name: "upper_tol", kind: "number", required: true },
  { name: "unit", kind: "text", required: false },
];

export const ROTARY_POSITIONING_COLUMNS: readonly ColumnSpec[] = [
  { name: "target_deg", kind: "number", required: true },
  { name: "run", kind: "number", required: true },
  { name: "direction", kind: "text", required: true },
  { name: "measured_deg", kind: "number", required: true },
  { name: "axis", kind: "text", required: false },
];

/** Every format's columns by dataset kind (the database's dataset_kind values). */
export const CSV_COLUMNS = {
  sphere_probe: SPHERE_PROBE_COLUMNS,
  tram: TRAM_COLUMNS,
  sweep: SWEEP_COLUMNS,
  test_part: TEST_PART_COLUMNS,
  rotary_positioning: ROTARY_POSITIONING_COLUMNS,
} as const;

export type { ColumnSpec };
