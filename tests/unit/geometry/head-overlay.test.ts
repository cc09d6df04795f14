// The pre/post overlay of the 3D view (geometry/head-scene.ts headOverlayScene, tipChangeUm).
// Outside references: rotations about the coordinate axes written out by hand (right-hand rule,
// ISO 841 machine frame: C turns about +Z, A about +X), and the chord of a circle, 2·r·sin(θ/2),
// for a point carried round an axis at distance r (elementary geometry).
import { describe, expect, it } from "vitest";
import { headOverlayScene, headScene, tipChangeUm } from "@/geometry/head-scene";
import { headPoseGrid, type HeadConfig, type HeadPose } from "@/geometry";

const CA: HeadConfig = { primary: "C", secondary: "A", pivotLengthMm: 152.4, toolDirection: [0, 0, -1] };
const tipAt = (tips: Float32Array, i: number) => [tips[3 * i]!, tips[3 * i + 1]!, tips[3 * i + 2]!];

describe("pre/post overlay geometry", () => {
  const poses: HeadPose[] = [
    { primaryDeg: 0, secondaryDeg: 0, toolMm: 0 },
    { primaryDeg: 0, secondaryDeg: 90, toolMm: 0 },
    { primaryDeg: 90, secondaryDeg: 90, toolMm: 0 },
    { primaryDeg: 90, secondaryDeg: 90, toolMm: 100 },
  ];

  it("a pivot-length error of 38 µm drawn ×100 puts the tip 3.8 mm further out, turned by hand-written rotations", () => {
    const o = headOverlayScene(CA, { pivot_length_error_um: 38 }, poses, 100);
    const L = 152.4 + 0.038 * 100; // 156.2 mm
    // Both axes at 0: straight down the tool, −Z.
    expect(tipAt(o.actualTipsMm, 0)[2]).toBeCloseTo(-L, 4);
    // A = +90° about +X: (0, 0, −L) → (0, +L, 0) (y' = y·cos − z·sin, z' = y·sin + z·cos).
    const a90 = tipAt(o.actualTipsMm, 1);
    expect(a90[0]).toBeCloseTo(0, 4);
    expect(a90[1]).toBeCloseTo(L, 4);
    expect(a90[2]).toBeCloseTo(0, 4);
    // Then C = +90° about +Z: (0, L, 0) → (−L, 0, 0) (x' = x·cos − y·sin).
    const c90 = tipAt(o.actualTipsMm, 2);
    expect(c90[0]).toBeCloseTo(-L, 4);
    expect(c90[1]).toBeCloseTo(0, 4);
    // The 100 mm tool extends the same lever: −(L + 100).
    expect(tipAt(o.actualTipsMm, 3)[0]).toBeCloseTo(-(L + 100), 3);
  });

  it("the other fit's axes: an offset of the tilt axis by 9 µm ×1000 shifts its line 9 mm along n = +Y; a squareness of 18″ ×1000 turns it 5° about +Y", () => {
    const o = headOverlayScene(CA, { secondary_offset_um: 9, secondary_tilt_arcsec: 18 }, poses, 1000);
    const pt = o.axes.secondary.pointMm;
    expect(pt[0]).toBeCloseTo(0, 9);
    expect(pt[1]).toBeCloseTo(9, 9);
    expect(pt[2]).toBeCloseTo(0, 9);
    // 18″ × 1000 = 18 000″ = 5°; R_y(5°)·(1, 0, 0) = (cos 5°, 0, −sin 5°).
    const d = o.axes.secondary.direction;
    expect(d[0]).toBeCloseTo(Math.cos((5 * Math.PI) / 180), 12);
    expect(d[1]).toBeCloseTo(0, 12);
    expect(d[2]).toBeCloseTo(-Math.sin((5 * Math.PI) / 180), 12);
    // The primary axis has no error here: still +Z.
    expect(o.axes.primary.direction).toEqual([0, 0, 1]);
  });

  it("uses the same forward model and sweeps as the shown fit: identical errors give identical paths", () => {
    const grid = headPoseGrid({ primarySteps: 8, secondaryDeg: [-90, 0, 90], toolMm: [0, 50] });
    const errors = { pivot_length_error_um: 12, tip_offset_n_um: -4, primary_zero_arcsec: 7 };
    const shown = headScene(CA, errors, grid, 300);
    const other = headOverlayScene(CA, errors, grid, 300);
    expect(Array.from(other.actualPathMm)).toEqual(Array.from(shown.actualPathMm));
    expect(other.actualPathMm.length).toBe(shown.nominalPathMm.length);
    // And different errors give a different path of the same length.
    const changed = headOverlayScene(CA, { pivot_length_error_um: 2 }, grid, 300);
    expect(changed.actualPathMm.length).toBe(shown.actualPathMm.length);
    expect(Array.from(changed.actualPathMm)).not.toEqual(Array.from(shown.actualPathMm));
  });

  it("tip change: pivot error 38 µm → 10 µm moves every tip by 28 µm along the tool", () => {
    const grid = headPoseGrid({ primarySteps: 12, secondaryDeg: [-90, -45, 0, 45, 90], toolMm: [0, 100] });
    const c = tipChangeUm(CA, { pivot_length_error_um: 38 }, { pivot_length_error_um: 10 }, grid);
    expect(c.maxUm).toBeCloseTo(28, 9);
    expect(c.rmsUm).toBeCloseTo(28, 9);
  });

  it("tip change: a tilt-axis offset e carried round the tilt axis by θ moves the tip by the chord 2·e·sin(θ/2)", () => {
    const e = 9;
    for (const theta of [45, 90, -90, 135]) {
      const c = tipChangeUm(CA, { secondary_offset_um: e }, {}, [
        { primaryDeg: 30, secondaryDeg: theta, toolMm: 0 },
      ]);
      expect(c.maxUm).toBeCloseTo(2 * e * Math.abs(Math.sin((theta * Math.PI) / 360)), 9);
    }
    // At θ = 0 the offset line still passes through the tip's lever: no change.
    expect(
      tipChangeUm(CA, { secondary_offset_um: e }, {}, [{ primaryDeg: 0, secondaryDeg: 0, toolMm: 0 }]).maxUm,
    ).toBeCloseTo(0, 9);
  });

  it("refuses a negative exaggeration like headScene", () => {
    expect(() => headOverlayScene(CA, {}, poses, -1)).toThrow(RangeError);
  });
});
