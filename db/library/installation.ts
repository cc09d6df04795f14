/**
 * Starter library: installing a two-axis head on a machine's spindle. Shipped with the product
 * (not demo data). Limits marked "common practice" are the trade's editable defaults, with no
 * published source; the figures noted "from memory" still need checking against a printed source
 * before anyone quotes them as more than that.
 */
import type { ProcedureInput } from "@/lib/validations/procedures";
import { CAUTION } from "./cautions";

/** Shared judged steps, used again by the re-check and the after-crash check. */
export const COLLAR_TIR = {
  title: "Collar face run-out at four clock positions",
  kind: "multi_point",
  instructions:
    "With the indicator on the spindle and its tip on the collar face near the outside edge, turn the spindle by hand and read at 12, 3, 6 and 9 o'clock (seen from the front of the machine). The step's value is the largest minus the smallest reading.",
  quantity: "Collar face run-out (TIR)",
  unit: "in",
  upper: 0.0005,
  points: ["12", "3", "6", "9"],
  pointResult: "tir",
  // 0.0005 in TIR on the collar face: the trade's usual figure (common practice).
  limitSource: "common_practice",
  limitSourceNote:
    "0.0005 in TIR is the trade's usual default; use the head maker's figure where it gives one.",
  safety: CAUTION.spindleInhibit,
  photoRequired: true,
} as const satisfies ProcedureInput["steps"][number];

export const SPINDLE_RUNOUT = {
  title: "Spindle run-out at the nose",
  kind: "reading",
  instructions:
    "Indicate the spindle's locating bore or taper mouth and turn the spindle slowly by hand through a full turn. Enter the total indicator reading.",
  quantity: "Spindle run-out (TIR)",
  unit: "in",
  upper: 0.0002,
  // 0.0002 in: from memory, a usual acceptance figure for a machining-centre spindle nose.
  limitSource: "common_practice",
  limitSourceNote:
    "0.0002 in TIR is a usual default for a spindle nose; the machine builder's figure comes first.",
  safety: CAUTION.spindleInhibit,
} as const satisfies ProcedureInput["steps"][number];

/**
 * Tram in one plane: the indicator on the spindle reads the test bar at two heights; the bar is
 * turned 180° and read again, and the mean of the two cancels the bar's own run-out.
 */
export function tramStep(plane: "XZ" | "YZ") {
  return {
    title: `Tram in the ${plane} plane, bar read at 0° and 180°`,
    kind: "angle_over_distance",
    instructions: `Clamp the test bar in the head with its high point marked. In the ${plane} plane, read the bar at two heights 100 mm apart, turn the bar 180° and read again; enter the mean change of reading over the 100 mm. The step turns it into an angle.`,
    quantity: `Tram, ${plane} plane`,
    unit: "arcsec",
    lower: -25,
    upper: 25,
    distanceMm: 100,
    // 25″ ≈ 0.0005 in over a 4 in bar (atan(0.0127 / 101.6)): the trade's usual tram default,
    // from memory; the trigonometry itself is exact.
    limitSource: "common_practice",
    limitSourceNote:
      "About 0.0005 in over a 4 in bar (≈ 25″) is the trade's usual default; the head maker's figure comes first.",
    safety: CAUTION.spindleInhibit,
  } as const satisfies ProcedureInput["steps"][number];
}

export const INSTALLATION: ProcedureInput = {
  name: "Starter: install a two-axis head",
  description:
    "From a clean spindle to a referenced, trammed head. Shipped with Trammel as a starting point: adjust the limits to the head maker's figures and the customer's specification.",
  jobKinds: ["installation"],
  steps: [
    {
      title: "Lock out the machine",
      kind: "check",
      instructions:
        "Power isolated, locked and tagged; stored energy (air, hydraulics, counterweights) released or blocked as the machine builder describes.",
      limitSource: "common_practice",
      limitSourceNote: "Required before any hand work on the spindle.",
      safety: CAUTION.lockOut,
    },
    {
      title: "Clean and stone the spindle face",
      kind: "check",
      instructions:
        "Wipe the spindle face and locating bore with a lint-free cloth and solvent; draw a flat stone lightly across the face to lift burrs and dings, then clean again. Nothing raised may remain under the collar.",
      limitSource: "common_practice",
      limitSourceNote: "A burr under the collar shows up as run-out that no adjustment removes.",
      safety: CAUTION.lockOut,
      photoRequired: true,
    },
    {
      title: "Fit the adapter collar",
      kind: "record",
      instructions:
        "Seat the collar on its register and tighten its bolts evenly in a cross pattern to the maker's torque. Enter the torque applied.",
      recordUnit: "N·m",
      safety: CAUTION.lockOut,
    },
    COLLAR_TIR,
    {
      title: "Shims under the collar",
      kind: "record",
      instructions:
        "If the collar needed shims to come within its limit, enter the total thickness and, in the text, where each shim sits (clock position). Enter 0 if none.",
      recordUnit: "mm",
    },
    {
      title: "Line the collar up with the head",
      kind: "check",
      instructions:
        "Turn the collar so its key or dowel holes line up with the head's before the head comes near; the head must not be rotated on the spline to find them.",
      limitSource: "common_practice",
      limitSourceNote: "The head's manual shows the orientation.",
    },
    {
      title: "Bring the head up on its stand",
      kind: "reading",
      instructions:
        "Raise the head on its stand under the spindle until the spline engages. Before any bolt draws it closed, measure the gap between head and collar with feeler gauges.",
      quantity: "Head-to-collar gap before the bolts draw it closed",
      unit: "in",
      lower: 0.0625,
      upper: 0.125,
      // 1/16 to 1/8 in: the trade's usual gap while the spline engages (common practice).
      limitSource: "common_practice",
      limitSourceNote: "1/16 to 1/8 in is the trade's usual gap; follow the head maker where it differs.",
      safety: CAUTION.lifting,
    },
    {
      title: "Orientation mark to the front of the machine",
      kind: "check",
      instructions: "The head's orientation mark points to the front of the machine before the bolts go in.",
      limitSource: "common_practice",
      limitSourceNote: "The control's axis directions assume this orientation.",
      photoRequired: true,
    },
    {
      title: "Bolt the head to the collar",
      kind: "record",
      instructions:
        "Tighten the head's bolts in the maker's sequence, in stages, to the maker's torque. Enter the final torque.",
      recordUnit: "N·m",
      safety: CAUTION.lifting,
    },
    {
      title: "Motor plate on its dowels",
      kind: "check",
      instructions:
        "Each axis motor plate sits fully home on its dowels, its bolts tight; no gap shows at the plate.",
      limitSource: "common_practice",
      limitSourceNote: "A plate off its dowels misplaces the motor against its coupler.",
      safety: CAUTION.lockOut,
    },
    {
      title: "Couplers evenly spaced, left loose",
      kind: "check",
      instructions:
        "Set each coupler with even spacing between its halves and leave its clamp screws loose: they are tightened only after the axes are zeroed.",
      limitSource: "common_practice",
      limitSourceNote: "A coupler tightened before zeroing locks in the wrong zero.",
      safety: CAUTION.lockOut,
    },
    {
      title: "Counterbalance set for the head",
      kind: "record",
      instructions:
        "Set the vertical axis's counterbalance (pressure or weight) for the head as the machine builder specifies, before the axis is released. Enter the setting.",
      recordUnit: "bar",
      safety: CAUTION.counterbalance,
    },
    {
      title: "Remove the stand",
      kind: "check",
      instructions:
        "With every head bolt tight, lower and remove the stand; the head now hangs from the spindle.",
      limitSource: "common_practice",
      limitSourceNote: "The stand comes away only after the bolts are at torque.",
      safety: CAUTION.hanging,
    },
    {
      title: "Zero offsets before referencing",
      kind: "record",
      instructions:
        "Read each head axis's zero offset from the control before anything is changed. Enter the primary axis's value; the secondary's goes in the text.",
      recordUnit: "°",
    },
    {
      title: "Reference the axes to the head's mechanical zero",
      kind: "check",
      instructions:
        "With the couplers loose, bring each head axis to its mechanical zero (pins or marks as the head maker shows), reference the control, and confirm the control's zero meets the mechanical zero.",
      limitSource: "common_practice",
      limitSourceNote: "The head maker's zeroing method applies.",
      safety: CAUTION.powerUp,
    },
    {
      title: "Tighten the couplers",
      kind: "record",
      instructions:
        "Tighten each coupler's clamp screws to the maker's torque without turning the shafts. Enter the torque.",
      recordUnit: "N·m",
      safety: CAUTION.lockOut,
    },
    {
      title: "Zero offsets after referencing",
      kind: "record",
      instructions:
        "Read each head axis's zero offset again. Enter the primary's value; the secondary's goes in the text.",
      recordUnit: "°",
    },
    {
      title: "Move each axis through its range",
      kind: "check",
      instructions:
        "At low feed, move each head axis through its full range and back: no binding, noise or alarm, and the limits stop it where the head maker says.",
      limitSource: "common_practice",
      limitSourceNote: "A first motion check before any measurement.",
      safety: CAUTION.handsClear,
    },
    {
      title: "Thermal soak",
      kind: "record",
      instructions:
        "Run the spindle and axes in a warm-up cycle until temperatures settle, then let the head stand; measure only after. Enter the soak time.",
      recordUnit: "min",
      safety: CAUTION.handsClear,
    },
    SPINDLE_RUNOUT,
    {
      title: "Find the high point of the test bar",
      kind: "check",
      instructions:
        "Clamp the test bar, turn it slowly by hand under the indicator and mark its high point; it sets the 0° position for the tram readings.",
      limitSource: "common_practice",
      limitSourceNote: "Reading at 0° and 180° from the high point cancels the bar's own run-out.",
      safety: CAUTION.spindleInhibit,
    },
    tramStep("XZ"),
    tramStep("YZ"),
    {
      title: "Collar face after tightening",
      kind: "multi_point",
      instructions:
        "Read the collar face again at 8 positions round it with the head on. The step's value is its flatness about the best-fit plane, so a tilt of the whole face does not count.",
      quantity: "Collar face flatness",
      unit: "in",
      upper: 0.0005,
      points: ["12", "1:30", "3", "4:30", "6", "7:30", "9", "10:30"],
      pointResult: "flatness",
      // The same 0.0005 in default as the collar's run-out (common practice).
      limitSource: "common_practice",
      limitSourceNote: "The collar's 0.0005 in default; the head maker's figure comes first.",
      safety: CAUTION.spindleInhibit,
    },
    {
      title: "Hand over",
      kind: "note",
      instructions:
        "Guards back, tools out of the working area, lock-out removed by whoever applied it. Note anything the customer should know.",
    },
  ],
};
