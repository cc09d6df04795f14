// Tool-centre-point check: range of the reported sphere centre in x, y, z and the largest distance
// from the mean centre. Checked against hand-derivable cases (marked) and against mathjs's own
// min/max/mean/norm (an independent general-purpose library) on random data.
import fc from "fast-check";
import { max, mean, min, norm, subtract } from "mathjs";
import { describe, expect, it } from "vitest";
import { GeometryError, readSphereProbeCsv, tcpCheck, tcpCheckToJson } from "@/geometry";
import { vec3 } from "./arbitraries";

describe("tcpCheck", () => {
  it("hand-derived: four poses on a 10 µm square in x–y and 4 µm in z", () => {
    // Centres (mm) at (0,0,0), (0.01,0,0), (0.01,0.01,0.004), (0,0.01,0): range x 10, y 10, z 4 µm;
    // mean (0.005, 0.005, 0.001); farthest is row 3: √(5² + 5² + 3²) = √59 µm.
    const r = tcpCheck({
      primaryDeg: [0, 90, 180, 270],
      secondaryDeg: [0, 30, 60, 90],
      xMm: [0, 0.01, 0.01, 0],
      yMm: [0, 0, 0.01, 0.01],
      zMm: [0, 0, 0.004, 0],
    });
    expect(r.range_um.x).toBeCloseTo(10, 9);
    expect(r.range_um.y).toBeCloseTo(10, 9);
    expect(r.range_um.z).toBeCloseTo(4, 9);
    expect(r.max_from_mean_um).toBeCloseTo(Math.sqrt(59), 9);
    expect(r.worst_row).toBe(3);
    expect(r.warnings.join(" ")).toMatch(/only 4 poses/);
    expect(Object.keys(tcpCheckToJson(r))).toEqual([
      "range_um",
      "max_from_mean_um",
      "worst_row",
      "poses",
      "warnings",
    ]);
  });

  it("agrees with mathjs min/max/mean/norm on random centres far from the origin", () => {
    fc.assert(
      fc.property(
        fc.array(vec3(-0.05, 0.05), { minLength: 2, maxLength: 30 }),
        fc.double({ min: -2000, max: 2000, noNaN: true }),
        (pts, offset) => {
          const P = pts.map(([x, y, z]) => [x + offset, y - offset, z + 500]);
          const r = tcpCheck({
            primaryDeg: P.map((_, i) => i * 10),
            secondaryDeg: P.map(() => 0),
            xMm: P.map((p) => p[0]!),
            yMm: P.map((p) => p[1]!),
            zMm: P.map((p) => p[2]!),
          });
          const col = (k: number) => P.map((p) => p[k]!);
          for (const [k, key] of (["x", "y", "z"] as const).entries())
            expect(r.range_um[key]).toBeCloseTo(
              ((max(col(k)) as number) - (min(col(k)) as number)) * 1000,
              5,
            ); // mathjs compares with relTol 1e-12
          const m = [0, 1, 2].map((k) => mean(col(k)) as number);
          const d = Math.max(...P.map((p) => norm(subtract(p, m) as number[]) as number)) * 1000;
          expect(r.max_from_mean_um).toBeCloseTo(d, 5);
        },
      ),
      { numRuns: 200 },
    );
  });

  it("errors: one pose only, one row, non-finite; huge coordinates fail with a message, not NaN", () => {
    const one = {
      primaryDeg: [10, 10, 10],
      secondaryDeg: [5, 5, 5],
      xMm: [0, 1, 2],
      yMm: [0, 0, 0],
      zMm: [0, 0, 0],
    };
    expect(() => tcpCheck(one)).toThrow(/all rows are at one pose/);
    expect(() => tcpCheck({ primaryDeg: [0], secondaryDeg: [0], xMm: [0], yMm: [0], zMm: [0] })).toThrow(
      /needs poses/,
    );
    expect(() => tcpCheck({ ...one, primaryDeg: [0, 1, 2], xMm: [0, NaN, 0] })).toThrow(GeometryError);
    expect(() => tcpCheck({ ...one, primaryDeg: [0, 1, 2], xMm: [1.7e308, -1.7e308, 0] })).toThrow(
      /number range/,
    );
    const big = tcpCheck({ ...one, primaryDeg: [0, 1, 2], xMm: [1e300, 1e300, 1e300] });
    expect(big.range_um.x).toBe(0);
    expect(big.max_from_mean_um).toBe(0);
  });

  it("reads the sphere-probe CSV in inches (1 in = 25.4 mm exactly, NIST SP 811) and names the worst file row", () => {
    const data = readSphereProbeCsv(
      "primary_deg,secondary_deg,x,y,z\n0,0,1,1,1\n90,45,1.0001,1,1\n180,90,1,1,1\n",
      { units: "in" },
    );
    const r = tcpCheck(data);
    expect(r.range_um.x).toBeCloseTo(2.54, 9);
    expect(r.worst_row).toBe(3);
  });
});
