// The head fit: cross-checked against an independent general-purpose solver (ml-levenberg-marquardt
// from the npm registry), property tests on synthetic data (fast-check), identifiability facts of
// geometry/README.md, and bad input.
import fc from "fast-check";
import { levenbergMarquardt as mlLm } from "ml-levenberg-marquardt";
import { describe, expect, it } from "vitest";
import {
  fitHead,
  headFitToJson,
  headPoseGrid,
  HEAD_PARAMETER_KEYS,
  measuredSphereCentreMm,
  planHeadPoses,
  synthesiseSphereProbe,
  type HeadConfig,
  type HeadErrors,
  type HeadFitResult,
  type SphereProbeData,
} from "@/geometry";
import { CA, ERR, thrown, HEAD_FIT_JSON_KEYS } from "./head-helpers";
import { vec3 } from "./arbitraries";

const grid = (tools: number[], primarySteps = 8) =>
  headPoseGrid({ primarySteps, secondaryDeg: [-90, -45, 0, 45, 90], toolMm: tools });
const value = (r: HeadFitResult, k: string) => r.parameters.find((p) => p.key === k)!;

describe("fitHead against ml-levenberg-marquardt (independent general-purpose package)", () => {
  it("both reach the same estimates on the same synthetic data", () => {
    const poses = grid([0, 100], 6);
    const data = synthesiseSphereProbe(CA, ERR, poses, { noiseUm: 1, seed: 5, centreMm: [10, -20, 30] });
    const ours = fitHead(CA, data);
    const freeKeys = HEAD_PARAMETER_KEYS.filter((k) => k !== "secondary_yaw_arcsec");
    // The package fits y = f(x) for scalar x: x is the index of a coordinate (3 per pose), y the
    // measured coordinate in µm; unknowns c (µm) and the free parameters (µm, arcsec). Its model is
    // our public measuredSphereCentreMm, so it shares no Jacobian or solver code with fitHead.
    const n = data.rows;
    const y = new Float64Array(3 * n);
    for (let i = 0; i < n; i++)
      [y[3 * i], y[3 * i + 1], y[3 * i + 2]] = [
        data.xMm[i]! * 1000,
        data.yMm[i]! * 1000,
        data.zMm[i]! * 1000,
      ];
    const model = (params: number[]) => {
      const errs: HeadErrors = Object.fromEntries(freeKeys.map((k, j) => [k, params[3 + j]!]));
      const out = new Float64Array(3 * n);
      for (let i = 0; i < n; i++) {
        const m = measuredSphereCentreMm(
          CA,
          errs,
          [params[0]! / 1000, params[1]! / 1000, params[2]! / 1000],
          {
            primaryDeg: data.primaryDeg[i]!,
            secondaryDeg: data.secondaryDeg[i]!,
            toolMm: data.toolMm![i]!,
          },
        );
        out.set(
          m.map((v) => v * 1000),
          3 * i,
        );
      }
      return (x: number) => out[x]!;
    };
    const theirs = mlLm({ x: Array.from({ length: 3 * n }, (_, i) => i), y }, model, {
      initialValues: [10000, -20000, 30000, ...freeKeys.map(() => 0)],
      maxIterations: 30,
      centralDifference: true,
      gradientDifference: 1e-2,
      errorTolerance: 1e-9,
    });
    freeKeys.forEach((k, j) =>
      expect(Math.abs(value(ours, k).value - theirs.parameterValues[3 + j]!)).toBeLessThan(1e-4),
    );
    for (let c = 0; c < 3; c++)
      expect(Math.abs(ours.sphere_centre_mm[c]! * 1000 - theirs.parameterValues[c]!)).toBeLessThan(1e-4);
  });
});

describe("fitHead properties (fast-check, synthetic data)", () => {
  // Errors within ±200 µm / ±200″, noise up to 2 µm, poses over the full primary turn, secondary
  // −90..+90°, two tool lengths. secondary_yaw stays 0 in the truth: it is held at 0 by default and
  // cannot be separated from primary_zero (tested below), so a non-zero truth would be carried by
  // primary_zero and this test would compare the wrong quantity.
  // Tolerance: within 2U (= 4u). Within U (2u) is what a 95 % interval gives, so about one
  // comparison in twenty would legitimately fall outside and a test over ~200 comparisons would
  // fail by design; |z| > 4 has probability 6e-5. As a check that u itself is honest (not just
  // large), the mean of z² over all comparisons must be near 1 (chi-square, ~200 degrees of freedom).
  it("recovers every identifiable parameter within its uncertainty", () => {
    const z2: number[] = [];
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -200, max: 200, noNaN: true }), { minLength: 9, maxLength: 9 }),
        fc.double({ min: 0.2, max: 2, noNaN: true }),
        fc.integer({ min: 1, max: 1e6 }),
        (vals, noise, seed) => {
          const keys = HEAD_PARAMETER_KEYS.filter((k) => k !== "secondary_yaw_arcsec");
          const truth: HeadErrors = Object.fromEntries(keys.map((k, j) => [k, vals[j]!]));
          const data = synthesiseSphereProbe(CA, truth, grid([0, 100], 6), {
            noiseUm: noise,
            seed,
            centreMm: [250, -40, 600],
          });
          const r = fitHead(CA, data);
          for (const p of r.parameters) {
            if (p.pinned) continue;
            expect(p.identifiable).toBe("yes");
            const z = (p.value - truth[p.key]!) / p.u!;
            z2.push(z * z);
            expect(Math.abs(p.value - truth[p.key]!)).toBeLessThanOrEqual(2 * p.U!);
          }
        },
      ),
      { numRuns: 25, seed: 2024 },
    );
    const mean = z2.reduce((a, b) => a + b, 0) / z2.length;
    expect(mean).toBeGreaterThan(0.7);
    expect(mean).toBeLessThan(1.35);
  });

  it("translating the data moves only the sphere centre; permuting rows changes nothing beyond 1e-9; re-runs are bit-identical", () => {
    fc.assert(
      fc.property(vec3(-500, 500), fc.integer({ min: 1, max: 1e6 }), (shift, seed) => {
        const data = synthesiseSphereProbe(CA, ERR, grid([0, 80], 5), { noiseUm: 1, seed });
        const base = fitHead(CA, data);
        const moved = fitHead(CA, {
          ...data,
          xMm: data.xMm.map((v) => v + shift[0]),
          yMm: data.yMm.map((v) => v + shift[1]),
          zMm: data.zMm.map((v) => v + shift[2]),
        });
        base.parameters.forEach((p, j) =>
          expect(Math.abs(p.value - moved.parameters[j]!.value)).toBeLessThan(1e-7),
        );
        for (let c = 0; c < 3; c++)
          expect(Math.abs(moved.sphere_centre_mm[c]! - base.sphere_centre_mm[c]! - shift[c]!)).toBeLessThan(
            1e-9,
          );
        const order = Array.from({ length: data.rows }, (_, i) => i).sort(
          (a, b) => ((a * 7919 + seed) % 101) - ((b * 7919 + seed) % 101),
        );
        const pick = (a: Float64Array) => Float64Array.from(order, (i) => a[i]!);
        const perm: SphereProbeData = {
          rows: data.rows,
          primaryDeg: pick(data.primaryDeg),
          secondaryDeg: pick(data.secondaryDeg),
          xMm: pick(data.xMm),
          yMm: pick(data.yMm),
          zMm: pick(data.zMm),
          toolMm: pick(data.toolMm!),
          sourceRow: Int32Array.from(order, (i) => data.sourceRow![i]!),
        };
        const permuted = fitHead(CA, perm);
        base.parameters.forEach((p, j) => {
          expect(Math.abs(p.value - permuted.parameters[j]!.value)).toBeLessThan(1e-9);
          if (p.u !== null) expect(Math.abs(p.u - permuted.parameters[j]!.u!)).toBeLessThan(1e-9);
        });
        expect(JSON.stringify(headFitToJson(fitHead(CA, data)))).toBe(JSON.stringify(headFitToJson(base)));
      }),
      { numRuns: 10, seed: 99 },
    );
  });
});

describe("identifiability is computed (geometry/README.md known facts)", () => {
  it("primary_zero and secondary_yaw cannot be separated: freed together both are 'no', with a warning", () => {
    const data = synthesiseSphereProbe(CA, ERR, grid([0, 100]), { noiseUm: 1, seed: 1 });
    const def = fitHead(CA, data);
    expect(value(def, "secondary_yaw_arcsec")).toMatchObject({
      identifiable: "no",
      pinned: true,
      value: 0,
      u: null,
    });
    expect(value(def, "primary_zero_arcsec").identifiable).toBe("yes");
    expect(
      def.warnings.some((w) => w.includes("secondary_yaw_arcsec") && w.includes("primary_zero_arcsec")),
    ).toBe(true);
    const freed = fitHead(CA, data, { free: ["secondary_yaw_arcsec"] });
    expect(value(freed, "secondary_yaw_arcsec").identifiable).toBe("no");
    expect(value(freed, "primary_zero_arcsec").identifiable).toBe("no");
    expect(freed.warnings.some((w) => w.includes("cannot be separated"))).toBe(true);
  });

  it("primary_zero carries the combined orientation when the truth has a yaw (C/A, tool along the primary axis)", () => {
    const data = synthesiseSphereProbe(
      CA,
      { primary_zero_arcsec: 30, secondary_yaw_arcsec: 20 },
      grid([0, 100]),
      { noiseUm: 0.5, seed: 4 },
    );
    const r = fitHead(CA, data);
    expect(Math.abs(value(r, "primary_zero_arcsec").value - 50)).toBeLessThan(
      2 * value(r, "primary_zero_arcsec").U!,
    );
  });

  it("secondary_zero and tip_offset_n cannot be separated with one tool length; two tool lengths separate them", () => {
    const one = fitHead(CA, synthesiseSphereProbe(CA, ERR, grid([0]), { noiseUm: 1, seed: 2 }));
    expect(value(one, "secondary_zero_arcsec").identifiable).toBe("no");
    expect(value(one, "tip_offset_n_um").identifiable).toBe("no");
    expect(
      one.warnings.some(
        (w) =>
          w.includes("tip_offset_n_um") &&
          w.includes("secondary_zero_arcsec") &&
          w.includes("second tool length"),
      ),
    ).toBe(true);
    const two = fitHead(CA, synthesiseSphereProbe(CA, ERR, grid([0, 100]), { noiseUm: 1, seed: 2 }));
    expect(value(two, "secondary_zero_arcsec").identifiable).toBe("yes");
    expect(value(two, "tip_offset_n_um").identifiable).toBe("yes");
  });

  it("the planner predicts the fit's uncertainty: u_fit ≈ s · u_per_um_noise (linear least squares)", () => {
    const poses = grid([0, 100]);
    const plan = planHeadPoses(CA, poses);
    const fit = fitHead(CA, synthesiseSphereProbe(CA, ERR, poses, { noiseUm: 1, seed: 8 }));
    plan.parameters.forEach((p, j) => {
      const f = fit.parameters[j]!;
      expect(p.identifiable).toBe(f.identifiable);
      if (p.u_per_um_noise === null) return expect(f.u).toBeNull();
      expect(Math.abs(f.u! / (fit.s_um * p.u_per_um_noise) - 1)).toBeLessThan(0.02);
    });
    const single = planHeadPoses(CA, grid([0]));
    expect(single.advice.some((a) => a.includes("second tool length"))).toBe(true);
  });
});

describe("other configurations", () => {
  it("C/B recovers the identifiable parameters", () => {
    const cfg: HeadConfig = { primary: "C", secondary: "B", pivotLengthMm: 120 };
    const r = fitHead(cfg, synthesiseSphereProbe(cfg, ERR, grid([0, 100]), { noiseUm: 1, seed: 3 }));
    for (const p of r.parameters)
      if (!p.pinned) expect(Math.abs(p.value - (ERR[p.key] ?? 0))).toBeLessThanOrEqual(2 * p.U!);
    expect(r.parameters.filter((p) => p.identifiable === "yes").length).toBe(9);
  });

  it("B/A with the tool along −Z: tip_offset_n is found inseparable from the pivot length (n ∥ t), the rest recovered", () => {
    const cfg: HeadConfig = { primary: "B", secondary: "A", pivotLengthMm: 200 };
    const truth: HeadErrors = { ...ERR, tip_offset_n_um: 0 };
    const r = fitHead(cfg, synthesiseSphereProbe(cfg, truth, grid([0, 100]), { noiseUm: 1, seed: 6 }));
    expect(value(r, "tip_offset_n_um")).toMatchObject({ identifiable: "no", pinned: true });
    expect(value(r, "pivot_length_error_um").identifiable).toBe("no");
    for (const p of r.parameters)
      if (!p.pinned) expect(Math.abs(p.value - (truth[p.key] ?? 0))).toBeLessThanOrEqual(2 * p.U!);
  });
});

describe("bad input gives a typed GeometryError naming what is wrong", () => {
  const data = synthesiseSphereProbe(CA, ERR, grid([0, 100], 4), { noiseUm: 1, seed: 1 });
  const cut = (d: SphereProbeData, n: number): SphereProbeData => ({
    rows: n,
    primaryDeg: d.primaryDeg.slice(0, n),
    secondaryDeg: d.secondaryDeg.slice(0, n),
    xMm: d.xMm.slice(0, n),
    yMm: d.yMm.slice(0, n),
    zMm: d.zMm.slice(0, n),
    toolMm: d.toolMm!.slice(0, n),
    sourceRow: d.sourceRow!.slice(0, n),
  });

  it("fewer poses than parameters", () => {
    const e = thrown(() => fitHead(CA, cut(data, 8)));
    expect(e.code).toBe("too_few_rows");
    expect(e.message).toContain("8 poses for 12 unknowns");
  });

  it("duplicate poses name both rows", () => {
    const d = cut(data, 20);
    d.primaryDeg[7] = d.primaryDeg[2]!;
    d.secondaryDeg[7] = d.secondaryDeg[2]!;
    d.toolMm![7] = d.toolMm![2]!;
    const e = thrown(() => fitHead(CA, d));
    expect(e.code).toBe("duplicate_pose");
    expect(e.issues[0]).toMatchObject({ row: 9 });
    expect(e.message).toContain("row 9 repeats the pose of row 4");
    // The same pose with distinct repeat indices is fine.
    expect(() =>
      fitHead(CA, { ...d, repeat: Float64Array.from({ length: 20 }, (_, i) => (i === 7 ? 2 : 1)) }),
    ).not.toThrow();
  });

  it("NaN names the row and column", () => {
    const d = cut(data, 20);
    d.yMm[5] = NaN;
    const e = thrown(() => fitHead(CA, d));
    expect(e.code).toBe("bad_number");
    expect(e.issues[0]).toMatchObject({ row: 7, column: "y" });
  });

  it("no convergence is reported, not hidden", () => {
    const e = thrown(() => fitHead(CA, data, { maxIterations: 1 }));
    expect(e.code).toBe("no_convergence");
  });

  it("unknown parameter names in the pin list", () => {
    expect(thrown(() => fitHead(CA, data, { pin: ["bogus" as never] })).code).toBe("bad_option");
  });

  it("the CLI JSON has exactly the documented keys (geometry/README.md, command line)", () => {
    const j = headFitToJson(fitHead(CA, data));
    expect(Object.keys(j)).toEqual(HEAD_FIT_JSON_KEYS);
    expect(Object.keys(j.parameters[0]!)).toEqual(["key", "iso", "value", "unit", "u", "U", "identifiable"]);
  });
});
