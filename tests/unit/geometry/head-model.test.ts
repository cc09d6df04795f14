// The head's forward model, its analytic Jacobian and its configuration.
import fc from "fast-check";
import { multiply, rotationMatrix } from "mathjs";
import { describe, expect, it } from "vitest";
import {
  GeometryError,
  headParameterSymbols,
  headTipMm,
  HEAD_PARAMETER_KEYS,
  measuredSphereCentreMm,
  nominalTipMm,
  parseHeadConfig,
  rodriguesRotate,
  RAD_PER_DEG,
  type HeadConfig,
  type HeadErrors,
} from "@/geometry";
import { headAxes } from "@/geometry/head/config";
import { HeadKernel } from "@/geometry/head/kernel";
import { vec3 } from "./arbitraries";

const CA: HeadConfig = { primary: "C", secondary: "A", pivotLengthMm: 152.4 };
const configs: HeadConfig[] = [
  CA,
  { primary: "C", secondary: "B", pivotLengthMm: 120 },
  { primary: "B", secondary: "A", pivotLengthMm: 200, toolDirection: [0, 0, -1] },
  { primary: "A", secondary: "C", pivotLengthMm: 90, toolDirection: [1, 0, -1] },
];
const axisOf = { A: [1, 0, 0], B: [0, 1, 0], C: [0, 0, 1] } as const;

/** mathjs rotationMatrix(θ, axis) applied to x: an independent library's rotation (right-hand rule). */
function mathjsRotate(axis: readonly number[], rad: number, x: readonly number[]): number[] {
  return multiply(rotationMatrix(rad, [...axis]) as unknown as number[][], [...x]) as number[];
}

describe("Rodrigues' rotation formula", () => {
  it("agrees with mathjs rotationMatrix for random axes, angles and vectors (independent library)", () => {
    fc.assert(
      fc.property(
        fc
          .tuple(
            fc.double({ min: -1, max: 1, noNaN: true }),
            fc.double({ min: -1, max: 1, noNaN: true }),
            fc.double({ min: -1, max: 1, noNaN: true }),
          )
          .filter((a) => Math.hypot(...a) > 0.1),
        fc.double({ min: -7, max: 7, noNaN: true }),
        vec3(-500, 500),
        (a0, phi, x) => {
          const n = Math.hypot(...a0);
          const a = [a0[0] / n, a0[1] / n, a0[2] / n] as const;
          const ours = rodriguesRotate(a, phi, x);
          const theirs = mathjsRotate(a, phi, x);
          for (let k = 0; k < 3; k++) expect(Math.abs(ours[k]! - theirs[k]!)).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 50, seed: 7 },
    );
  });

  it("right-hand rule (ISO 841): +90° about +Z takes +X to +Y", () => {
    const y = rodriguesRotate([0, 0, 1], Math.PI / 2, [1, 0, 0]);
    expect(y[0]).toBeCloseTo(0, 15);
    expect(y[1]).toBeCloseTo(1, 15);
  });
});

describe("forward model (geometry/README.md, exact forward model)", () => {
  it("zero errors: tip equals the nominal tip, which equals R(p,P)·R(s,S)·(L0 + tool)·t built with mathjs", () => {
    for (const cfg of configs) {
      const t0 = cfg.toolDirection ?? [0, 0, -1];
      const tn = Math.hypot(...t0);
      for (const [P, S, tool] of [
        [0, 0, 0],
        [37, -62, 25],
        [270, 90, 100],
        [-123.4, 12.5, 0],
      ] as const) {
        const tip = headTipMm(cfg, {}, { primaryDeg: P, secondaryDeg: S, toolMm: tool });
        const nom = nominalTipMm(cfg, { primaryDeg: P, secondaryDeg: S, toolMm: tool });
        const q = t0.map((v) => (v / tn) * (cfg.pivotLengthMm + tool));
        const ref = mathjsRotate(
          axisOf[cfg.primary],
          P * RAD_PER_DEG,
          mathjsRotate(axisOf[cfg.secondary], S * RAD_PER_DEG, q),
        );
        for (let k = 0; k < 3; k++) {
          expect(tip[k]).toBe(nom[k]);
          expect(Math.abs(tip[k]! - ref[k]!)).toBeLessThan(1e-12);
        }
      }
    }
  });

  it("pure rotation errors match an independent construction with mathjs (rotated axes, then rotations)", () => {
    const arc = Math.PI / 648000; // 1″ in rad, by definition
    const e: HeadErrors = {
      primary_zero_arcsec: 120,
      secondary_zero_arcsec: -80,
      secondary_tilt_arcsec: 60,
      secondary_yaw_arcsec: -40,
      primary_tilt_s_arcsec: 150,
      primary_tilt_n_arcsec: -90,
    };
    const P = 33;
    const S = -47;
    const p = [0, 0, 1];
    const s = [1, 0, 0];
    const n = [0, 1, 0]; // p × s for C/A
    const sp = mathjsRotate(n, 60 * arc, mathjsRotate(p, -40 * arc, s));
    const pp = mathjsRotate(s, 150 * arc, mathjsRotate(n, -90 * arc, p));
    const q = [0, 0, -152.4];
    const ref = mathjsRotate(
      pp,
      P * RAD_PER_DEG + 120 * arc,
      mathjsRotate(sp, S * RAD_PER_DEG - 80 * arc, q),
    );
    const tip = headTipMm(CA, e, { primaryDeg: P, secondaryDeg: S });
    for (let k = 0; k < 3; k++) expect(Math.abs(tip[k]! - ref[k]!)).toBeLessThan(1e-12);
  });

  it("offsets: pivot length along t, tip offsets along s and n, secondary axis through e·n (geometry/README.md)", () => {
    const e: HeadErrors = {
      pivot_length_error_um: 100,
      tip_offset_s_um: 20,
      tip_offset_n_um: -30,
      secondary_offset_um: 50,
    };
    // At P = S = 0 no rotation acts: tip = q = (L0 + 0.1)·t + 0.02·s − 0.03·n (o cancels).
    const tip = headTipMm(CA, e, { primaryDeg: 0, secondaryDeg: 0 });
    expect(tip[0]).toBeCloseTo(0.02, 12);
    expect(tip[1]).toBeCloseTo(-0.03, 12);
    expect(tip[2]).toBeCloseTo(-152.5, 12);
    // S = 90° about +X: v = o + R(x, 90°)(q − o), o = (0, 0.05, 0).
    const q = [0.02, -0.03 - 0.05, -152.5];
    const r = mathjsRotate([1, 0, 0], Math.PI / 2, q);
    const tip90 = headTipMm(CA, e, { primaryDeg: 0, secondaryDeg: 90 });
    expect(Math.abs(tip90[0] - r[0]!)).toBeLessThan(1e-12);
    expect(Math.abs(tip90[1] - (0.05 + r[1]!))).toBeLessThan(1e-12);
    expect(Math.abs(tip90[2] - r[2]!)).toBeLessThan(1e-12);
    // Measurement model m = c − (tip − tip₀).
    const m = measuredSphereCentreMm(CA, e, [1, 2, 3], { primaryDeg: 0, secondaryDeg: 0 });
    expect(m[0]).toBeCloseTo(1 - 0.02, 12);
    expect(m[2]).toBeCloseTo(3 + 0.1, 12);
  });
});

describe("analytic Jacobian", () => {
  it("matches central finite differences for random configs, errors and poses (numerical differentiation)", () => {
    const letters = fc.constantFrom<[HeadConfig["primary"], HeadConfig["secondary"]]>(
      ["C", "A"],
      ["C", "B"],
      ["B", "A"],
      ["A", "C"],
      ["B", "C"],
      ["A", "B"],
    );
    fc.assert(
      fc.property(
        letters,
        fc.double({ min: 50, max: 400, noNaN: true }),
        fc.array(fc.double({ min: -200, max: 200, noNaN: true }), { minLength: 10, maxLength: 10 }),
        fc.double({ min: -360, max: 360, noNaN: true }),
        fc.double({ min: -90, max: 90, noNaN: true }),
        fc.double({ min: 0, max: 150, noNaN: true }),
        ([pr, se], L, errs, P, S, tool) => {
          const axes = headAxes({ primary: pr, secondary: se, pivotLengthMm: L });
          const k = new HeadKernel(axes, errs);
          k.eval(P, S, tool, true);
          const h = 0.01; // µm or arcsec; the model is smooth, truncation error O(h²) is far below the check
          for (let j = 0; j < 10; j++) {
            const up = [...errs];
            const dn = [...errs];
            up[j]! += h;
            dn[j]! -= h;
            const ku = new HeadKernel(axes, up);
            const kd = new HeadKernel(axes, dn);
            ku.eval(P, S, tool, false);
            kd.eval(P, S, tool, false);
            for (let c = 0; c < 3; c++) {
              const fd = (ku.tip[c]! - kd.tip[c]!) / (2 * h);
              expect(Math.abs(fd - k.jac[c * 10 + j]!)).toBeLessThan(1e-9);
            }
          }
        },
      ),
      { numRuns: 50, seed: 11 },
    );
  });
});

describe("head configuration", () => {
  it("parses the snake_case head file; tool direction defaults to −Z", () => {
    const c = parseHeadConfig({ primary: "C", secondary: "A", pivot_length_mm: 152.4 });
    expect(c).toEqual({ primary: "C", secondary: "A", pivotLengthMm: 152.4 });
    expect(headAxes(c).t).toEqual([0, 0, -1]);
    expect(headAxes(c).n).toEqual([0, 1, 0]);
    const d = parseHeadConfig({
      primary: "C",
      secondary: "A",
      pivot_length_mm: 152.4,
      tool_direction: [0, 0, -2],
    });
    expect(headAxes(d).t).toEqual([0, 0, -1]);
  });

  it("refuses bad files with errors that name the field", () => {
    const fail = (j: unknown) => {
      try {
        parseHeadConfig(j);
      } catch (e) {
        expect(e).toBeInstanceOf(GeometryError);
        expect((e as GeometryError).code).toBe("bad_config");
        return (e as GeometryError).issues.map((i) => i.column);
      }
      throw new Error("no error");
    };
    expect(fail({ primary: "C", secondary: "C", pivot_length_mm: 1 })).toEqual(["secondary"]);
    expect(fail({ primary: "D", secondary: "A", pivot_length_mm: 1 })).toEqual(["primary"]);
    expect(fail({ primary: "C", secondary: "A", pivot_length_mm: -5 })).toEqual(["pivot_length_mm"]);
    expect(fail({ primary: "C", secondary: "A" })).toEqual(["pivot_length_mm"]);
    expect(fail({ primary: "C", secondary: "A", pivot_length_mm: 1, tool_direction: [0, 0] })).toEqual([
      "tool_direction",
    ]);
    expect(fail({ primary: "C", secondary: "A", pivot_length_mm: 1, pivot: 2 })).toEqual(["pivot"]);
    expect(fail([1, 2])).toEqual([undefined]);
    expect(() => headAxes({ primary: "C", secondary: "C", pivotLengthMm: 1 })).toThrow(GeometryError);
  });

  it("ISO 230-1 style symbols: C/A gives EY0A, EB0A, EA0C, EB0C, EC0C, EA0A as geometry/README.md lists", () => {
    const s = headParameterSymbols(CA);
    expect(s.secondary_offset_um).toBe("EY0A");
    expect(s.secondary_tilt_arcsec).toBe("EB0A");
    expect(s.primary_tilt_s_arcsec).toBe("EA0C");
    expect(s.primary_tilt_n_arcsec).toBe("EB0C");
    expect(s.primary_zero_arcsec).toBe("EC0C");
    expect(s.secondary_zero_arcsec).toBe("EA0A");
    expect(s.secondary_yaw_arcsec).toBe("EC0A");
    const cb = headParameterSymbols({ primary: "C", secondary: "B", pivotLengthMm: 100 });
    expect(cb.secondary_offset_um).toBe("EX0B");
    expect(cb.secondary_zero_arcsec).toBe("EB0B");
    expect(new Set(HEAD_PARAMETER_KEYS.map((k) => s[k])).size).toBe(10);
  });
});
