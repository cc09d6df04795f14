import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { fitSweep } from "@/geometry";
import { SWEEP_JSON_KEYS } from "./cli-helpers";

const deg = (d: number) => (d * Math.PI) / 180;

function face(
  angles: number[],
  mean: number,
  amp: number,
  dirDeg: number,
  form: (t: number) => number = () => 0,
) {
  return {
    angleDeg: angles,
    readingUm: angles.map((a) => mean + amp * Math.cos(deg(a - dirDeg)) + form(deg(a))),
  };
}

describe("fitSweep", () => {
  it("tilt = TIR / sweep diameter: 0.0005 in over 10 in is 50 µm/m, 10.31″ (common practice: trade trigonometry)", () => {
    // Sweep radius 5 in = 127 mm; a flat face tilted so the TIR is 0.0005 in = 12.7 µm (1 in = 25.4 mm exactly).
    const angles = Array.from({ length: 8 }, (_, k) => k * 45);
    const r = fitSweep(face(angles, 3, 6.35, 0), 127);
    expect(r.tir_um).toBeCloseTo(12.7, 10);
    expect(r.tilt_um_per_m).toBeCloseTo(50, 9);
    expect(r.tilt_arcsec).toBeCloseTo(10.31, 2);
    expect(r.direction_deg).toBeCloseTo(0, 9);
    expect(r.flatness_ls_um).toBeLessThan(1e-9);
    expect(r.flatness_mz_um).toBeLessThan(1e-9);
  });

  it("recovers a known tilt and direction from a synthetic face with form error (answer known by construction)", () => {
    const angles = Array.from({ length: 36 }, (_, k) => k * 10);
    // 30 µm/m at 200 mm radius = 6 µm amplitude, high side at 130°; plus a 1 µm saddle (cos 2θ).
    const r = fitSweep(
      face(angles, -2, 6, 130, (t) => Math.cos(2 * t)),
      200,
    );
    expect(r.tilt_um_per_m).toBeCloseTo(30, 9);
    expect(r.direction_deg).toBeCloseTo(130, 8);
    expect(r.flatness_ls_um).toBeCloseTo(2, 9);
    expect(r.flatness_mz_um!).toBeLessThanOrEqual(r.flatness_ls_um! + 1e-12);
  });

  it("minimum zone ≤ least squares always, and no tilt on a fine grid does better (property)", () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 0, max: 359 }), { minLength: 4, maxLength: 12 }),
        fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: 12, maxLength: 12 }),
        (angles, noise) => {
          const data = { angleDeg: angles, readingUm: angles.map((_, i) => noise[i]!) };
          const r = fitSweep(data, 100);
          expect(r.flatness_mz_um).not.toBeNull();
          expect(r.flatness_mz_um!).toBeLessThanOrEqual(r.flatness_ls_um! + 1e-9);
          // Independent check by brute force over (b, c) around the least-squares tilt.
          let gridBest = Infinity;
          const span = 20;
          for (let i = -40; i <= 40; i++) {
            for (let j = -40; j <= 40; j++) {
              const b = r.b_um + (i * span) / 40;
              const c = r.c_um + (j * span) / 40;
              let lo = Infinity;
              let hi = -Infinity;
              angles.forEach((a, k) => {
                const e = noise[k]! - b * Math.cos(deg(a)) - c * Math.sin(deg(a));
                lo = Math.min(lo, e);
                hi = Math.max(hi, e);
              });
              gridBest = Math.min(gridBest, hi - lo);
            }
          }
          expect(r.flatness_mz_um!).toBeLessThanOrEqual(gridBest + 1e-9);
        },
      ),
      { numRuns: 40 },
    );
  });

  it("row order does not change the result (property, within 1e-9)", () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 0, max: 359 }), { minLength: 4, maxLength: 16 }),
        fc.integer(),
        (angles, seed) => {
          const y = angles.map((a, i) => 5 * Math.cos(deg(a - 40)) + Math.sin(seed + i));
          const a = fitSweep({ angleDeg: angles, readingUm: y }, 150);
          const idx = angles
            .map((_, i) => i)
            .sort((p, q) => Math.sin(seed + p * 3.7) - Math.sin(seed + q * 3.7));
          const b = fitSweep({ angleDeg: idx.map((i) => angles[i]!), readingUm: idx.map((i) => y[i]!) }, 150);
          for (const k of SWEEP_JSON_KEYS) expect(Math.abs((a[k] ?? 0) - (b[k] ?? 0))).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 60 },
    );
  });

  it("says where the points do not allow flatness or a well-determined tilt", () => {
    const three = fitSweep({ angleDeg: [0, 120, 240], readingUm: [1, 2, 3] }, 100);
    expect(three.flatness_ls_um).toBeNull();
    expect(three.flatness_mz_um).toBeNull();
    expect(three.notes.join(" ")).toMatch(/4 or more distinct angles/);
    const arc = fitSweep({ angleDeg: [0, 20, 40, 60], readingUm: [1, 2, 3, 3.5] }, 100);
    expect(arc.notes.join(" ")).toMatch(/gap of 300°/);
    expect(() => fitSweep({ angleDeg: [0, 360, 90], readingUm: [1, 1, 2] }, 100)).toThrow(
      /3 or more distinct angles/,
    );
    expect(() => fitSweep({ angleDeg: [0, 90, 180], readingUm: [1, 1, 2] }, 0)).toThrow(/radius/);
  });
});
