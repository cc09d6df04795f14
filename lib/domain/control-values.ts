/**
 * The control loop's closed sets: the control-neutral kinematic values an engineer reads from and
 * enters into the control, each tied to the fitted head parameter that corrects it (see
 * geometry/README.md, "The head model"), and the two stages at which the control's values are
 * recorded. Lengths are stored in mm and angles in degrees, the quantities controls hold.
 */
// Relative import: db/schema.ts loads this file under drizzle-kit, without the app's path alias.
import type { HeadParameterKey } from "../../geometry/head/config";
import { closedSet } from "./closed-set";

/** As found before any change, and as left after the engineer entered the new values. */
export const { values: CONTROL_VALUE_STAGES, labels: CONTROL_VALUE_STAGE_LABELS } = closedSet({
  as_found: "As found",
  as_left: "As left",
});
export type ControlValueStage = (typeof CONTROL_VALUE_STAGES)[number];

export const CONTROL_VALUE_KEYS = [
  "pivot_length_mm",
  "tool_offset_along_tilt_mm",
  "tool_offset_across_tilt_mm",
  "secondary_offset_mm",
  "primary_zero_deg",
  "secondary_zero_deg",
  "secondary_squareness_deg",
  "secondary_yaw_deg",
  "primary_tilt_s_deg",
  "primary_tilt_n_deg",
] as const;
export type ControlValueKey = (typeof CONTROL_VALUE_KEYS)[number];

/** Values of one stage: canonical mm for a length key, degrees for an angle key; a key left out was not recorded. */
export type ControlValueSet = Partial<Record<ControlValueKey, number>>;

export interface ControlValueDef {
  readonly key: ControlValueKey;
  readonly kind: "length" | "angle";
  /** The fitted parameter whose value is this quantity's correction. */
  readonly parameter: HeadParameterKey;
  readonly label: string;
}

export const CONTROL_VALUE_DEFS: readonly ControlValueDef[] = [
  {
    key: "pivot_length_mm",
    kind: "length",
    parameter: "pivot_length_error_um",
    label: "Pivot length (tilt axis to gauge point)",
  },
  {
    key: "tool_offset_along_tilt_mm",
    kind: "length",
    parameter: "tip_offset_s_um",
    label: "Tool-axis offset along the tilt axis",
  },
  {
    key: "tool_offset_across_tilt_mm",
    kind: "length",
    parameter: "tip_offset_n_um",
    label: "Tool-axis offset across the tilt axis",
  },
  {
    key: "secondary_offset_mm",
    kind: "length",
    parameter: "secondary_offset_um",
    label: "Tilt-axis offset from the primary axis",
  },
  {
    key: "primary_zero_deg",
    kind: "angle",
    parameter: "primary_zero_arcsec",
    label: "Primary axis zero offset",
  },
  {
    key: "secondary_zero_deg",
    kind: "angle",
    parameter: "secondary_zero_arcsec",
    label: "Tilt axis zero offset",
  },
  {
    key: "secondary_squareness_deg",
    kind: "angle",
    parameter: "secondary_tilt_arcsec",
    label: "Squareness of the tilt axis to the primary",
  },
  {
    key: "secondary_yaw_deg",
    kind: "angle",
    parameter: "secondary_yaw_arcsec",
    label: "Tilt axis turned about the primary",
  },
  {
    key: "primary_tilt_s_deg",
    kind: "angle",
    parameter: "primary_tilt_s_arcsec",
    label: "Primary axis tilt about the tilt axis",
  },
  {
    key: "primary_tilt_n_deg",
    kind: "angle",
    parameter: "primary_tilt_n_arcsec",
    label: "Primary axis tilt across the tilt axis",
  },
];
