// Weak, degenerate and hostile input to the head fit (solver duties): valid but weak data end in a
// result with "weak" flags and U; "yes" needs U within the limit or the stated scale (10 µm / 10″);
// no spread of poses and out-of-range tool lengths are errors naming what is wrong; no finite input
// crashes the fit or `fit-head` (a clean GeometryError or exit code 2 is allowed).
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import fc from "fast-check";
import { Matrix, SingularValueDecomposition } from "ml-matrix";
import { afterAll, describe, expect, it } from "vitest";
import {
  fitHead,
  GeometryError,
  headPoseGrid,
  HEAD_PARAMETER_KEYS,
  measuredSphereCentreMm,
  synthesiseSphereProbe,
  type HeadErrors,
  type HeadFitResult,
  type SphereProbeData,
} from "@/geometry";
import { CA, ERR, thrown } from "./head-helpers";
import { main } from "@/lib/cli/geometry";

const synth = (secondaryDeg: number[], toolMm: number[], seed = 7) =>
  synthesiseSphereProbe(CA, ERR, headPoseGrid({ primarySteps: 24, secondaryDeg, toolMm }), {
    noiseUm: 1,
    seed,
    centreMm: [250, -120, 400],
  });
const param = (r: HeadFitResult, key: string) => r.parameters.find((p) => p.key === key)!;
/** No parameter is "yes" with U above the 10 µm / 10″ scale. */
const noLargeYes = (r: HeadFitResult) =>
  r.parameters.filter((p) => p.identifiable === "yes" && p.U !== null && p.U > 10).map((p) => p.key);

/**
 * Standard uncertainties from an independent computation: a central-difference Jacobian of the
 * public forward model (measuredSphereCentreMm) at the estimate, and the covariance s²·V Σ⁻² Vᵀ from
 * ml-matrix's singular value decomposition of that Jacobian (a general-purpose library).
 */
function independentU(data: SphereProbeData, r: HeadFitResult): Map<string, number> {
  const free = r.parameters.filter((p) => !p.pinned);
  const theta = [...r.sphere_centre_mm.map((v) => v * 1000), ...free.map((p) => p.value)];
  const resid = (t: number[]) => {
    const errs: HeadErrors = Object.fromEntries(free.map((p, j) => [p.key, t[3 + j]!]));
    const out: number[] = [];
    for (let i = 0; i < data.rows; i++) {
      const m = measuredSphereCentreMm(CA, errs, [t[0]! / 1000, t[1]! / 1000, t[2]! / 1000], {
        primaryDeg: data.primaryDeg[i]!,
        secondaryDeg: data.secondaryDeg[i]!,
        toolMm: data.toolMm ? data.toolMm[i]! : 0,
      });
      out.push(
        data.xMm[i]! * 1000 - m[0] * 1000,
        data.yMm[i]! * 1000 - m[1] * 1000,
        data.zMm[i]! * 1000 - m[2] * 1000,
      );
    }
    return out;
  };
  const r0 = resid(theta);
  const J = new Matrix(r0.length, theta.length);
  theta.forEach((_, j) => {
    const h = 1e-3;
    const up = resid(theta.map((v, k) => (k === j ? v + h : v)));
    const dn = resid(theta.map((v, k) => (k === j ? v - h : v)));
    for (let i = 0; i < r0.length; i++) J.set(i, j, (up[i]! - dn[i]!) / (2 * h));
  });
  const s2 = r0.reduce((a, v) => a + v * v, 0) / (r0.length - theta.length);
  const svd = new SingularValueDecomposition(J);
  const V = svd.rightSingularVectors;
  const sv = svd.diagonal;
  const out = new Map<string, number>();
  free.forEach((p, j) => {
    let c = 0;
    for (let k = 0; k < sv.length; k++) c += V.get(3 + j, k) ** 2 / sv[k]! ** 2;
    out.set(p.key, Math.sqrt(s2 * c));
  });
  return out;
}

describe("valid but weak data end in a result with weak flags and U, not a non-convergence error", () => {
  it("secondary swept only ±0.2°: a result; secondary_tilt is weak with a large U, never 'yes'", () => {
    const data = synth([-0.2, -0.1, 0, 0.1, 0.2], [0, 100]);
    const r = fitHead(CA, data);
    const tilt = param(r, "secondary_tilt_arcsec");
    expect(tilt.identifiable).toBe("weak");
    expect(tilt.U!).toBeGreaterThan(1000);
    expect(noLargeYes(r)).toEqual([]);
    expect(r.warnings.join(" ")).toMatch(/secondary_tilt_arcsec .*U = .* exceeds 10 ″/);
    expect(r.warnings.join(" ")).toMatch(/secondary angles over a wider range/);
    for (const p of r.parameters) if (!p.pinned) expect(Number.isFinite(p.U!)).toBe(true);
  });

  it("two tool lengths 0.01 mm apart: tip_offset_n and secondary_zero weak, advice names the tool spread; U as an independent SVD gives it", () => {
    const data = synth([-90, -45, 0, 45, 90], [100, 100.01]);
    const r = fitHead(CA, data);
    expect(param(r, "tip_offset_n_um").identifiable).toBe("weak");
    expect(param(r, "secondary_zero_arcsec").identifiable).toBe("weak");
    expect(noLargeYes(r)).toEqual([]);
    expect(r.warnings.join(" ")).toMatch(/tool lengths further apart \(these span only 0\.01 mm/);
    // Honest U: the covariance matches ml-matrix's SVD of a finite-difference Jacobian (1 %).
    const indep = independentU(data, r);
    for (const [key, u] of indep) expect(Math.abs(param(r, key).u! / u - 1)).toBeLessThan(0.01);
    // And the truth lies within U for the weak pair (they carry it, U is large).
    for (const key of ["tip_offset_n_um", "secondary_zero_arcsec"] as const)
      expect(Math.abs(param(r, key).value - ERR[key]!)).toBeLessThan(param(r, key).U!);
  });

  it("a limit tighter than U withholds 'yes' and says which limit", () => {
    const data = synth([-90, -45, 0, 45, 90], [0, 100]);
    const free = fitHead(CA, data);
    const p = param(free, "pivot_length_error_um");
    expect(p.identifiable).toBe("yes");
    const r = fitHead(CA, data, { limits: { pivot_length_error_um: p.U! / 2 } });
    expect(param(r, "pivot_length_error_um").identifiable).toBe("weak");
    expect(r.warnings.join(" ")).toMatch(/pivot_length_error_um .*exceeds .* \(its limit\)/);
    expect(param(r, "pivot_length_error_um").value).toBe(p.value);
  });
});

describe("rank-deficient and out-of-range input is an error naming what is missing or wrong", () => {
  it("50 identical poses differing only in repeat: no spread of poses", () => {
    const n = 50;
    const data: SphereProbeData = {
      rows: n,
      primaryDeg: new Float64Array(n).fill(30),
      secondaryDeg: new Float64Array(n).fill(45),
      xMm: new Float64Array(n).fill(100),
      yMm: new Float64Array(n).fill(200),
      zMm: new Float64Array(n).fill(300),
      repeat: Float64Array.from({ length: n }, (_, i) => i + 1),
    };
    const e = thrown(() => fitHead(CA, data));
    expect(e.code).toBe("degenerate");
    expect(e.message).toMatch(/all 50 rows are at one pose \(primary 30°, secondary 45°\)/);
    expect(e.message).toMatch(/primary angles around the full turn/);
  });

  it("tool_mm of −1e6 is refused with its row and column; 0 … 2 000 mm is the range", () => {
    const data = synth([-90, 0, 90], [0, 100]);
    const toolMm = Float64Array.from(data.toolMm!);
    toolMm[4] = -1e6;
    toolMm[9] = 2000.5;
    const e = thrown(() => fitHead(CA, { ...data, toolMm }));
    expect(e.code).toBe("bad_value");
    expect(e.issues[0]).toMatchObject({ row: 6, column: "tool_mm" });
    expect(e.issues[0]!.message).toMatch(/-1000000 mm, outside 0 … 2000 mm/);
    expect(e.issues[1]).toMatchObject({ row: 11, column: "tool_mm" });
  });
});

describe("no finite input crashes the fit or fit-head (fast-check)", () => {
  const dir = mkdtempSync(join(tmpdir(), "trammel-head-weak-"));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  const head = join(dir, "head.json");
  writeFileSync(head, JSON.stringify({ primary: "C", secondary: "A", pivot_length_mm: 152.4 }));
  const finite = fc.oneof(
    fc.double({ noNaN: true, noDefaultInfinity: true }),
    fc.double({ min: -1000, max: 1000, noNaN: true }),
    fc.constantFrom(0, -0, 1e-300, 1e155, -1e155, 90, 180, 360),
  );
  const row = fc.tuple(finite, finite, finite, finite, finite, fc.option(finite, { nil: undefined }));

  it("fitHead returns all-finite numbers or throws a GeometryError", () => {
    fc.assert(
      fc.property(fc.array(row, { minLength: 1, maxLength: 40 }), fc.boolean(), (rows, withTool) => {
        const col = (k: number) => Float64Array.from(rows, (r) => (r[k] as number | undefined) ?? 0);
        const data: SphereProbeData = {
          rows: rows.length,
          primaryDeg: col(0),
          secondaryDeg: col(1),
          xMm: col(2),
          yMm: col(3),
          zMm: col(4),
          ...(withTool ? { toolMm: col(5) } : {}),
        };
        try {
          const r = fitHead(CA, data);
          for (const p of r.parameters) {
            expect(Number.isFinite(p.value)).toBe(true);
            if (p.U !== null) expect(Number.isFinite(p.U)).toBe(true);
          }
          expect(r.sphere_centre_mm.every(Number.isFinite)).toBe(true);
          expect(Number.isFinite(r.rms_um)).toBe(true);
        } catch (e) {
          expect(e).toBeInstanceOf(GeometryError);
        }
      }),
      { numRuns: 150, seed: 17 },
    );
  });

  it("fit-head exits 0 with finite JSON or 2 with a message; never 1 or a stack trace", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(row, { minLength: 1, maxLength: 30 }),
        fc.array(fc.tuple(fc.double({ min: 0, max: 359 }), fc.double({ min: -90, max: 90 })), {
          minLength: 0,
          maxLength: 20,
        }),
        async (rows, spread) => {
          // Hostile rows, sometimes after a set of ordinary poses so the fit gets far.
          const lines = ["primary_deg,secondary_deg,x,y,z,tool_mm"];
          spread.forEach(([p, s], i) =>
            lines.push(`${p},${s},${100 + i},${200 - i},${300 + i / 3},${i % 2 ? 100 : 0}`),
          );
          rows.forEach((r) => lines.push(r.map((v) => (v === undefined ? "0" : String(v))).join(",")));
          const file = join(dir, "in.csv");
          writeFileSync(file, lines.join("\n"));
          let out = "";
          let err = "";
          const code = await main(
            ["fit-head", file, "--head", head],
            (s) => (out += s),
            (s) => (err += s),
          );
          expect([0, 2]).toContain(code);
          if (code === 0) {
            const j = JSON.parse(out) as {
              parameters: { value: number; U: number | null }[];
              rms_um: number;
            };
            expect(j.parameters.every((p) => Number.isFinite(p.value))).toBe(true);
            expect(Number.isFinite(j.rms_um)).toBe(true);
          } else {
            expect(err).toMatch(/^error: /);
            expect(err).not.toMatch(/ at .*\.ts:\d+/);
          }
        },
      ),
      { numRuns: 60, seed: 23 },
    );
  });
});

it("HEAD_PARAMETER_KEYS still lists the ten parameters the tests above name", () => {
  expect(HEAD_PARAMETER_KEYS).toContain("secondary_tilt_arcsec");
  expect(HEAD_PARAMETER_KEYS).toHaveLength(10);
});
