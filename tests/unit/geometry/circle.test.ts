import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { axisSquareness, fitCircle, pivotLengthMm, RAD_PER_ARCSEC, type Vec3 } from "@/geometry";
import { GGS } from "./reference-data";
import { vec3 } from "./arbitraries";

// Gander, Golub & Strebel, "Least-squares fitting of circles and ellipses", BIT 34 (1994) 558–578:
// six points; geometric fit centre (4.7398, 2.9835), r 4.7142 (the paper's figures from memory;
// reproduced to more digits with an independent least-squares tool: 4.739782, 2.983533, 4.714226,
// sum of squared distances 1.22760 — the values asserted here).

type M3 = readonly [Vec3, Vec3, Vec3];
function rotation(ax: number, ay: number, az: number): M3 {
  const [ca, sa, cb, sb, cc, sc] = [
    Math.cos(ax),
    Math.sin(ax),
    Math.cos(ay),
    Math.sin(ay),
    Math.cos(az),
    Math.sin(az),
  ];
  // Rz·Ry·Rx
  return [
    [cc * cb, cc * sb * sa - sc * ca, cc * sb * ca + sc * sa],
    [sc * cb, sc * sb * sa + cc * ca, sc * sb * ca - cc * sa],
    [-sb, cb * sa, cb * ca],
  ];
}
const apply = (R: M3, p: Vec3, t: Vec3): Vec3 => [
  R[0][0] * p[0] + R[0][1] * p[1] + R[0][2] * p[2] + t[0],
  R[1][0] * p[0] + R[1][1] * p[1] + R[1][2] * p[2] + t[1],
  R[2][0] * p[0] + R[2][1] * p[1] + R[2][2] * p[2] + t[2],
];
const cols = (pts: readonly Vec3[]) => ({
  xMm: pts.map((p) => p[0]),
  yMm: pts.map((p) => p[1]),
  zMm: pts.map((p) => p[2]),
});

describe("fitCircle", () => {
  it("Gander, Golub & Strebel (1994): geometric fit centre (4.7398, 2.9835), r 4.7142, in the plane z = 0", () => {
    const f = fitCircle(cols(GGS.map(([x, y]) => [x, y, 0] as Vec3)));
    expect(f.centre_mm[0]).toBeCloseTo(4.739782, 5);
    expect(f.centre_mm[1]).toBeCloseTo(2.983533, 5);
    expect(f.centre_mm[2]).toBeCloseTo(0, 12);
    expect(f.radius_mm).toBeCloseTo(4.714226, 5);
    expect(f.normal).toEqual([0, 0, 1].map((v) => expect.closeTo(v, 12)));
    // Sum of squared distances 1.22760 (the independently reproduced value above).
    expect((f.rms_um / 1000) ** 2 * 6).toBeCloseTo(1.2276, 4);
  });

  it("the same six points rotated and translated in 3-D give the same centre (mapped) and radius", () => {
    fc.assert(
      fc.property(vec3(-3, 3), vec3(-500, 500), (ang, t) => {
        const R = rotation(...ang);
        const f = fitCircle(cols(GGS.map(([x, y]) => apply(R, [x, y, 0], t))));
        const c = apply(R, [4.739782, 2.983533, 0], t);
        for (let k = 0; k < 3; k++) expect(Math.abs(f.centre_mm[k]! - c[k]!)).toBeLessThan(2e-6);
        expect(Math.abs(f.radius_mm - 4.714226)).toBeLessThan(2e-6);
        const nz = R.map((row) => row[2]);
        expect(
          Math.abs(Math.abs(f.normal[0] * nz[0]! + f.normal[1] * nz[1]! + f.normal[2] * nz[2]!) - 1),
        ).toBeLessThan(1e-12);
      }),
      { numRuns: 50 },
    );
  });

  it("a tilted synthetic circle with out-of-plane noise: rms includes the distance from the plane", () => {
    const pts: Vec3[] = [];
    for (let k = 0; k < 12; k++) {
      const th = (k * Math.PI) / 6;
      pts.push([100 + 80 * Math.cos(th), -20 + 80 * Math.sin(th), 5 + (k % 2 === 0 ? 0.001 : -0.001)]);
    }
    const f = fitCircle(cols(pts));
    expect(f.radius_mm).toBeCloseTo(80, 9);
    expect(f.rms_um).toBeCloseTo(1, 9);
    expect(f.plane_rms_um).toBeCloseTo(1, 9);
    expect(f.radial_rms_um).toBeLessThan(1e-6);
  });

  it("row order does not change the fit (property, within 1e-9)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1000 }), (seed) => {
        const pts: Vec3[] = GGS.map(([x, y], i) => [
          x * 10 + Math.sin(seed + i),
          y * 10,
          0.01 * Math.cos(seed * i),
        ]);
        const a = fitCircle(cols(pts));
        const perm = pts
          .map((p, i) => ({ p, k: Math.sin(seed * 7.1 + i * 3.3) }))
          .sort((u, v) => u.k - v.k)
          .map((e) => e.p);
        const b = fitCircle(cols(perm));
        for (let k = 0; k < 3; k++) {
          expect(Math.abs(a.centre_mm[k]! - b.centre_mm[k]!)).toBeLessThan(1e-9);
          expect(Math.abs(a.normal[k]! - b.normal[k]!)).toBeLessThan(1e-9);
        }
        expect(Math.abs(a.radius_mm - b.radius_mm)).toBeLessThan(1e-9);
        expect(Math.abs(a.rms_um - b.rms_um)).toBeLessThan(1e-9);
      }),
      { numRuns: 30 },
    );
  });

  it("refuses collinear points", () => {
    expect(() =>
      fitCircle(
        cols([
          [0, 0, 0],
          [1, 1, 1],
          [2, 2, 2],
          [3, 3, 3],
        ]),
      ),
    ).toThrow(/line/);
  });
});

describe("axisSquareness and pivotLengthMm", () => {
  it("squareness: an axis tilted 10″ from perpendicular reads 10″ (definition of the arc second, π/648000 rad)", () => {
    const e = 10 * RAD_PER_ARCSEC;
    const s = axisSquareness([0, 0, 1], [Math.cos(e), 0, -Math.sin(e)]);
    expect(s.squareness_arcsec).toBeCloseTo(10, 9);
    expect(axisSquareness([0, 0, 1], [1, 0, 0]).out_of_square_arcsec).toBe(0);
  });
  it("pivot length is the distance from the fitted tilt axis to the tip point", () => {
    expect(pivotLengthMm({ centre_mm: [0, 5, 200], normal: [1, 0, 0] }, [33, 5, 47.6])).toBeCloseTo(
      152.4,
      12,
    );
  });
  it("fitted secondary axis from a circle of tip points gives the pivot length back", () => {
    // Tip points of a 152.4 mm pivot swung about an axis along X through (0, 0, 300).
    const pts: Vec3[] = [-90, -45, 0, 45, 90].map((d) => {
      const t = (d * Math.PI) / 180;
      return [12, 152.4 * Math.sin(t), 300 - 152.4 * Math.cos(t)];
    });
    const f = fitCircle(cols(pts));
    expect(pivotLengthMm(f, [12, 0, 300 - 152.4])).toBeCloseTo(152.4, 9);
    expect(Math.abs(f.normal[0])).toBeCloseTo(1, 12);
  });
});
