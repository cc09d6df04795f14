/**
 * Fit of the head's error parameters to sphere-probe data (geometry/README.md, "The fit").
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
  HEAD_PARAMETER_KEYS,
  type HeadConfig,
  type HeadParameterKey,
  type HeadVec3 as Vec3,
} from "./config";
import {
  analyseHeadIdentifiability,
  initialFreeSet,
  parameterStandings,
  separationAdvice,
  type HeadParameterStanding,
  type ParameterSelection,
} from "./identifiability";
import { NP } from "./kernel";
import { headNormalEquations, poseTrig } from "./normal";

const ALL = HEAD_PARAMETER_KEYS.map((_, j) => j);
/** Initial damping of the scaled system (unit diagonal): small, so the first step is nearly Gauss–Newton. */
const INITIAL_DAMPING = 1e-9;
/** Input ranges: beyond them the data are not a head on a machine (and the algebra would overflow). */
const MAX_ANGLE_DEG = 1e5;
const MAX_COORDINATE_MM = 1e6;
/** Tool lengths outside 0 … 2 000 mm are refused (a gauge tool's length added to the pivot length). */
export const MAX_TOOL_MM = 2000;
/** Iteration cap of the solver (weak data may need hundreds of small steps). */
const MAX_ITERATIONS = 200;
/**
 * Statistically settled: when the cap is reached but S fell by less than SETTLED_FRACTION·s² over
 * the last SETTLED_STEPS accepted steps, the estimates are within about √0.01 = 0.1 standard
 * uncertainty of the minimum (ΔS ≈ s²·ΔθᵀC⁻¹Δθ near it), so the result stands with a warning.
 */
const SETTLED_STEPS = 10;
const SETTLED_FRACTION = 1e-2;
/** Scale below which U must lie for "yes" where no limit is given (µm, arcsec). */
export const IDENTIFIABLE_SCALE = 10;
/** At most this many outliers are listed (the worst); all are counted. */
export const MAX_LISTED_OUTLIERS = 50;

export interface HeadFitOptions extends ParameterSelection {
  /** Maximum LM iterations (default 200); past it, a statistically settled fit still stands. */
  readonly maxIterations?: number;
  /** Relative scaled-step tolerance (default 1e-10). */
  readonly stepTolerance?: number;
  /** Gradient (cosine) tolerance (default 1e-10). */
  readonly gradientTolerance?: number;
  /**
   * Limits per parameter (µm or arcsec, as its key says): "yes" needs U at or below it; without one
   * the scale IDENTIFIABLE_SCALE (10 µm / 10″) applies.
   */
  readonly limits?: Partial<Record<HeadParameterKey, number>>;
}

/** `identifiable` is the analysis's, or "weak" where U exceeds the parameter's limit (HeadFitOptions). */
export interface HeadFitParameter extends HeadParameterStanding {
  /** Estimate, in `unit`; 0 when pinned. */
  readonly value: number;
  /** Standard uncertainty in `unit`; null when the parameter is held at 0. */
  readonly u: number | null;
  /** Expanded uncertainty U = 2u in `unit`; null when held at 0. */
  readonly U: number | null;
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

/** Index of the first value not in [lo, hi] (NaN and ±Infinity are never in a finite range), or n. */
function firstOutside(a: Float64Array, n: number, lo: number, hi: number): number {
  for (let i = 0; i < n; i++) {
    const v = a[i]!;
    if (!(v >= lo && v <= hi) || v - v !== 0) return i;
  }
  return n;
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
    if (firstOutside(a, n, -Infinity, Infinity) === n) continue;
    for (let i = 0; i < n && bad.length < 50; i++) {
      if (!Number.isFinite(a[i]!))
        bad.push({ row: rowOf(data, i), column: name, message: `${name} is ${a[i]}, not a finite number` });
    }
  }
  if (bad.length === 0) {
    const ranges: [string, Float64Array | undefined, number, number, string][] = [
      ["primary_deg", data.primaryDeg, -MAX_ANGLE_DEG, MAX_ANGLE_DEG, "°"],
      ["secondary_deg", data.secondaryDeg, -MAX_ANGLE_DEG, MAX_ANGLE_DEG, "°"],
      ["x", data.xMm, -MAX_COORDINATE_MM, MAX_COORDINATE_MM, " mm"],
      ["y", data.yMm, -MAX_COORDINATE_MM, MAX_COORDINATE_MM, " mm"],
      ["z", data.zMm, -MAX_COORDINATE_MM, MAX_COORDINATE_MM, " mm"],
      ["tool_mm", data.toolMm, 0, MAX_TOOL_MM, " mm"],
    ];
    for (const [name, a, lo, hi, unit] of ranges) {
      if (!a || firstOutside(a, n, lo, hi) === n) continue;
      for (let i = 0; i < n && bad.length < 50; i++) {
        const v = a[i]!;
        if (v < lo || v > hi)
          bad.push({
            row: rowOf(data, i),
            column: name,
            message: `${name} is ${v}${unit}, outside ${lo} … ${hi}${unit}${name === "tool_mm" ? " (the tool length added to the pivot length; it cannot be negative)" : ""}`,
          });
      }
    }
    if (bad.length > 0)
      throw new GeometryError(
        "bad_value",
        `${bad.length} value${bad.length > 1 ? "s" : ""} out of range: ${bad
          .slice(0, 5)
          .map((b) => `row ${b.row} ${b.message}`)
          .join("; ")}`,
        bad,
      );
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

/** All rows at one pose (same primary, secondary and tool; repeats aside): an error naming what is missing. */
function requireSpread(data: SphereProbeData): void {
  const n = data.rows;
  const P = data.primaryDeg;
  const S = data.secondaryDeg;
  const T = data.toolMm;
  let sameP = true;
  let sameS = true;
  let sameT = true;
  for (let i = 1; i < n; i++) {
    if (P[i] !== P[0]) sameP = false;
    if (S[i] !== S[0]) sameS = false;
    if (T && T[i] !== T[0]) sameT = false;
  }
  if (sameP && sameS && sameT)
    throw new GeometryError(
      "degenerate",
      `all ${n} rows are at one pose (primary ${P[0]}°, secondary ${S[0]}°${T ? `, tool ${T[0]} mm` : ""}); repeats of one pose cannot show the head's errors: probe at primary angles around the full turn, secondary angles over a wide range (e.g. −90° to +90°) and two tool lengths`,
    );
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
  let result: HeadFitResult;
  try {
    result = fitHeadUnchecked(config, data, options);
  } catch (e) {
    if (e instanceof GeometryError) throw e;
    // A fault of the algebra on extreme but finite input: a clear error, never a stack trace.
    throw new GeometryError(
      "degenerate",
      `the fit could not be computed from these data (${e instanceof Error ? e.message : String(e)}); check that the poses are spread over the primary turn and the secondary's range and that the coordinates are in the stated unit`,
    );
  }
  requireFinite(result);
  return result;
}

/** Every number the fit reports is finite, or a GeometryError naming the first that is not. */
function requireFinite(r: HeadFitResult): void {
  const bad = (name: string, v: number | null) => {
    if (v !== null && !Number.isFinite(v))
      throw new GeometryError(
        "degenerate",
        `the fit gave a non-finite ${name} (${v}); the data do not determine it — spread the poses over the primary turn, the secondary's range and two tool lengths`,
      );
  };
  for (const p of r.parameters) {
    bad(`${p.key} value`, p.value);
    bad(`${p.key} uncertainty`, p.u);
  }
  r.sphere_centre_mm.forEach((v, k) => bad(`sphere centre ${"xyz"[k]}`, v));
  bad("residual RMS", r.rms_um);
  bad("largest residual", r.max_um);
}

function fitHeadUnchecked(config: HeadConfig, data: SphereProbeData, options: HeadFitOptions): HeadFitResult {
  const axes = headAxes(config);
  const n = data.rows;
  const startFree = initialFreeSet(options);
  if (n < 3 + startFree.length) {
    throw new GeometryError(
      "too_few_rows",
      `${n} pose${n === 1 ? "" : "s"} for ${3 + startFree.length} unknowns (the sphere centre and ${startFree.length} parameters): probe at least ${3 + startFree.length} poses, and many more for a useful uncertainty`,
    );
  }
  validate(data);
  requireSpread(data);
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

  // First pass, at zero error over [c, all ten parameters]: JᵀJ for the identifiability analysis
  // and the normal equations of the start θ = 0 (r = meas there); it folds the nominal tips into
  // meas (meas − 1000·tip₀) for the later passes.
  const N = 3 + NP;
  const fullJtj = new Float64Array(N * N);
  const fullJtr = new Float64Array(N);
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
    true,
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
  const acceptedS: number[] = [start.S];
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
    e.S = headNormalEquations(axes, poses, "folded", meas, free, params10, theta, e.jtj, e.jtr, spare);
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
          acceptedS.push(e.S);
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
      maxIterations: options.maxIterations ?? MAX_ITERATIONS,
      stepTolerance: options.stepTolerance,
      gradientTolerance: options.gradientTolerance,
      // A Gauss–Newton-like first step: this model is nearly linear in the errors, so from θ = 0
      // three iterations reach the minimum to 1e-7 µm / ″, where the solver's default 1e-3 took
      // five and stopped up to 1e-6 short of it (its damping still biased the last steps).
      initialDamping: INITIAL_DAMPING,
    },
  );
  const final = same(current.theta, lm.theta) ? current : evaluate(lm.theta);
  const residuals = final.residuals;
  const S = final.S;
  const s2 = S / dof;
  const s = Math.sqrt(s2);
  const warnings = [...ident.warnings];
  const weakKeys = free
    .filter((j) => ident.parameters[j]!.identifiable !== "yes")
    .map((j) => HEAD_PARAMETER_KEYS[j]!);
  if (!lm.converged) {
    // Valid but weakly conditioned data: the solver creeps along a flat valley. If the last steps
    // could no longer move the estimates by more than a few per cent of their u, the result stands.
    const k = acceptedS.length;
    const settled =
      k > SETTLED_STEPS && acceptedS[k - 1 - SETTLED_STEPS]! - acceptedS[k - 1]! <= SETTLED_FRACTION * s2;
    if (!settled) {
      const rmsUm = Math.sqrt(S / n);
      throw new GeometryError(
        "no_convergence",
        `the fit was still improving after ${lm.iterations} iterations (residual RMS ${rmsUm.toPrecision(3)} µm)${
          weakKeys.length > 0
            ? `: ${weakKeys.join(" and ")} ${weakKeys.length > 1 ? "are" : "is"} only weakly determined by these poses; to strengthen: ${separationAdvice(weakKeys, posesPlain)}`
            : ""
        }${rmsUm > 1000 ? "; a residual RMS above 1 mm also suggests the head configuration (axis letters, pivot length, tool direction) does not match the data" : ""}`,
      );
    }
    warnings.push(
      `the solver reached its cap of ${lm.iterations} iterations while still creeping along a flat direction of these data; the last ${SETTLED_STEPS} steps lowered the residual sum by less than ${SETTLED_FRACTION} s², i.e. the estimates are within about a tenth of their standard uncertainty of the least-squares minimum: the result stands; its weak parameters carry large U, and with data this weak the linearised U may understate their scatter`,
    );
  }
  const cov = covarianceFromNormal(lm.jtj, np, s2);

  const largeU: string[] = [];
  const largeUKeys: HeadParameterKey[] = [];
  const parameters = parameterStandings(config, ident).map(({ column, ...standing }): HeadFitParameter => {
    if (column < 0) return { ...standing, value: 0, u: null, U: null, pinned: true };
    const { key, iso, unit } = standing;
    const u = Math.sqrt(cov[(3 + column) * np + 3 + column]!);
    // "yes" needs the singular-value test and U within the parameter's limit (or the scale).
    const limit = options.limits?.[key] ?? IDENTIFIABLE_SCALE;
    let identifiable = standing.identifiable;
    if (identifiable === "yes" && !(2 * u <= limit)) {
      identifiable = "weak";
      largeU.push(
        `${key} (${iso}): U = ${+(2 * u).toPrecision(3)} ${unit === "um" ? "µm" : "″"} exceeds ${limit} ${unit === "um" ? "µm" : "″"}${options.limits?.[key] !== undefined ? " (its limit)" : " (the scale used where no limit is given)"}`,
      );
      largeUKeys.push(key);
    }
    return { ...standing, value: lm.theta[3 + column]!, u, U: 2 * u, identifiable, pinned: false };
  });
  if (largeU.length > 0)
    warnings.push(
      `weak, although the poses separate ${largeU.length > 1 ? "them" : "it"}: ${largeU.join("; ")}. To strengthen: ${separationAdvice(largeUKeys, posesPlain)}.`,
    );

  let sumSq = 0;
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
  const beyond = 3 * s;
  let maxLen2 = 0;
  for (let i = 0; i < n; i++) {
    const r0 = residuals[3 * i]!;
    const r1 = residuals[3 * i + 1]!;
    const r2 = residuals[3 * i + 2]!;
    const len2 = r0 * r0 + r1 * r1 + r2 * r2;
    sumSq += len2;
    if (len2 > maxLen2) maxLen2 = len2;
    if (r0 > beyond || r0 < -beyond || r1 > beyond || r1 < -beyond || r2 > beyond || r2 < -beyond) {
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
    max_um: Math.sqrt(maxLen2),
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

/** The JSON `fit-head` prints (geometry/README.md, "Command line"), exactly these keys. */
export interface HeadFitJson {
  readonly parameters: readonly Pick<
    HeadFitParameter,
    "key" | "iso" | "value" | "unit" | "u" | "U" | "identifiable"
  >[];
  readonly sphere_centre_mm: Vec3;
  readonly rms_um: number;
  readonly max_um: number;
  readonly outliers: readonly { readonly row: number; readonly residual_um: Vec3 }[];
  readonly outlier_count: number;
  readonly iterations: number;
  readonly warnings: readonly string[];
}

/** A fit result as the `fit-head` JSON of geometry/README.md. */
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
