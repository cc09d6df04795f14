/**
 * ISO 230-2 positioning of the head's rotary axes (geometry/rotary-positioning.ts): which axis a
 * test is about, and the quantities a procedure may set a limit for.
 */
import { closedSet } from "./closed-set";

/** The head's axes by their role: the primary (rotary) axis and the secondary (tilt) axis. */
export const { values: HEAD_AXIS_ROLES, labels: HEAD_AXIS_ROLE_WORDS } = closedSet({
  primary: "primary (rotary) axis",
  secondary: "secondary (tilt) axis",
});
export type HeadAxisRole = (typeof HEAD_AXIS_ROLES)[number];

/**
 * The bidirectional quantities of ISO 230-2 a procedure may limit (arc seconds, upper limit only):
 * accuracy A, systematic positioning error E, mean bidirectional positioning error M,
 * repeatability R and reversal value B.
 */
export const { values: POSITIONING_QUANTITIES, labels: POSITIONING_QUANTITY_WORDS } = closedSet({
  A: "Accuracy of positioning",
  E: "Systematic positioning error",
  M: "Mean bidirectional positioning error",
  R: "Repeatability of positioning",
  B: "Reversal value",
});
export type PositioningQuantity = (typeof POSITIONING_QUANTITIES)[number];
