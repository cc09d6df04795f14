// Tool lengths in a sphere-probe CSV are range-checked (0 … 2000 mm): a tool of −1e6 mm is a typing
// or unit error, refused with its row and column rather than fitted.
import { describe, expect, it } from "vitest";
import { readSphereProbeCsv, TOOL_MM_MAX } from "@/geometry";

const head = "primary_deg,secondary_deg,x,y,z,tool_mm\n";

describe("sphere-probe tool_mm range", () => {
  it("accepts 0 and 2000 mm, refuses −1e6 and 2000.5 mm naming the row", () => {
    expect(readSphereProbeCsv(`${head}0,0,1,2,3,0\n90,0,1,2,3,2000\n`, { units: "mm" }).toolMm).toEqual(
      Float64Array.from([0, 2000]),
    );
    expect(TOOL_MM_MAX).toBe(2000);
    expect(() => readSphereProbeCsv(`${head}0,0,1,2,3,100\n90,0,1,2,3,-1e6\n`, { units: "mm" })).toThrow(
      /row 3, column tool_mm: tool length -1000000 mm is outside 0 … 2000 mm/,
    );
    expect(() => readSphereProbeCsv(`${head}0,0,1,2,3,2000.5\n`, { units: "in" })).toThrow(
      /row 2, column tool_mm/,
    );
  });
});
