// The helpers that check and shape a fit's result fields. Non-finite values per IEEE 754-2019
// §6.1 (infinities) and §6.2 (NaN); key order per ECMAScript 2024 §10.1.11.1 (creation order).
import { describe, expect, it } from "vitest";
import { assertFiniteFields, GeometryError } from "@/geometry";
import { pickFields } from "@/geometry/json";
import { thrownAs } from "../thrown";

describe("assertFiniteFields", () => {
  it.each([Infinity, -Infinity, NaN])("names the first top-level field that is %s", (bad) => {
    const result = { n: 3, slope_um_per_m: 1.5, angle_arcsec: bad, residuals_um: [bad] };
    const e = thrownAs(GeometryError, () => assertFiniteFields(result, "the tram"));
    expect(e.code).toBe("bad_number");
    expect(e.message).toBe("the tram's angle_arcsec is beyond the number range; check the units");
  });

  it("passes finite numbers and leaves arrays and other values to the caller", () => {
    expect(() =>
      assertFiniteFields({ a: 0, b: -1e308, c: Number.MIN_VALUE, d: [NaN], e: null, f: "x" }, "the sweep"),
    ).not.toThrow();
  });
});

describe("pickFields", () => {
  it("keeps only the named fields, in the order named, values untouched", () => {
    const residuals = [1, 2];
    const r = { n: 4, tir_um: 2.5, residuals_um: residuals, slope_um_per_m: -0 };
    const picked = pickFields(r, ["slope_um_per_m", "tir_um", "residuals_um"]);
    expect(Object.keys(picked)).toEqual(["slope_um_per_m", "tir_um", "residuals_um"]);
    expect(Object.is(picked.slope_um_per_m, -0)).toBe(true);
    expect(picked.residuals_um).toBe(residuals);
  });
});
