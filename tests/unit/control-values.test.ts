// The control loop's view model: values to enter = as found + correction, in the control's units,
// and the flags on what was left. Conversions are checked against exact definitions outside the
// project: 1 in = 25.4 mm exactly (NIST SP 811, 2008, B.8) and 1° = 3600″ (SI Brochure, 9th ed.,
// Table 8). The sums are worked by hand beside each case.
import { describe, expect, it } from "vitest";
import { fitHead, headFitToJson, headPoseGrid, synthesiseSphereProbe } from "@/geometry";
import {
  controlLoop,
  controlValueText,
  correctionOf,
  flagTolerance,
  fromControlCanonical,
  toControlCanonical,
  unknownControlKeys,
  SIGN_CONVENTION,
} from "@/lib/control-values";
import { CONTROL_VALUE_DEFS, CONTROL_VALUE_KEYS } from "@/lib/domain/control-values";
import { headFitJson, param } from "./fit-builders";

type ControlLoopInput = Parameters<typeof controlLoop>[0];

const approved = headFitJson([
  param("pivot_length_error_um", 37.88, 1.2, "EZ0A"),
  param("tip_offset_n_um", -12.5, 0.8),
  param("secondary_zero_arcsec", 18, 0.5),
  param("secondary_yaw_arcsec", 0, null),
]);

/** The control loop against the approved fit above, in metric controls unless told. */
const loopOf = (
  asFound: ControlLoopInput["asFound"],
  asLeft: ControlLoopInput["asLeft"] = null,
  unitSystem: ControlLoopInput["unitSystem"] = "metric",
) => controlLoop({ asFound, asLeft, approvedFit: approved, unitSystem });
/** A control's row in a loop. */
const rowOf = (loop: ReturnType<typeof controlLoop>, key: string) => loop.rows.find((r) => r.key === key)!;
/** The row of one control setting in a loop where only it was found, at this value. */
const onlyRow = (key: string, asFound: number, unitSystem: ControlLoopInput["unitSystem"] = "metric") =>
  rowOf(loopOf({ [key]: asFound }, null, unitSystem), key);

describe("values to enter (worked by hand)", () => {
  it("adds the fitted length error in mm: 152.4000 mm + 37.88 µm = 152.43788 mm", () => {
    const loop = loopOf({ pivot_length_mm: 152.4 });
    const row = rowOf(loop, "pivot_length_mm");
    expect(row.correction).toBeCloseTo(0.03788, 12);
    expect(row.toEnter).toBeCloseTo(152.43788, 10);
    expect(row.iso).toBe("EZ0A");
    expect(row.toEnterText).toBe("152.4379 mm");
    expect(row.correctionText).toBe("+0.0379 mm");
    expect(loop.hasValuesToEnter).toBe(true);
  });

  it("keeps the sign: a negative offset lowers the value (0.0100 mm − 12.5 µm = −0.0025 mm)", () => {
    const row = onlyRow("tool_offset_across_tilt_mm", 0.01);
    expect(row.toEnter).toBeCloseTo(-0.0025, 12);
    expect(row.toEnterText).toBe("−0.0025 mm");
  });

  it("adds angles in degrees: 90.00000° + 18″ = 90.00500° (1° = 3600″, SI Brochure Table 8)", () => {
    const row = onlyRow("secondary_zero_deg", 90);
    expect(row.correction).toBeCloseTo(0.005, 14);
    expect(row.toEnter).toBeCloseTo(90.005, 12);
    expect(row.toEnterText).toBe("90.00500° (324018.0″)");
  });

  it("leaves a parameter held at zero unchanged and says so", () => {
    const row = onlyRow("secondary_yaw_deg", 0.01);
    expect(row.held).toBe(true);
    expect(row.toEnter).toBe(0.01);
    expect(row.correctionText).toBe("held (no change)");
  });

  it("computes nothing before approval or without an as-found value", () => {
    const before = controlLoop({
      asFound: { pivot_length_mm: 152.4 },
      asLeft: null,
      approvedFit: null,
      unitSystem: "metric",
    });
    expect(before.hasValuesToEnter).toBe(false);
    expect(before.rows.every((r) => r.toEnter === null && r.toEnterText === "—")).toBe(true);
    const noFound = loopOf({});
    expect(noFound.hasValuesToEnter).toBe(false);
  });

  it("shows inch controls in inch with mm beside (1 in = 25.4 mm exactly, NIST SP 811)", () => {
    // 6.00000 in = 152.4 mm; + 37.88 µm = 152.43788 mm = 6.0014913… in.
    const row = onlyRow("pivot_length_mm", 152.4, "inch");
    expect(row.asFoundText).toBe("6.00000 in (152.4000 mm)");
    expect(row.toEnterText).toBe("6.00149 in (152.4379 mm)");
    expect(toControlCanonical(6, "length", "inch")).toBeCloseTo(152.4, 12);
    expect(fromControlCanonical(25.4, "length", "inch")).toBeCloseTo(1, 14);
    expect(toControlCanonical(1.5, "angle", "inch")).toBe(1.5);
  });

  it("spells out the sign convention the sums follow", () => {
    expect(SIGN_CONVENTION).toContain("Value to enter = as found + correction");
    expect(controlValueText(-0.0001, "length", "metric", true)).toBe("−0.0001 mm");
  });
});

describe("as-left flags", () => {
  const asFound = { pivot_length_mm: 152.4, secondary_zero_deg: 90 };

  it("passes values that round to the shown digits of the value to enter", () => {
    // Value to enter 152.43788 mm; 152.4379 mm differs by 0.00002 mm < half of 0.0001 mm.
    const loop = loopOf(asFound, { pivot_length_mm: 152.4379, secondary_zero_deg: 90.005 });
    expect(loop.flagged).toEqual([]);
  });

  it("flags a value left different from the one computed, with the signed difference", () => {
    const loop = loopOf(asFound, { pivot_length_mm: 152.4479, secondary_zero_deg: 90.005 });
    expect(loop.flagged.map((r) => r.key)).toEqual(["pivot_length_mm"]);
    const row = loop.flagged[0]!;
    expect(row.flag).toBe("differs");
    expect(row.difference).toBeCloseTo(0.01002, 10);
    expect(row.differenceText).toBe("+0.0100 mm");
  });

  it("flags a value to enter that has no as-left value", () => {
    const loop = loopOf(asFound, { pivot_length_mm: 152.43788 });
    expect(loop.flagged.map((r) => [r.key, r.flag])).toEqual([["secondary_zero_deg", "not_left"]]);
  });

  it("flags nothing until an as-left set is recorded", () => {
    const loop = loopOf(asFound);
    expect(loop.flagged).toEqual([]);
  });

  it("uses half the last shown digit as tolerance: 0.00005 mm, 0.000005 in, 0.000005°", () => {
    expect(flagTolerance("length", "metric")).toBeCloseTo(0.00005, 15);
    expect(flagTolerance("length", "inch")).toBeCloseTo(0.000005 * 25.4, 15);
    expect(flagTolerance("angle", "metric")).toBeCloseTo(0.000005, 15);
    // 0.0001 in left above the value to enter is flagged on an inch control (0.00254 mm).
    const loop = loopOf({ pivot_length_mm: 152.4 }, { pivot_length_mm: 152.43788 + 0.00254 }, "inch");
    expect(loop.flagged[0]?.flag).toBe("differs");
  });
});

describe("the correction closes the loop", () => {
  it("a head probed against the as-found model gives the error that the value to enter removes", () => {
    // Forward model of geometry/README.md: a real pivot 40 µm longer than the control holds and a
    // tilt-axis zero 25″ off. Fitting the synthetic probe data recovers them; adding them to the
    // as-found values gives the real head (the same check as re-probing with the new values).
    const config = { primary: "C", secondary: "A", pivotLengthMm: 152.4 } as const;
    const poses = headPoseGrid({ primarySteps: 8, secondaryDeg: [-90, -45, 0, 45, 90], toolMm: [0, 100] });
    const data = synthesiseSphereProbe(
      { ...config, toolDirection: [0, 0, -1] },
      { pivot_length_error_um: 40, secondary_zero_arcsec: 25 },
      poses,
    );
    const f = headFitToJson(fitHead({ ...config, toolDirection: [0, 0, -1] }, data));
    const loop = controlLoop({
      asFound: { pivot_length_mm: 152.4, secondary_zero_deg: 0 },
      asLeft: null,
      approvedFit: f,
      unitSystem: "metric",
    });
    expect(rowOf(loop, "pivot_length_mm").toEnter).toBeCloseTo(152.44, 6);
    expect(rowOf(loop, "secondary_zero_deg").toEnter).toBeCloseTo(25 / 3600, 8);
  });

  it("maps every control value to one fitted parameter", () => {
    expect(CONTROL_VALUE_DEFS.map((d) => d.key)).toEqual([...CONTROL_VALUE_KEYS]);
    expect(new Set(CONTROL_VALUE_DEFS.map((d) => d.parameter)).size).toBe(CONTROL_VALUE_DEFS.length);
    expect(correctionOf(CONTROL_VALUE_DEFS[1]!, approved)).toBeNull();
    expect(unknownControlKeys({ pivot_length_mm: 1, pivot: 2 })).toEqual(["pivot"]);
  });
});

describe("the form's input", () => {
  const jobId = "4f3a1c2e-5b6d-4e7f-8a9b-0c1d2e3f4a5b";
  /** The form's fields for the as-found values in inch, with these values typed. */
  const asFoundInInch = (values: Record<string, string>) => ({
    jobId,
    stage: "as_found",
    unitSystem: "inch",
    ...values,
  });
  it("turns flat fields into one record and drops empty ones", async () => {
    const { controlValuesFormSchema } = await import("@/lib/validations/control-values");
    const r = controlValuesFormSchema.parse(
      asFoundInInch({ pivot_length_mm: "6,0000", secondary_zero_deg: "" }),
    );
    expect(r.record.values).toEqual({ pivot_length_mm: 6 });
    expect(r.record.unitSystem).toBe("inch");
  });

  it("names the field of a value out of range (2000 mm = 78.74 in) and asks for at least one", async () => {
    const { controlValuesFormSchema } = await import("@/lib/validations/control-values");
    const big = controlValuesFormSchema.safeParse(asFoundInInch({ pivot_length_mm: "80" }));
    expect(big.success).toBe(false);
    expect(big.error!.issues.map((i) => i.path.join("."))).toEqual(["pivot_length_mm"]);
    const none = controlValuesFormSchema.safeParse({ jobId, stage: "as_left", unitSystem: "metric" });
    expect(none.error!.issues.map((i) => i.message)).toContain("Enter at least one value.");
  });
});
