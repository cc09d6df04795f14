// An instrument's range in the register form: optional, in the unit of the form, in order.
import { describe, expect, it } from "vitest";
import { instrumentCreateSchema, instrumentPatchSchema } from "@/lib/validations/registers";

const base = {
  kind: "Dial test indicator",
  serial: "DTI-9",
  quantityKind: "length",
  resolution: "0.0001",
  standardUncertainty: "0.00005",
  unit: "in",
  calibrationDueOn: "2027-01-01",
};

describe("instrument range", () => {
  it("is optional, and read with a decimal comma", () => {
    expect(instrumentCreateSchema.parse({ ...base, rangeMin: "", rangeMax: "" })).toMatchObject({
      rangeMin: undefined,
      rangeMax: undefined,
    });
    expect(instrumentCreateSchema.parse({ ...base, rangeMin: "-0,015", rangeMax: "0.015" })).toMatchObject({
      rangeMin: -0.015,
      rangeMax: 0.015,
    });
  });
  it("refuses a top below the bottom, naming rangeMax, and a range patch without its unit", () => {
    const r = instrumentCreateSchema.safeParse({ ...base, rangeMin: "0.5", rangeMax: "0.1" });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.path).toEqual(["rangeMax"]);
    const p = instrumentPatchSchema.safeParse({ rangeMax: 1 });
    expect(p.success).toBe(false);
    expect(p.error!.issues[0]!.path).toEqual(["unit"]);
    expect(instrumentPatchSchema.safeParse({ rangeMax: 1, unit: "mm" }).success).toBe(true);
  });
});
