/**
 * Synthetic sphere-probe data from known errors, for tests, the benchmark and the demo seed (never
 * presented as a measurement). Deterministic: a seeded PRNG (mulberry32, a public-domain 32-bit
 * generator) and Gaussian noise by the Box–Muller transform.
 */
import { GeometryError } from "../errors";
import type { SphereProbeData } from "../types";
import { headAxes, type HeadConfig, type HeadErrors, type HeadVec3 as Vec3 } from "./config";
import { HeadKernel } from "./kernel";
import { headErrorVector, type HeadPose } from "./model";

/** A uniform [0, 1) generator from a 32-bit seed (mulberry32). */
export function seededUniform(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates from a uniform generator (Box–Muller; one value per call). */
export function seededGaussian(seed: number): () => number {
  const u = seededUniform(seed);
  let spare: number | undefined;
  return () => {
    if (spare !== undefined) {
      const s = spare;
      spare = undefined;
      return s;
    }
    let u1 = u();
    while (u1 === 0) u1 = u();
    const r = Math.sqrt(-2 * Math.log(u1));
    const a = 2 * Math.PI * u();
    spare = r * Math.sin(a);
    return r * Math.cos(a);
  };
}

export interface PoseGridOptions {
  /** Number of primary angles spread evenly over the full turn (0 ≤ P < 360°). */
  readonly primarySteps: number;
  /** Secondary angles, degrees (e.g. −90, −45, 0, 45, 90). */
  readonly secondaryDeg: readonly number[];
  /** Tool lengths in mm (default [0]). */
  readonly toolMm?: readonly number[];
}

/** Every combination of primary angle × secondary angle × tool length, tool length outermost. */
export function headPoseGrid(options: PoseGridOptions): HeadPose[] {
  const poses: HeadPose[] = [];
  for (const toolMm of options.toolMm ?? [0]) {
    for (let i = 0; i < options.primarySteps; i++) {
      for (const secondaryDeg of options.secondaryDeg)
        poses.push({ primaryDeg: (360 * i) / options.primarySteps, secondaryDeg, toolMm });
    }
  }
  return poses;
}

export interface SynthOptions {
  /** Standard deviation of the Gaussian noise on each coordinate, µm (default 0). */
  readonly noiseUm?: number;
  readonly seed?: number;
  /** Sphere centre c, mm (default [0, 0, 0]). */
  readonly centreMm?: Vec3;
}

/**
 * Sphere-probe data for known errors: mᵢ = c − (tip(Pᵢ, Sᵢ) − tip₀(Pᵢ, Sᵢ)) + noise (mm), the
 * measurement model of geometry/README.md. Rows are numbered as a CSV file would number them
 * (header row 1, first pose row 2); `toolMm` is present when any pose gives a tool length.
 */
export function synthesiseSphereProbe(
  config: HeadConfig,
  errors: HeadErrors,
  poses: readonly HeadPose[],
  options: SynthOptions = {},
): SphereProbeData {
  const sigmaMm = (options.noiseUm ?? 0) / 1000;
  if (!(sigmaMm >= 0)) throw new GeometryError("bad_option", "the noise must be 0 µm or more");
  const c = options.centreMm ?? [0, 0, 0];
  const axes = headAxes(config);
  const k = new HeadKernel(axes, headErrorVector(errors));
  const k0 = new HeadKernel(axes, new Float64Array(10));
  const g = seededGaussian(options.seed ?? 1);
  const n = poses.length;
  const P = new Float64Array(n);
  const S = new Float64Array(n);
  const T = new Float64Array(n);
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  const z = new Float64Array(n);
  const sourceRow = new Int32Array(n);
  let anyTool = false;
  poses.forEach((pose, i) => {
    const tool = pose.toolMm ?? 0;
    if (pose.toolMm !== undefined) anyTool = true;
    k.eval(pose.primaryDeg, pose.secondaryDeg, tool, false);
    k0.eval(pose.primaryDeg, pose.secondaryDeg, tool, false);
    P[i] = pose.primaryDeg;
    S[i] = pose.secondaryDeg;
    T[i] = tool;
    x[i] = c[0] - (k.tip[0]! - k0.tip[0]!) + sigmaMm * g();
    y[i] = c[1] - (k.tip[1]! - k0.tip[1]!) + sigmaMm * g();
    z[i] = c[2] - (k.tip[2]! - k0.tip[2]!) + sigmaMm * g();
    sourceRow[i] = i + 2;
  });
  return {
    rows: n,
    primaryDeg: P,
    secondaryDeg: S,
    xMm: x,
    yMm: y,
    zMm: z,
    ...(anyTool ? { toolMm: T } : {}),
    sourceRow,
  };
}
