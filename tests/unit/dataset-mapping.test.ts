// The browser's automatic column matching for uploads (components/datasets/kinds.ts). The column
// names are the product's own CSV formats (geometry/README.md, "CSV formats").
import { describe, expect, it } from "vitest";
import { COLUMNS, guessMapping, normaliseHeader, PRESENTATION } from "@/components/datasets/kinds";
import { CSV_COLUMNS } from "@/geometry/csv/columns";
import { CSV_FORMAT_OF, DATASET_KINDS } from "@/lib/domain/datasets";

describe("the form's columns are geometry's", () => {
  it("lists exactly the readers' columns, in their order, with their required and number flags", () => {
    for (const kind of DATASET_KINDS) {
      expect(COLUMNS[kind].map((c) => [c.name, c.required, c.numeric, Boolean(c.allowEmpty)])).toEqual(
        CSV_COLUMNS[CSV_FORMAT_OF[kind]].map((c) => [
          c.name,
          c.required,
          c.kind === "number",
          Boolean(c.allowEmpty),
        ]),
      );
      // A label for a column the readers no longer have would be dead text.
      expect(Object.keys(PRESENTATION[kind]).sort()).toEqual(
        CSV_COLUMNS[CSV_FORMAT_OF[kind]].map((c) => c.name).sort(),
      );
    }
  });
});

describe("guessMapping", () => {
  it("maps the format's own header names exactly, in any order and case", () => {
    const m = guessMapping("sphere_probe", ["Z", "x", " Y ", "secondary_deg", "PRIMARY_DEG"]);
    expect(m).toMatchObject({ primary_deg: 4, secondary_deg: 3, x: 1, y: 2, z: 0, point: -1, tool_mm: -1 });
  });

  it("maps common other spellings, with units in brackets ignored", () => {
    const m = guessMapping("sphere_probe", ["C (deg)", "A (deg)", "X [mm]", "Y [mm]", "Z [mm]", "Pt"]);
    expect(m).toMatchObject({ primary_deg: 0, secondary_deg: 1, x: 2, y: 3, z: 4, point: 5 });
    expect(
      guessMapping("test_part", [
        "Feature",
        "Characteristic",
        "Nom",
        "Actual",
        "Lower Tol",
        "Upper Tol",
        "Units",
      ]),
    ).toEqual({
      feature: 0,
      characteristic: 1,
      nominal: 2,
      measured: 3,
      lower_tol: 4,
      upper_tol: 5,
      unit: 6,
    });
  });

  it("never maps one file column to two of ours; an exact name wins over another column's alias", () => {
    // "x" is tram's alias for travel, but here a column is literally named travel.
    const m = guessMapping("tram", ["x", "travel", "reading"]);
    expect(m).toEqual({ travel: 1, reading: 2, note: -1, plane: -1, bar_deg: -1 });
    const values = Object.values(guessMapping("sphere_probe", ["a", "b", "c"])).filter((i) => i >= 0);
    expect(new Set(values).size).toBe(values.length);
  });

  it("leaves a column unmapped (−1) when nothing matches", () => {
    expect(guessMapping("sweep", ["foo", "bar"])).toEqual({ angle_deg: -1, reading: -1 });
  });

  it("every format lists its required columns as the product defines them", () => {
    const required = (k: keyof typeof COLUMNS) => COLUMNS[k].filter((c) => c.required).map((c) => c.name);
    expect(required("sphere_probe")).toEqual(["primary_deg", "secondary_deg", "x", "y", "z"]);
    expect(required("tram")).toEqual(["travel", "reading"]);
    expect(required("sweep")).toEqual(["angle_deg", "reading"]);
    expect(required("test_part")).toEqual([
      "feature",
      "characteristic",
      "nominal",
      "measured",
      "lower_tol",
      "upper_tol",
    ]);
    expect(normaliseHeader("Lower-Tol (mm)")).toBe("lowertol");
  });
});
