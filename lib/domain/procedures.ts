/**
 * Procedures: the kinds of step a procedure can hold, and what a multi-point step derives from
 * its points. db/schema.ts builds its enums from these arrays; forms, labels and the checklist
 * read them from here.
 */
import { closedSet } from "./closed-set";

/**
 * How a step's value is obtained.
 * - direct: one reading of the quantity itself.
 * - angle_over_distance: an indicator reading over a travel, turned into an angle.
 * - sweep_flatness: derived from an uploaded sweep.
 * - check: a yes/no answer (stored as value 1 = yes, 0 = no, with the word in text_value).
 * - multi_point: readings at named points (clock positions 12/3/6/9, or N equal points); the
 *   judged value is derived from them (see MULTI_POINT_RESULTS); the points are kept in inputs.
 * - record: a value with its own unit kept for the record and not judged (torque applied, shim
 *   thickness), with free text beside it (where the shims went).
 * - note: text only (stored as value 0 with the text in text_value); never judged.
 */
export const { values: STEP_KINDS, labels: STEP_KIND_LABELS } = closedSet({
  direct: "Single reading",
  angle_over_distance: "Angle from a reading over a distance",
  sweep_flatness: "From an uploaded sweep",
  check: "Yes / no check",
  multi_point: "Readings at several points",
  record: "Value for the record",
  note: "Note",
});
export type StepKind = (typeof STEP_KINDS)[number];

/** Step kinds whose value is judged against limits. */
export const JUDGED_STEP_KINDS: readonly StepKind[] = [
  "direct",
  "angle_over_distance",
  "sweep_flatness",
  "check",
  "multi_point",
];

/**
 * What a multi-point step derives from its points.
 * - tir: total indicator reading, largest minus smallest reading (run-out).
 * - mean: the arithmetic mean of the points.
 * - flatness: spread of the readings about the least-squares plane through them (face readings
 *   at clock positions).
 */
export const { values: MULTI_POINT_RESULTS, labels: MULTI_POINT_RESULT_LABELS } = closedSet({
  tir: "Total indicator reading (largest − smallest)",
  mean: "Mean of the points",
  flatness: "Flatness about the best-fit plane",
});
export type MultiPointResult = (typeof MULTI_POINT_RESULTS)[number];

/** The usual point sets a procedure offers (clock positions seen from the operator's side). */
export const CLOCK_POINTS_4 = ["12", "3", "6", "9"] as const;
export const CLOCK_POINTS_8 = ["12", "1:30", "3", "4:30", "6", "7:30", "9", "10:30"] as const;

/**
 * Where a limit comes from, in the database enum's order, with the words every page, form and the
 * report print ("Limit: Maker's manual: HC-40 manual §4.2"). The note beside it names the clause,
 * the document or why a figure is common practice.
 */
export const { values: LIMIT_SOURCES, labels: LIMIT_SOURCE_LABELS } = closedSet({
  standard: "Standard",
  maker_manual: "Maker's manual",
  common_practice: "Common practice",
  customer_spec: "Customer specification",
});
export type LimitSource = (typeof LIMIT_SOURCES)[number];
