// Circle-fit uncertainty (Type A, JCGM 100): U of radius, centre and normal from the fit's
// covariance s²·(JᵀJ)⁻¹. Checked against an independent general-purpose least-squares library
// (ml-levenberg-marquardt fits the same circle; mathjs inverts JᵀJ of a central-difference
// Jacobian) on the Gander–Golub–Strebel points (BIT 34, 1994), and by Monte Carlo on a short arc.
import { inv, multiply, transpose } from "mathjs";
import { levenbergMarquardt as mlLm } from "ml-levenberg-marquardt";
import { describe, expect, it } from "vitest";
import { fitCircle, GeometryError } from "@/geometry";
import { GGS } from "./reference-data";

/** Small deterministic generator (mulberry32) and Box–Muller normals for the Monte Carlo check. */
function rng(seed: number) {
  let t = seed >>> 0;
  const u = () => {
    t = (t + 0x6d2b79f5) >>> 0;
    let x = Math.imul(t ^ (t >>> 15), 1 | t);
    x = (x + Math.imul(x ^ (x >>> 7), 61 | x)) ^ x;
    return ((x ^ (x >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(u() + 1e-300)) * Math.cos(2 * Math.PI * u());
}

describe("circle uncertainty", () => {
  it("Gander–Golub–Strebel: U of radius and centre equal 2·√diag(s²(JᵀJ)⁻¹) of an independent fit (ml-levenberg-marquardt + mathjs)", () => {
    const ours = fitCircle({ xMm: GGS.map((p) => p[0]), yMm: GGS.map((p) => p[1]), zMm: GGS.map(() => 0) });
    const dist = ([a, b, r]: number[], i: number) => Math.hypot(GGS[i]![0] - a!, GGS[i]![1] - b!) - r!;
    const theirs = mlLm(
      { x: GGS.map((_, i) => i), y: GGS.map(() => 0) },
      (p: number[]) => (i: number) => dist(p, i),
      {
        initialValues: [5, 3, 4.5],
        maxIterations: 500,
        errorTolerance: 1e-14,
        damping: 1e-3,
        gradientDifference: 1e-7,
      },
    );
    const p = theirs.parameterValues;
    // Check values: centre (4.739782, 2.983533), r 4.714226, Σd² 1.22760 (reproduced).
    expect(p[0]!).toBeCloseTo(4.739782, 4);
    expect(p[2]!).toBeCloseTo(4.714226, 4);
    const h = 1e-6;
    const J = GGS.map((_, i) =>
      [0, 1, 2].map((k) => {
        const up = [...p];
        const dn = [...p];
        up[k]! += h;
        dn[k]! -= h;
        return (dist(up, i) - dist(dn, i)) / (2 * h);
      }),
    );
    const ss = GGS.reduce((s, _, i) => s + dist(p, i) ** 2, 0);
    const C = multiply(inv(multiply(transpose(J), J)), ss / (GGS.length - 3)) as number[][];
    const rel = (a: number, b: number) => Math.abs(a / b - 1);
    expect(rel(ours.radius_U_mm!, 2 * Math.sqrt(C[2]![2]!))).toBeLessThan(1e-4);
    expect(rel(ours.centre_U_mm![0], 2 * Math.sqrt(C[0]![0]!))).toBeLessThan(1e-4);
    expect(rel(ours.centre_U_mm![1], 2 * Math.sqrt(C[1]![1]!))).toBeLessThan(1e-4);
    // Points in one plane exactly: nothing out of plane.
    expect(ours.centre_U_mm![2]).toBe(0);
    expect(ours.normal_U_arcsec).toBe(0);
    expect(ours.arc_deg).toBeGreaterThan(90);
    expect(ours.arc_deg).toBeLessThan(180);
  });

  it("30° arc of R 150 mm, 1 µm noise: a short-arc warning, and the radius U matches its Monte Carlo scatter", () => {
    const R = 150;
    const N = 16;
    const normal = rng(7);
    const radii: number[] = [];
    const Us: number[] = [];
    let warnings: readonly string[] = [];
    for (let run = 0; run < 300; run++) {
      const xs: number[] = [];
      const ys: number[] = [];
      const zs: number[] = [];
      for (let i = 0; i < N; i++) {
        const t = ((i / (N - 1)) * 30 * Math.PI) / 180;
        xs.push(R * Math.cos(t) + 0.001 * normal());
        ys.push(R * Math.sin(t) + 0.001 * normal());
        zs.push(0.001 * normal());
      }
      const f = fitCircle({ xMm: xs, yMm: ys, zMm: zs });
      radii.push(f.radius_mm);
      Us.push(f.radius_U_mm!);
      warnings = f.warnings;
    }
    const mean = radii.reduce((s, r) => s + r, 0) / radii.length;
    const sd = Math.sqrt(radii.reduce((s, r) => s + (r - mean) ** 2, 0) / (radii.length - 1));
    const meanU = Us.reduce((s, u) => s + u, 0) / Us.length;
    // The scatter is tens of µm although every point is within a few µm of its circle.
    expect(sd).toBeGreaterThan(0.005);
    // u = U/2 agrees with the observed standard deviation within the Monte Carlo and linearisation error.
    expect(meanU / 2 / sd).toBeGreaterThan(0.8);
    expect(meanU / 2 / sd).toBeLessThan(1.25);
    expect(warnings.join(" ")).toMatch(/only 30° of arc/);
  });

  it("no finite input crashes: coordinates near 1e155 and 1e300 fit or fail with a message", () => {
    const ring = (scale: number, off: number) => {
      const xs: number[] = [];
      const ys: number[] = [];
      const zs: number[] = [];
      for (let i = 0; i < 8; i++) {
        xs.push(off + scale * Math.cos(i));
        ys.push(off + scale * Math.sin(i));
        zs.push(off);
      }
      return { xMm: xs, yMm: ys, zMm: zs };
    };
    const big = fitCircle(ring(1e155, 0));
    expect(big.radius_mm / 1e155).toBeCloseTo(1, 9);
    // A radius of 1e307 mm fits, but its figures in µm overflow: a message naming the figure.
    expect(() => fitCircle(ring(1e307, 0))).toThrow(/rms_um is beyond the number range/);
    // Points spanning beyond the number range: a message, no NaN.
    expect(() =>
      fitCircle({ xMm: [1.7e308, -1.7e308, -1.7e308], yMm: [0, 1e308, -1e308], zMm: [0, 0, 0] }),
    ).toThrow(/number range/);
    const far = (() => {
      try {
        return fitCircle(ring(1, 1e155));
      } catch (e) {
        return e;
      }
    })();
    expect(far instanceof GeometryError || Number.isFinite((far as { radius_mm: number }).radius_mm)).toBe(
      true,
    );
    expect(() => fitCircle({ xMm: [1, 1, 1, 1], yMm: [2, 2, 2, 2], zMm: [3, 3, 3, 3] })).toThrow(
      /all points coincide/,
    );
    const three = fitCircle({ xMm: [1, 0, -1], yMm: [0, 1, 0], zMm: [0, 0, 0] });
    expect(three.radius_U_mm).toBeNull();
    expect(three.warnings.join(" ")).toMatch(/3 points fit a circle exactly/);
  });
});
