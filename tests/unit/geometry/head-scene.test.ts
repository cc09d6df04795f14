// The 3D view's scene from the head model (geometry/head-scene.ts). Outside references: the
// definitions of the head model of geometry/README.md, and mathjs's rotationMatrix (an independent
// implementation of the axis–angle rotation) for the fitted axis directions.
import { multiply, rotationMatrix } from "mathjs";
import { describe, expect, it } from "vitest";
import { exaggerateErrors, headAxisLines, headScene, residualColour } from "@/geometry/head-scene";
import { headPoseGrid, headTipMm, nominalTipMm, type HeadConfig, type HeadErrors } from "@/geometry";

const CA: HeadConfig = { primary: "C", secondary: "A", pivotLengthMm: 152.4 };
const poses = headPoseGrid({ primarySteps: 12, secondaryDeg: [-90, -45, 0, 45, 90], toolMm: [0, 100] });
const ARCSEC = Math.PI / 648000;

const mathjsRotate = (angleRad: number, axis: readonly number[], v: readonly number[]): number[] =>
  (multiply(rotationMatrix(angleRad, [...axis]) as unknown as number[][], [...v]) as unknown as number[]).map(
    Number,
  );

describe("head scene", () => {
  it("zero errors: the actual tips, paths and axes equal the nominal ones at every k", () => {
    for (const k of [1, 100, 10_000]) {
      const s = headScene(CA, {}, poses, k);
      expect(Array.from(s.actualTipsMm)).toEqual(Array.from(s.nominalTipsMm));
      expect(Array.from(s.actualPathMm)).toEqual(Array.from(s.nominalPathMm));
      expect(s.axes.fittedPrimary.direction).toEqual(s.axes.nominalPrimary.direction);
      for (let c = 0; c < 3; c++)
        expect(s.axes.fittedSecondary.direction[c]).toBeCloseTo(s.axes.nominalSecondary.direction[c]!, 15);
    }
  });

  it("tips equal geometry's public forward model (nominalTipMm, headTipMm with the errors × k)", () => {
    const errors: HeadErrors = { pivot_length_error_um: 38, secondary_tilt_arcsec: 18, tip_offset_n_um: 21 };
    const s = headScene(CA, errors, poses, 250);
    poses.forEach((p, i) => {
      const t0 = nominalTipMm(CA, p);
      const t = headTipMm(
        CA,
        { pivot_length_error_um: 38 * 250, secondary_tilt_arcsec: 18 * 250, tip_offset_n_um: 21 * 250 },
        p,
      );
      for (let c = 0; c < 3; c++) {
        expect(s.nominalTipsMm[3 * i + c]).toBeCloseTo(t0[c]!, 4);
        expect(s.actualTipsMm[3 * i + c]).toBeCloseTo(t[c]!, 4);
      }
    });
  });

  it("a pure pivot-length error e moves the gauge point along the tool by exactly k·e at every pose", () => {
    // By definition (geometry/README.md): L = L0 + pivot_length_error, along the tool direction t
    // carried through both rotations; the nominal tip is (L0 + tool)·R·t, so the move is k·e·R·t.
    const e = 38; // µm
    for (const k of [1, 1000, 10_000]) {
      const s = headScene(CA, { pivot_length_error_um: e }, poses, k);
      poses.forEach((p, i) => {
        const t0 = [0, 1, 2].map((c) => s.nominalTipsMm[3 * i + c]!);
        const d = [0, 1, 2].map((c) => s.actualTipsMm[3 * i + c]! - t0[c]!);
        const len = Math.hypot(d[0]!, d[1]!, d[2]!);
        expect(len).toBeCloseTo((k * e) / 1000, 3); // float32 storage: about 1e-5 mm at 250 mm
        const L = Math.hypot(t0[0]!, t0[1]!, t0[2]!);
        expect(L).toBeCloseTo(152.4 + (p.toolMm ?? 0), 3);
        // Parallel to the tool: d = (k·e / L)·tip₀.
        for (let c = 0; c < 3; c++) expect(d[c]!).toBeCloseTo((((k * e) / 1000) * t0[c]!) / L, 3);
      });
    }
  });

  it("fitted axis directions agree with an independent construction by mathjs rotationMatrix", () => {
    const errors: HeadErrors = {
      primary_tilt_s_arcsec: 6,
      primary_tilt_n_arcsec: -9,
      secondary_tilt_arcsec: 18,
      secondary_yaw_arcsec: 4,
      primary_zero_arcsec: 14,
      secondary_offset_um: 9,
    };
    const k = 5000;
    const a = headAxisLines(CA, exaggerateErrors(errors, k), 30);
    // C/A: p = +Z, s = +X, n = p × s = +Y.
    const p = [0, 0, 1];
    const s = [1, 0, 0];
    const n = [0, 1, 0];
    const pPrime = mathjsRotate(6 * k * ARCSEC, s, mathjsRotate(-9 * k * ARCSEC, n, p));
    const sPrime = mathjsRotate(18 * k * ARCSEC, n, mathjsRotate(4 * k * ARCSEC, p, s));
    const turn = (30 * Math.PI) / 180 + 14 * k * ARCSEC;
    const dir = mathjsRotate(turn, pPrime, sPrime);
    const point = mathjsRotate(turn, pPrime, [0, (9 * k) / 1000, 0]);
    for (let c = 0; c < 3; c++) {
      expect(a.fittedPrimary.direction[c]).toBeCloseTo(pPrime[c]!, 12);
      expect(a.fittedSecondary.direction[c]).toBeCloseTo(dir[c]!, 12);
      expect(a.fittedSecondary.pointMm[c]).toBeCloseTo(point[c]!, 12);
    }
    // Nominal secondary at primary 30°: (cos 30°, sin 30°, 0).
    expect(a.nominalSecondary.direction[0]).toBeCloseTo(Math.cos(Math.PI / 6), 15);
    expect(a.nominalSecondary.direction[1]).toBeCloseTo(Math.sin(Math.PI / 6), 15);
  });

  it("measured tips sit k·residual from the actual tips; paths join the secondary sweeps", () => {
    const res = poses.map((_, i) => [i % 3 === 0 ? 2 : 0, 0, i % 3 === 1 ? -1 : 0] as const);
    const s = headScene(CA, { tip_offset_n_um: 20 }, poses, 100, res);
    poses.forEach((_, i) => {
      for (let c = 0; c < 3; c++)
        expect(s.measuredTipsMm[3 * i + c]! - s.actualTipsMm[3 * i + c]!).toBeCloseTo(
          (-100 * res[i]![c]!) / 1000,
          4,
        );
      expect(s.residualUm[i]).toBeCloseTo(Math.hypot(...res[i]!), 6);
    });
    // 12 primary angles × 2 tools sweeps of 5 secondary angles: 4 segments each.
    expect(s.nominalPathMm.length).toBe(12 * 2 * 4 * 6);
  });

  it("refuses a negative or non-finite factor; the colour ramp is clamped", () => {
    expect(() => exaggerateErrors({}, -1)).toThrow(/factor/);
    expect(() => exaggerateErrors({}, Number.NaN)).toThrow(/factor/);
    expect(residualColour(10, 5)).toEqual(residualColour(5, 5));
    expect(residualColour(-1, 5)).toEqual(residualColour(0, 5));
  });
});
