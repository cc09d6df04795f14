/**
 * Fit of the head's error parameters to sphere-probe data (docs/geometry.md, "Fit").
 *
 * Nonlinear least squares over the sphere centre c and the free parameters by Levenberg–Marquardt
 * (geometry/lm.ts): residuals in µm (measured minus modelled sphere centre, model
 * m = c − (tip − tip₀)), columns scaled by their norms, analytic Jacobian, JᵀJ and Jᵀr built in one
 * pass over the poses (normal.ts). Uncertainty: covariance s²·(JᵀJ)⁻¹ with s² = S/(3N − p) at the
 * estimate; u from its diagonal; U = 2u (coverage factor k = 2, about 95 %: JCGM 100:2008, GUM).
 * Identifiability: identifiability.ts.
 */
import { GeometryError, type GeometryIssue } from "../errors";
import { covarianceFromNormal, levenbergMarquardt } from "../lm";
import type { SphereProbeData } from "../types";
import {
  headAxes,
  headParameterSymbols,
  headParameterUnit,
  HEAD_PARAMETER_KEYS,
  type HeadConfig,
  type HeadParameterKey,
  type HeadParameterUnit,
  type HeadVec3 as Vec3,
} from "./config";
import {
  analyseHeadIdentifiability,
  initialFreeSet,
  type Identifiability,
  type ParameterSelection,
} from "./identifiability";
import { NP } from "./kernel";
import { headNormalEquations, poseTrig } from "./normal";

const ALL = HEAD_PARAMETER_KEYS.map((_, j) => j);
/** Initial damping of the scaled system (unit diagonal): small, so the first step is nearly Gauss–Newton. */
const INITIAL_DAMPING = 1e-9;
/** At most this many outliers are listed (the worst); all are counted. */
export const MAX_LISTED_OUTLIERS = 50;

export interface HeadFitOptions extends ParameterSelection {
  /** Maximum LM iterations (default 50). */
  readonly maxIterations?: number;
  /** Relative scaled-step tolerance (default 1e-10). */
  readonly stepTolerance?: number;
  /** Gradient (cosine) tolerance (default 1e-10). */
  readonly gradientTolerance?: number;
}

export interface HeadFitParameter {
  readonly key: HeadParameterKey;
  /** Symbol beside the key (ISO 230-1 style where one applies; see headParameterSymbols). */
  readonly iso: string;
  /** Estimate, in `unit`; 0 when pinned. */
  readonly value: number;
  readonly unit: HeadParameterUnit;
  /** Standard uncertainty in `unit`; null when the parameter is held at 0. */
  readonly u: number | null;
  /** Expanded uncertainty U = 2u in `unit`; null when held at 0. */
  readonly U: number | null;
  readonly identifiable: Identifiability;
  readonly pinned: boolean;
}

export interface HeadFitOutlier {
  /** Source row (header = row 1) of the pose. */
  readonly row: number;
  /** Residual (measured − modelled centre), µm. */
  readonly residual_um: Vec3;
  /** Largest |component| / s. */
  readonly normalised: number;
}

export interface HeadFitResult {
  readonly parameters: readonly HeadFitParameter[];
  readonly sphere_centre_mm: Vec3;
  /** RMS over poses of the residual vector length, µm. */
  readonly rms_um: number;
  /** Largest residual vector length, µm. */
  readonly max_um: number;
  /** Residual standard deviation per coordinate s = √(S/(3N − p)), µm. */
  readonly s_um: number;
  readonly degrees_of_freedom: number;
  /** Residual vectors per pose, µm, interleaved x, y, z (3·rows). */
  readonly residuals_um: Float64Array;
  /** The worst (at most MAX_LISTED_OUTLIERS) poses with a residual component beyond 3 s, worst first. */
  readonly outliers: readonly HeadFitOutlier[];
  /** How many poses have a residual component beyond 3 s (all of them, listed or not). */
  readonly outlier_count: number;
  readonly iterations: number;
  readonly warnings: readonly string[];
  /** Covariance of the free unknowns [c (µm), free parameters], row-major, and their keys. */
  readonly covariance: { readonly keys: readonly string[]; readonly values: Float64Array };
}

const rowOf = (data: SphereProbeData, i: number) => (data.sourceRow ? data.sourceRow[i]! : i + 2);

/**
 * For each row, the first row with the same pose (primary, secondary, tool, repeat; exact values,
 * −0 = 0): an open-addressing hash table on typed arrays, no string or object per row.
 */
function firstEqualPose(
  n: number,
  P: Float64Array,
  S: Float64Array,
  T: Float64Array | undefined,
  R: Float64Array | undefined,
): Int32Array {
  let size = 16;
  while (size < 2 * n) size *= 2;
  const mask = size - 1;
  const table = new Int32Array(size).fill(-1);
  const out = new Int32Array(n);
  const f = new Float64Array(1);
  const w = new Uint32Array(f.buffer);
  const mix = (h: number, x: number) => {
    f[0] = x + 0; // −0 → 0
    h = Math.imul(h ^ w[0]!, 0x9e3779b1);
    h = Math.imul(h ^ w[1]!, 0x85ebca6b);
    return h ^ (h >>> 15);
  };
  for (let i = 0; i < n; i++) {
    const p = P[i]!;
    const s = S[i]!;
    const t = T ? T[i]! : 0;
    const r = R ? R[i]! : 0;
    let k = mix(mix(mix(mix(0x12345, p), s), t), r) & mask;
    for (;;) {
      const j = table[k]!;
      if (j === -1) {
        table[k] = i;
        out[i] = i;
        break;
      }
      if (P[j] === p && S[j] === s && (T ? T[j] : 0) === t && (R ? R[j] : 0) === r) {
        out[i] = j;
        break;
      }
      k = (k + 1) & mask;
    }
  }
  return out;
}

/** Non-finite inputs and duplicate poses, as GeometryErrors naming the rows. */
function validate(data: SphereProbeData): void {
  const n = data.rows;
  const cols: [string, Float64Array | undefined][] = [
    ["primary_deg", data.primaryDeg],
    ["secondary_deg", data.secondaryDeg],
    ["x", data.xMm],
    ["y", data.yMm],
    ["z", data.zMm],
    ["tool_mm", data.toolMm],
    ["repeat", data.repeat],
  ];
  const bad: GeometryIssue[] = [];
  for (const [name, a] of cols) {
    if (!a) continue;
    if (a.length < n)
      throw new GeometryError("bad_value", `column ${name} has ${a.length} values for ${n} rows`);
    for (let i = 0; i < n && bad.length < 50; i++) {
      if (!Number.isFinite(a[i]!))
        bad.push({ row: rowOf(data, i), column: name, message: `${name} is ${a[i]}, not a finite number` });
    }
  }
  if (bad.length > 0) {
    throw new GeometryError(
      "bad_number",
      `${bad.length} non-finite value${bad.length > 1 ? "s" : ""}: ${bad
        .slice(0, 5)
        .map((b) => `row ${b.row} ${b.message}`)
        .join("; ")}`,
      bad,
    );
  }
  const P = data.primaryDeg;
  const Sd = data.secondaryDeg;
  const T = data.toolMm;
  const R = data.repeat;
  const dup: GeometryIssue[] = [];
  const firstOf = firstEqualPose(n, P, Sd, T, R);
  for (let i = 0; i < n && dup.length < 50; i++) {
    const first = firstOf[i]!;
    if (first === i) continue;
    dup.push({
      row: rowOf(data, i),
      message: `row ${rowOf(data, i)} repeats the pose of row ${rowOf(data, first)} (primary ${P[i]}°, secondary ${Sd[i]}°, tool ${T ? T[i] : 0} mm${R ? `, repeat ${R[i]}` : ""}); give repeated poses a distinct repeat index or remove one`,
    });
  }
  if (dup.length > 0) {
    throw new GeometryError(
      "duplicate_pose",
      `${dup.length} duplicate pose${dup.length > 1 ? "s" : ""}: ${dup
        .slice(0, 3)
        .map((d) => d.message)
        .join("; ")}`,
      dup,
    );
  }
}

/**
 * Fit the head's error parameters and the sphere centre to sphere-probe data (mm, degrees; method
 * in the file header). Throws GeometryError: "too_few_rows" (fewer poses than unknowns),
 * "duplicate_pose" (same primary, secondary, tool and repeat index; rows named), "bad_number"
 * (non-finite input), "no_convergence", "degenerate".
 */
export function fitHead(
  config: HeadConfig,
  data: SphereProbeData,
  options: HeadFitOptions = {},
): HeadFitResult {
  const axes = headAxes(config);
  const symbols = headParameterSymbols(config);
  const n = data.rows;
  const startFree = initialFreeSet(options);
  if (n < 3 + startFree.length) {
    throw new GeometryError(
      "too_few_rows",
      `${n} pose${n === 1 ? "" : "s"} for ${3 + startFree.length} unknowns (the sphere centre and ${startFree.length} parameters): probe at least ${3 + startFree.length} poses, and many more for a useful uncertainty`,
    );
  }
  validate(data);
  const posesPlain = {
    rows: n,
    primaryDeg: data.primaryDeg,
    secondaryDeg: data.secondaryDeg,
    ...(data.toolMm ? { toolMm: data.toolMm } : {}),
  };
  const poses = { ...posesPlain, trig: poseTrig(posesPlain) };

  // Start c₀ = mean measured centre; measurements centred on it, in µm.
  let cx = 0;
  let cy = 0;
  let cz = 0;
  for (let i = 0; i < n; i++) {
    cx += data.xMm[i]!;
    cy += data.yMm[i]!;
    cz += data.zMm[i]!;
  }
  const c0: Vec3 = [cx / n, cy / n, cz / n];
  const meas = new Float64Array(3 * n);
  for (let i = 0; i < n; i++) {
    meas[3 * i] = 1000 * (data.xMm[i]! - c0[0]);
    meas[3 * i + 1] = 1000 * (data.yMm[i]! - c0[1]);
    meas[3 * i + 2] = 1000 * (data.zMm[i]! - c0[2]);
  }

  // First pass, at zero error over [c, all ten parameters]: the nominal tips tip₀, JᵀJ for the
  // identifiability analysis, and the normal equations of the start θ = 0 (r = meas there).
  const N = 3 + NP;
  const fullJtj = new Float64Array(N * N);
  const fullJtr = new Float64Array(N);
  const tip0 = new Float64Array(3 * n);
  const bufA = new Float64Array(3 * n);
  const S0 = headNormalEquations(
    axes,
    poses,
    null,
    meas,
    ALL,
    new Float64Array(NP),
    new Float64Array(N),
    fullJtj,
    fullJtr,
    bufA,
    tip0,
  );
  const ident = analyseHeadIdentifiability(config, posesPlain, options, fullJtj);
  const free = ident.freeIndices;
  if (free.length === 0)
    throw new GeometryError(
      "degenerate",
      "no error parameter can be determined from these poses; probe over the full primary turn, the secondary over a wide range (e.g. −90° to +90°) and two tool lengths",
    );
  const np = 3 + free.length;
  const dof = 3 * n - np;
  if (dof <= 0) throw new GeometryError("too_few_rows", `${n} poses leave no redundancy for ${np} unknowns`);

  // The solver asks for S at a trial point and, when it accepts it, for the normal equations there;
  // each pass computes both (and the residuals), so an accepted step costs one pass, not two.
  const params10 = new Float64Array(NP);
  interface Evaluation {
    theta: Float64Array;
    S: number;
    jtj: Float64Array;
    jtr: Float64Array;
    residuals: Float64Array;
  }
  const idx = [0, 1, 2, ...free.map((j) => 3 + j)];
  const start: Evaluation = {
    theta: new Float64Array(np),
    S: S0,
    jtj: Float64Array.from(
      { length: np * np },
      (_, k) => fullJtj[idx[Math.floor(k / np)]! * N + idx[k % np]!]!,
    ),
    jtr: Float64Array.from(idx, (a) => fullJtr[a]!),
    residuals: bufA,
  };
  let current = start;
  let trial: Evaluation | null = null;
  let spare: Float64Array = new Float64Array(3 * n);
  const same = (a: Float64Array, b: Float64Array) => a.every((v, k) => v === b[k]);
  const evaluate = (theta: Float64Array): Evaluation => {
    const e: Evaluation = {
      theta: Float64Array.from(theta),
      S: 0,
      jtj: new Float64Array(np * np),
      jtr: new Float64Array(np),
      residuals: spare,
    };
    e.S = headNormalEquations(axes, poses, tip0, meas, free, params10, theta, e.jtj, e.jtr, spare);
    return e;
  };
  const lm = levenbergMarquardt(
    {
      parameters: np,
      normalEquations: (theta, jtj, jtr) => {
        let e: Evaluation;
        if (same(current.theta, theta)) e = current;
        else if (trial !== null && same(trial.theta, theta)) e = trial;
        else e = evaluate(theta);
        if (e !== current) {
          spare = current.residuals;
          current = e;
          trial = null;
        }
        jtj.set(e.jtj);
        jtr.set(e.jtr);
        return e.S;
      },
      sumOfSquares: (theta) => {
        trial = evaluate(theta);
        return trial.S;
      },
    },
    start.theta,
    {
      maxIterations: options.maxIterations ?? 50,
      stepTolerance: options.stepTolerance,
      gradientTolerance: options.gradientTolerance,
      // A Gauss–Newton-like first step: this model is nearly linear in the errors, so from θ = 0
      // three iterations reach the minimum to 1e-7 µm / ″, where the solver's default 1e-3 took
      // five and stopped up to 1e-6 short of it (its damping still biased the last steps).
      initialDamping: INITIAL_DAMPING,
    },
  );
  if (!lm.converged) {
    throw new GeometryError(
      "no_convergence",
      `the fit did not converge in ${lm.iterations} iterations; check the head configuration (axis letters, pivot length, tool direction) against the data`,
    );
  }
  const final = same(current.theta, lm.theta) ? current : evaluate(lm.theta);
  const residuals = final.residuals;
  const S = final.S;
  const s2 = S / dof;
  const s = Math.sqrt(s2);
  const cov = covarianceFromNormal(lm.jtj, np, s2);

  const parameters: HeadFitParameter[] = HEAD_PARAMETER_KEYS.map((key, j) => {
    const st = ident.parameters[j]!;
    const col = free.indexOf(j);
    const unit = headParameterUnit(key);
    if (col < 0)
      return {
        key,
        iso: symbols[key],
        value: 0,
        unit,
        u: null,
        U: null,
        identifiable: st.identifiable,
        pinned: true,
      };
    const u = Math.sqrt(cov[(3 + col) * np + 3 + col]!);
    return {
      key,
      iso: symbols[key],
      value: lm.theta[3 + col]!,
      unit,
      u,
      U: 2 * u,
      identifiable: st.identifiable,
      pinned: false,
    };
  });

  let sumSq = 0;
  let max = 0;
  // Outliers: all counted, the worst MAX_LISTED_OUTLIERS kept (a min-heap on the normalised size),
  // so 10^6 poses with Gaussian noise (about 8 000 beyond 3 s by chance) list 50, not 8 000.
  let outlierCount = 0;
  const heap: number[] = []; // pose indices, heap-ordered by worstOf
  const worstOf = (i: number) =>
    Math.max(Math.abs(residuals[3 * i]!), Math.abs(residuals[3 * i + 1]!), Math.abs(residuals[3 * i + 2]!)) /
    s;
  const worse = (a: number, b: number) => worstOf(a) < worstOf(b) || (worstOf(a) === worstOf(b) && a > b);
  const siftDown = (k: number) => {
    for (;;) {
      const l = 2 * k + 1;
      const r = l + 1;
      let m = k;
      if (l < heap.length && worse(heap[l]!, heap[m]!)) m = l;
      if (r < heap.length && worse(heap[r]!, heap[m]!)) m = r;
      if (m === k) return;
      [heap[k], heap[m]] = [heap[m]!, heap[k]!];
      k = m;
    }
  };
  for (let i = 0; i < n; i++) {
    const r0 = residuals[3 * i]!;
    const r1 = residuals[3 * i + 1]!;
    const r2 = residuals[3 * i + 2]!;
    const len2 = r0 * r0 + r1 * r1 + r2 * r2;
    sumSq += len2;
    max = Math.max(max, Math.sqrt(len2));
    if (Math.max(Math.abs(r0), Math.abs(r1), Math.abs(r2)) / s > 3) {
      outlierCount++;
      if (heap.length < MAX_LISTED_OUTLIERS) {
        heap.push(i);
        for (let k = heap.length - 1; k > 0;) {
          const parent = (k - 1) >> 1;
          if (!worse(heap[k]!, heap[parent]!)) break;
          [heap[k], heap[parent]] = [heap[parent]!, heap[k]!];
          k = parent;
        }
      } else if (worse(heap[0]!, i)) {
        heap[0] = i;
        siftDown(0);
      }
    }
  }
  const outliers: HeadFitOutlier[] = heap
    .sort((a, b) => worstOf(b) - worstOf(a) || a - b)
    .map((i) => ({
      row: rowOf(data, i),
      residual_um: [residuals[3 * i]!, residuals[3 * i + 1]!, residuals[3 * i + 2]!],
      normalised: worstOf(i),
    }));
  const warnings = [...ident.warnings];
  if (outlierCount > 0) {
    const rows = outliers.map((o) => o.row).sort((a, b) => a - b);
    warnings.push(
      `${outlierCount} pose${outlierCount > 1 ? "s have" : " has"} a residual beyond 3 s (s = ${s.toPrecision(3)} µm)${outlierCount <= 5 ? `: row${outlierCount > 1 ? "s" : ""} ${rows.join(", ")}` : outlierCount > MAX_LISTED_OUTLIERS ? `; the worst ${MAX_LISTED_OUTLIERS} are listed` : ""}; with Gaussian noise about 0.8 % of poses exceed it by chance`,
    );
  }
  const covKeys = ["centre_x_um", "centre_y_um", "centre_z_um", ...free.map((j) => HEAD_PARAMETER_KEYS[j]!)];
  return {
    parameters,
    sphere_centre_mm: [c0[0] + lm.theta[0]! / 1000, c0[1] + lm.theta[1]! / 1000, c0[2] + lm.theta[2]! / 1000],
    rms_um: Math.sqrt(sumSq / n),
    max_um: max,
    s_um: s,
    degrees_of_freedom: dof,
    residuals_um: residuals,
    outliers,
    outlier_count: outlierCount,
    iterations: lm.iterations,
    warnings,
    covariance: { keys: covKeys, values: cov },
  };
}

/** The JSON `fit-head` prints (docs/geometry.md, "Command line"), exactly these keys. */
export interface HeadFitJson {
  readonly parameters: readonly {
    readonly key: HeadParameterKey;
    readonly iso: string;
    readonly value: number;
    readonly unit: HeadParameterUnit;
    readonly u: number | null;
    readonly U: number | null;
    readonly identifiable: Identifiability;
  }[];
  readonly sphere_centre_mm: Vec3;
  readonly rms_um: number;
  readonly max_um: number;
  readonly outliers: readonly { readonly row: number; readonly residual_um: Vec3 }[];
  readonly outlier_count: number;
  readonly iterations: number;
  readonly warnings: readonly string[];
}

/** A fit result as the `fit-head` JSON of docs/geometry.md. */
export function headFitToJson(result: HeadFitResult): HeadFitJson {
  return {
    parameters: result.parameters.map(({ key, iso, value, unit, u, U, identifiable }) => ({
      key,
      iso,
      value,
      unit,
      u,
      U,
      identifiable,
    })),
    sphere_centre_mm: result.sphere_centre_mm,
    rms_um: result.rms_um,
    max_um: result.max_um,
    outliers: result.outliers.map(({ row, residual_um }) => ({ row, residual_um })),
    outlier_count: result.outlier_count,
    iterations: result.iterations,
    warnings: result.warnings,
  };
}
