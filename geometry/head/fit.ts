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
import { headNormalEquations, nominalTips } from "./normal";

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
  /** Poses with a residual component beyond 3 s. */
  readonly outliers: readonly HeadFitOutlier[];
  readonly iterations: number;
  readonly warnings: readonly string[];
  /** Covariance of the free unknowns [c (µm), free parameters], row-major, and their keys. */
  readonly covariance: { readonly keys: readonly string[]; readonly values: Float64Array };
}

const rowOf = (data: SphereProbeData, i: number) => (data.sourceRow ? data.sourceRow[i]! : i + 2);

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
  const seen = new Map<string, number>();
  const dup: GeometryIssue[] = [];
  for (let i = 0; i < n; i++) {
    const key = `${data.primaryDeg[i]}|${data.secondaryDeg[i]}|${data.toolMm ? data.toolMm[i] : 0}|${data.repeat ? data.repeat[i] : ""}`;
    const first = seen.get(key);
    if (first === undefined) seen.set(key, i);
    else if (dup.length < 50) {
      dup.push({
        row: rowOf(data, i),
        message: `row ${rowOf(data, i)} repeats the pose of row ${rowOf(data, first)} (primary ${data.primaryDeg[i]}°, secondary ${data.secondaryDeg[i]}°, tool ${data.toolMm ? data.toolMm[i] : 0} mm${data.repeat ? `, repeat ${data.repeat[i]}` : ""}); give repeated poses a distinct repeat index or remove one`,
      });
    }
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
  const start = initialFreeSet(options);
  if (n < 3 + start.length) {
    throw new GeometryError(
      "too_few_rows",
      `${n} pose${n === 1 ? "" : "s"} for ${3 + start.length} unknowns (the sphere centre and ${start.length} parameters): probe at least ${3 + start.length} poses, and many more for a useful uncertainty`,
    );
  }
  validate(data);
  const poses = {
    rows: n,
    primaryDeg: data.primaryDeg,
    secondaryDeg: data.secondaryDeg,
    ...(data.toolMm ? { toolMm: data.toolMm } : {}),
  };
  const ident = analyseHeadIdentifiability(config, poses, options);
  const free = ident.freeIndices;
  const np = 3 + free.length;
  const dof = 3 * n - np;
  if (dof <= 0) throw new GeometryError("too_few_rows", `${n} poses leave no redundancy for ${np} unknowns`);

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
  const tip0 = nominalTips(axes, poses);
  const params10 = new Float64Array(NP);
  const lm = levenbergMarquardt(
    {
      parameters: np,
      normalEquations: (theta, jtj, jtr) =>
        headNormalEquations(axes, poses, tip0, meas, free, params10, theta, jtj, jtr),
      sumOfSquares: (theta) =>
        headNormalEquations(axes, poses, tip0, meas, free, params10, theta, null, null),
    },
    new Float64Array(np),
    {
      maxIterations: options.maxIterations ?? 50,
      stepTolerance: options.stepTolerance,
      gradientTolerance: options.gradientTolerance,
    },
  );
  if (!lm.converged) {
    throw new GeometryError(
      "no_convergence",
      `the fit did not converge in ${lm.iterations} iterations; check the head configuration (axis letters, pivot length, tool direction) against the data`,
    );
  }
  const residuals = new Float64Array(3 * n);
  const S = headNormalEquations(axes, poses, tip0, meas, free, params10, lm.theta, null, null, residuals);
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
  const outliers: HeadFitOutlier[] = [];
  for (let i = 0; i < n; i++) {
    const r0 = residuals[3 * i]!;
    const r1 = residuals[3 * i + 1]!;
    const r2 = residuals[3 * i + 2]!;
    const len2 = r0 * r0 + r1 * r1 + r2 * r2;
    sumSq += len2;
    max = Math.max(max, Math.sqrt(len2));
    const worst = Math.max(Math.abs(r0), Math.abs(r1), Math.abs(r2)) / s;
    if (worst > 3) outliers.push({ row: rowOf(data, i), residual_um: [r0, r1, r2], normalised: worst });
  }
  const warnings = [...ident.warnings];
  if (outliers.length > 0) {
    warnings.push(
      `${outliers.length} pose${outliers.length > 1 ? "s have" : " has"} a residual beyond 3 s (s = ${s.toPrecision(3)} µm)${outliers.length <= 5 ? `: row${outliers.length > 1 ? "s" : ""} ${outliers.map((o) => o.row).join(", ")}` : ""}; with Gaussian noise about 0.8 % of poses exceed it by chance`,
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
    iterations: lm.iterations,
    warnings,
    covariance: { keys: covKeys, values: cov },
  };
}

/** The JSON `fit-head` prints (geometry/README.md, "Command line"), exactly these keys. */
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
    iterations: result.iterations,
    warnings: result.warnings,
  };
}
