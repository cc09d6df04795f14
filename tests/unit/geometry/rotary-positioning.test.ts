// ISO 230-2 positioning statistics against a public worked data set: the ISO 230-2 test report in
// the open-source repository paulscherrerinstitute/ecmccfg, examples/test/fat_sat/report.md
// (5 targets × 5 runs × 2 directions, a linear axis in mm). Its printed per-target means, standard
// deviations, reversals and R_i, and its printed B, B̄, M, A, A↑, A↓, E↑, E↓, R↑, R↓ are recomputed
// here. That report prints R and E unidirectionally (R = max(R↑, R↓), E = E↑); ISO 230-2's
// bidirectional R = max R_i and E over both directions' means differ, which the test shows.
import { describe, expect, it } from "vitest";
import {
  GeometryError,
  positioningStatistics,
  readRotaryPositioningCsv,
  rotaryPositioning,
  rotaryPositioningToJson,
} from "@/geometry";
import { BIDIRECTIONAL, BWD, FWD, PRINTED_AXIS, TARGETS } from "../../fixtures/iso230-2-public";

// Printed per target (mm): x̄↑, x̄↓, x̄ bidirectional, B_i, s↑, s↓, R_i.
const PRINTED = [
  [-9.242e-5, -9.202e-5, -9.222e-5, -4e-7, 8.79e-6, 6.28e-6, 3.517e-5],
  [-9.162e-5, -1.0122e-4, -9.642e-5, 9.6e-6, 6.77e-6, 7.29e-6, 3.772e-5],
  [-8.482e-5, -9.082e-5, -8.782e-5, 6e-6, 7.26e-6, 1.043e-5, 4.17e-5],
  [-8.902e-5, -8.862e-5, -8.882e-5, -4e-7, 9e-6, 1.218e-5, 4.871e-5],
  [-1.0942e-4, -1.2162e-4, -1.1552e-4, 1.22e-5, 1.258e-5, 1.573e-5, 6.882e-5],
];

function rows() {
  const target: number[] = [];
  const direction: ("pos" | "neg")[] = [];
  const run: number[] = [];
  const deviation: number[] = [];
  TARGETS.forEach((t, i) => {
    for (const [dir, data] of [
      ["pos", FWD],
      ["neg", BWD],
    ] as const) {
      data[i]!.forEach((m, j) => {
        target.push(t);
        direction.push(dir);
        run.push(j + 1);
        deviation.push(m - t);
      });
    }
  });
  return { target, direction, run, deviation };
}

/** The report prints every figure rounded to 8 decimal places of a mm: agreement to half a unit there. */
const printed = (value: number, p: number, what?: string) =>
  expect(Math.abs(value - p), what).toBeLessThanOrEqual(0.5e-8 + 1e-15);

describe("ISO 230-2 positioning statistics (public data set: ecmccfg fat_sat report)", () => {
  const r = positioningStatistics(rows());

  it("per target: means, standard deviations, reversal and bidirectional repeatability as printed", () => {
    expect(r.targets.map((t) => t.target)).toEqual(TARGETS);
    r.targets.forEach((t, i) => {
      const [mp, mn, mb, b, sp, sn, Ri] = PRINTED[i]!;
      printed(t.mean_pos, mp!);
      printed(t.mean_neg, mn!);
      printed(t.mean_bidirectional, mb!);
      expect(Math.abs(t.reversal - b!)).toBeLessThan(1e-11);
      printed(t.s_pos, sp!);
      printed(t.s_neg, sn!);
      printed(t.R, Ri!);
      expect(t.R_pos).toBeCloseTo(4 * t.s_pos, 15);
    });
  });

  it("axis quantities as printed: B, B̄, M, A, A↑, A↓, E↑, E↓, R↑, R↓", () => {
    for (const [q, mm] of PRINTED_AXIS) printed(r[q], mm, q);
  });

  it("bidirectional R and E (ISO 230-2) differ from the report's unidirectional ones (negative check)", () => {
    // Recomputed bidirectionally (check values: R 0.0688 µm, E 0.0368 µm).
    for (const [q, mm] of BIDIRECTIONAL) printed(r[q], mm, q);
    expect(Math.abs(r.R - 6.29e-5)).toBeGreaterThan(1e-6);
    expect(Math.abs(r.E - 2.46e-5)).toBeGreaterThan(1e-6);
    expect(r.warnings).toEqual([]);
  });

  it("a rotary axis: the same data read as degrees from CSV give the same figures in arc seconds", () => {
    const lines = ["target_deg,run,direction,measured_deg,axis"];
    TARGETS.forEach((t, i) => {
      FWD[i]!.forEach((m, j) => lines.push(`${t},${j + 1},pos,${m},C`));
      BWD[i]!.forEach((m, j) => lines.push(`${t},${j + 1},NEG,${m},c`));
    });
    const data = readRotaryPositioningCsv(lines.join("\n"));
    const rot = rotaryPositioning(data);
    const json = rotaryPositioningToJson(rot);
    expect(json.unit).toBe("arcsec");
    expect(json.axis).toBe("C");
    expect(json.A / 3600).toBeCloseTo(r.A, 12);
    expect(json.R / 3600).toBeCloseTo(r.R, 12);
    expect(json.B_mean / 3600).toBeCloseTo(r.B_mean, 12);
    expect(json.targets[4]!.reversal / 3600).toBeCloseTo(1.22e-5, 11);
    expect(Object.keys(json)).toEqual([
      "unit",
      "axis",
      "targets",
      "A",
      "A_pos",
      "A_neg",
      "E",
      "E_pos",
      "E_neg",
      "M",
      "R",
      "R_pos",
      "R_neg",
      "B",
      "B_mean",
      "warnings",
    ]);
  });

  it("360° is its own target; fewer than 5 runs warn; bad rows are named", () => {
    const csv = (body: string[]) =>
      readRotaryPositioningCsv(["target_deg,run,direction,measured_deg", ...body].join("\n"));
    const few = rotaryPositioning(
      csv([
        "0,1,pos,0.001",
        "0,2,pos,0.002",
        "0,1,neg,0",
        "0,2,neg,0.001",
        "360,1,pos,360",
        "360,2,pos,360.001",
        "360,1,neg,360",
        "360,2,neg,359.999",
      ]),
    );
    expect(few.targets.map((t) => t.target)).toEqual([0, 360]);
    expect(few.warnings.join(" ")).toMatch(/fewer than 5 runs/);
    expect(few.targets[0]!.mean_pos).toBeCloseTo(5.4, 9); // (0.001 + 0.002)/2 deg = 5.4″
    expect(() => csv(["0,1,up,0"])).toThrow(/row 2, column direction: 'up' is not pos or neg/);
    expect(() => rotaryPositioning(csv(["0,1,pos,0", "0,1,pos,0", "0,1,neg,0", "0,2,neg,0"]))).toThrow(
      /row 3.*given twice/,
    );
    expect(() => rotaryPositioning(csv(["0,1,pos,0", "0,2,pos,0", "0,1,neg,0"]))).toThrow(
      /1 run in the neg direction/,
    );
    expect(() => csv(["0,1,pos,0,", "0,2,pos,0"].map((s) => s.slice(0, -1)).concat(["0,1.5,neg,0"]))).toThrow(
      GeometryError,
    );
  });
});
