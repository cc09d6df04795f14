/**
 * Starter library: the periodic re-check of an installed head and the check after a crash.
 * Shipped with the product (not demo data); the limits are the installation's (see
 * installation.ts for their sources).
 */
import type { ProcedureInput } from "@/lib/validations/procedures";
import { CAUTION } from "./cautions";
import { COLLAR_TIR, SPINDLE_RUNOUT, tramStep } from "./installation";

const offsets = (when: string) =>
  ({
    title: `Zero offsets ${when}`,
    kind: "record",
    instructions: `Read each head axis's zero offset from the control ${when}. Enter the primary's value; the secondary's goes in the text.`,
    recordUnit: "°",
  }) as const;

export const RECHECK: ProcedureInput = {
  name: "Starter: periodic re-check of a two-axis head",
  description:
    "The head's geometry checked at its service interval, with nothing taken apart. Shipped with Trammel as a starting point.",
  jobKinds: ["reverification"],
  steps: [
    {
      title: "Machine at working temperature",
      kind: "record",
      instructions: "Run the warm-up cycle and let the head stand before measuring. Enter the soak time.",
      recordUnit: "min",
      safety: CAUTION.handsClear,
    },
    offsets("as found"),
    {
      title: "Head bolts at torque",
      kind: "record",
      instructions:
        "Check the head-to-collar bolts with a torque wrench set to the maker's torque. Enter the setting.",
      recordUnit: "N·m",
      safety: CAUTION.lockOut,
    },
    SPINDLE_RUNOUT,
    {
      title: "Find the high point of the test bar",
      kind: "check",
      instructions: "Turn the test bar slowly by hand under the indicator and mark its high point.",
      limitSource: "common_practice",
      limitSourceNote: "Reading at 0° and 180° from the high point cancels the bar's own run-out.",
      safety: CAUTION.spindleInhibit,
    },
    tramStep("XZ"),
    tramStep("YZ"),
    {
      title: "Notes for the customer",
      kind: "note",
      instructions: "Anything found that is not yet out of limit but is moving, and what to watch.",
    },
  ],
};

export const AFTER_CRASH: ProcedureInput = {
  name: "Starter: check a two-axis head after a crash",
  description:
    "What to prove before a head that has been hit cuts again. Compare with the head's history. Shipped with Trammel as a starting point.",
  jobKinds: ["after_crash"],
  steps: [
    {
      title: "Lock out the machine",
      kind: "check",
      instructions: "Power isolated, locked and tagged before anyone reaches into the head's area.",
      limitSource: "common_practice",
      limitSourceNote: "Required before any hand work on the head.",
      safety: CAUTION.lockOut,
    },
    {
      title: "Look for damage",
      kind: "check",
      instructions:
        "Inspect the head, collar, covers and cables: cracks, shifted covers, marks on the collar joint, leaks. Answer yes when nothing is damaged; photograph whatever is.",
      limitSource: "common_practice",
      limitSourceNote: "Visible damage stops the check: call the head maker.",
      safety: CAUTION.lockOut,
      photoRequired: true,
    },
    {
      title: "Couplers have not slipped",
      kind: "check",
      instructions: "The witness marks across each coupler still line up; the clamp screws are at torque.",
      limitSource: "common_practice",
      limitSourceNote: "A slipped coupler moves the axis's zero.",
      safety: CAUTION.lockOut,
    },
    offsets("as found"),
    COLLAR_TIR,
    {
      title: "Reference the axes and compare the zero",
      kind: "check",
      instructions:
        "Reference each head axis and bring it to its mechanical zero: the control's zero still meets the mechanical zero.",
      limitSource: "common_practice",
      limitSourceNote: "The head maker's zeroing method applies.",
      safety: CAUTION.powerUp,
    },
    SPINDLE_RUNOUT,
    tramStep("XZ"),
    tramStep("YZ"),
    offsets("as left"),
    {
      title: "Findings",
      kind: "note",
      instructions: "What was hit, what was found, what was changed, and whether the head may cut again.",
    },
  ],
};
