// Tram in two planes with the bar reversed. Checked against NIST StRD "Norris" (certified slope
// 1.00211681802045, sd 4.29796848199937e-4) read as one bar position, the other position built from
// it by hand (marked): the mean cancels the bar's part, half the difference is the bar's part, and
// U = 2·½·√(u₀² + u₁₈₀²) (JCGM 100, two independent inputs with sensitivity ½).
import { describe, expect, it } from "vitest";
import { fitTram, fitTramPlanes, GeometryError, readTramCsv } from "@/geometry";
import { runCli, tempFiles } from "./cli-helpers";
import { NORRIS_X, NORRIS_Y } from "./reference-data";

const { file } = tempFiles("tram");

const B1 = 1.00211681802045; // µm/mm
const SD_B1 = 4.29796848199937e-4;

describe("fitTramPlanes", () => {
  it("Norris at 0°, its mirror about a 0.4 µm/mm tram at 180° (hand-built): tram, bar part and U", () => {
    const t = 0.4; // µm/mm: the spindle's tram in XZ; the 180° readings are 2·t·x − y.
    const y180 = NORRIS_X.map((x, i) => 2 * t * x - NORRIS_Y[i]!);
    const plane = [...NORRIS_X.map(() => "XZ" as const), ...NORRIS_X.map(() => "XZ" as const)];
    const r = fitTramPlanes({
      travelMm: [...NORRIS_X, ...NORRIS_X],
      readingUm: [...NORRIS_Y, ...y180],
      plane,
      barDeg: [...NORRIS_X.map(() => 0), ...NORRIS_X.map(() => 180)],
    });
    expect(r.planes).toHaveLength(1);
    const xz = r.planes[0]!;
    expect(xz.slope_um_per_m).toBeCloseTo(t * 1000, 8);
    expect(xz.bar_um_per_m!).toBeCloseTo((B1 - t) * 1000, 8);
    // Both positions have Norris's certified sd: U = 2·½·√2·sd = √2·sd (µm/mm → ×1000 µm/m).
    expect(Math.abs(xz.slope_U_um_per_m / (Math.SQRT2 * SD_B1 * 1000) - 1)).toBeLessThan(1e-9);
    expect(r.warnings).toEqual([]);
  });

  it("one bar position per plane stands alone with a warning; the single-plane tram is unchanged", () => {
    const text = [
      "travel,reading,plane",
      ...NORRIS_X.map((x, i) => `${x},${NORRIS_Y[i]},yz`),
      "0,0,XZ",
      "100,5,XZ",
      "200,10.2,XZ",
    ].join("\n");
    const data = readTramCsv(text, { travelUnits: "mm", readingUnits: "um" });
    const r = fitTramPlanes({ ...data, plane: data.plane! });
    expect(r.planes.map((p) => p.plane)).toEqual(["XZ", "YZ"]);
    expect(r.planes[1]!.slope_um_per_m / 1000).toBeCloseTo(B1, 12);
    expect(r.planes[1]!.bar_um_per_m).toBeUndefined();
    expect(r.warnings).toHaveLength(2);
    const single = fitTram({ travelMm: NORRIS_X, readingUm: NORRIS_Y });
    expect(Math.abs(single.slope_um_per_m / 1000 / B1 - 1)).toBeLessThan(1e-12);
  });

  it("bad plane or bar position names the row; the CLI prints planes", async () => {
    expect(() =>
      readTramCsv("travel,reading,plane\n0,1,XY\n", { travelUnits: "mm", readingUnits: "um" }),
    ).toThrow(/row 2, column plane: 'XY' is not XZ or YZ/);
    expect(() =>
      readTramCsv("travel,reading,plane,bar_deg\n0,1,XZ,90\n", { travelUnits: "mm", readingUnits: "um" }),
    ).toThrow(/row 2, column bar_deg: 90 is not 0 or 180/);
    expect(() =>
      fitTramPlanes({ travelMm: [1, 1, 1], readingUm: [1, 2, 3], plane: ["XZ", "XZ", "XZ"] }),
    ).toThrow(GeometryError);
    const f = file(
      "t.csv",
      "travel,reading,plane,bar_deg\n0,0,XZ,0\n100,3,XZ,0\n200,6.1,XZ,0\n0,0,XZ,180\n100,1,XZ,180\n200,2,XZ,180\n",
    );
    const { code, stdout } = await runCli("tram", f);
    expect(code).toBe(0);
    const j = JSON.parse(stdout);
    expect(Object.keys(j.planes[0])).toEqual([
      "plane",
      "slope_um_per_m",
      "slope_U_um_per_m",
      "angle_arcsec",
      "bar_um_per_m",
    ]);
    // Hand-derived: slopes 30.5 and 10 µm/m → tram 20.25, bar 10.25 µm/m.
    expect(j.planes[0].slope_um_per_m).toBeCloseTo(20.25, 9);
    expect(j.planes[0].bar_um_per_m).toBeCloseTo(10.25, 9);
  });
});
