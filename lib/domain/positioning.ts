/**
 * ISO 230-2 positioning of the head's rotary axes (geometry/rotary-positioning.ts): which axis a
 * test is about, and the quantities a procedure may set a limit for.
 */

/** The head's axes by their role: the primary (rotary) axis and the secondary (tilt) axis. */
export const HEAD_AXIS_ROLES = ["primary", "secondary"] as const;
export type HeadAxisRole = (typeof HEAD_AXIS_ROLES)[number];

export const HEAD_AXIS_ROLE_WORDS: Record<HeadAxisRole, string> = {
  primary: "primary (rotary) axis",
  secondary: "secondary (tilt) axis",
};

/**
 * The bidirectional quantities of ISO 230-2 a procedure may limit (arc seconds, upper limit only):
 * accuracy A, systematic positioning error E, mean bidirectional positioning error M,
 * repeatability R and reversal value B.
 */
export const POSITIONING_QUANTITIES = ["A", "E", "M", "R", "B"] as const;
export type PositioningQuantity = (typeof POSITIONING_QUANTITIES)[number];

export const POSITIONING_QUANTITY_WORDS: Record<PositioningQuantity, string> = {
  A: "Accuracy of positioning",
  E: "Systematic positioning error",
  M: "Mean bidirectional positioning error",
  R: "Repeatability of positioning",
  B: "Reversal value",
};
