/**
 * The cautions the starter procedures show at each hazard, one short paragraph each, written once
 * here so every step that needs one says the same thing. Each defers to the manuals and the law.
 */
const DEFER = "The machine builder's and head maker's manuals, local codes and licensed practice come first.";

export const CAUTION = {
  lockOut: `Lock out and tag out the machine's power before hands go near couplers, motor shafts or the spindle nose, and prove it dead. ${DEFER}`,
  handsClear: `Hands away from the spline and the spindle nose whenever an axis can move under power; jog at low feed with the enabling device in reach. ${DEFER}`,
  lifting: `The head is heavy: rated lifting gear at the maker's lifting points only, nobody under the load, fingers out of the gap while the spline engages. ${DEFER}`,
  hanging: `Once the stand is off, the head hangs from the spindle: keep hands and body out from under it and support it as its maker directs until every bolt is tight. ${DEFER}`,
  counterbalance: `A heavy head changes the load on the vertical axis: set its counterbalance or brake for the head's weight before the axis is released, or it may drop. ${DEFER}`,
  powerUp: `Axes can move on power-up and while they reference: everyone clear of the head and the working area, a hand near the emergency stop. ${DEFER}`,
  spindleInhibit: `Inhibit the spindle (not just stop it) while an indicator is on the test bar; a start would throw the indicator. ${DEFER}`,
} as const;
