// The upload form's expanded-uncertainty fields (U, k = 2, JCGM 100:2008 §6.2.1: a non-negative
// quantity): a blank field states none, anything else must be a number within range, and a refusal
// is a 422 naming the field and its unit.
import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { parseUploadForm } from "@/lib/storage/parse-dataset";
import { thrownAs } from "./thrown";

const cases = [
  { kind: "test_part", field: "uncertainty_mm", unit: "(mm)", min: "≥ 0 mm", max: 10 },
  {
    kind: "rotary_positioning",
    field: "uncertainty_arcsec",
    unit: "(arc seconds)",
    min: "≥ 0″",
    max: 36_000,
    extra: { axis: "primary" },
  },
] as const;

describe.each(cases)("$field", ({ kind, field, unit, min, max, ...rest }) => {
  const form = (value: string) => ({
    kind,
    phase: "pre",
    ...("extra" in rest ? rest.extra : {}),
    [field]: value,
  });
  const refusal = (value: string) => thrownAs(AppError, () => parseUploadForm(form(value)));

  it("reads a blank field as none stated, and a number as that number", () => {
    expect(parseUploadForm(form(""))[field]).toBeUndefined();
    expect(parseUploadForm(form("0"))[field]).toBe(0);
    expect(parseUploadForm(form(String(max)))[field]).toBe(max);
  });

  it("refuses a word, a negative value and one above the range, naming the field", () => {
    const word = refusal("about two");
    expect(word.status).toBe(422);
    expect(word.issues).toEqual([{ field, message: `the expanded uncertainty must be a number ${unit}` }]);
    expect(refusal("-0.5").issues).toEqual([{ field, message: `the expanded uncertainty must be ${min}` }]);
    expect(refusal(String(max * 2)).issues?.map((i) => i.field)).toEqual([field]);
  });
});
