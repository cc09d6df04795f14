/**
 * Pose planning before anyone probes (geometry/README.md, "The fit": the pose-plan helper): for a head
 * config and candidate poses (with optional tool lengths), which parameters the sphere-probe fit
 * will identify, and each one's predicted standard uncertainty per 1 µm of probing noise.
 *
 * Method: the fit's Jacobian at zero error (normal.ts), classified as in identifiability.ts; the
 * prediction is u_j = √((JᵀJ)⁻¹)_jj for σ = 1 µm on each coordinate (linear least squares
 * covariance σ²(JᵀJ)⁻¹; e.g. JCGM 100:2008 and any regression text), in µm or arcsec per µm. Scale
 * by the expected noise in µm (the probe's repeatability) for a forecast.
 */
import { GeometryError } from "../errors";
import { covarianceFromNormal } from "../lm";
import { headAxes, type HeadConfig } from "./config";
import {
  analyseHeadIdentifiability,
  initialFreeSet,
  parameterStandings,
  type HeadParameterStanding,
  type ParameterSelection,
} from "./identifiability";
import { NP } from "./kernel";
import type { HeadPose } from "./model";
import type { PoseColumns } from "./normal";

export interface HeadPlanParameter extends HeadParameterStanding {
  readonly pinned: boolean;
  /** Predicted standard uncertainty per 1 µm of probing noise, in `unit` per µm; null when held at 0. */
  readonly u_per_um_noise: number | null;
}

export interface HeadPlanResult {
  readonly parameters: readonly HeadPlanParameter[];
  readonly poses: number;
  /** Distinct tool lengths among the poses, mm. */
  readonly tool_lengths_mm: readonly number[];
  /** Plain-words advice: what cannot be separated, what would separate it, what looks thin. */
  readonly advice: readonly string[];
}

/** Poses as columns from a list. */
export function poseColumns(poses: readonly HeadPose[]): PoseColumns {
  const n = poses.length;
  const primaryDeg = new Float64Array(n);
  const secondaryDeg = new Float64Array(n);
  const toolMm = new Float64Array(n);
  poses.forEach((p, i) => {
    primaryDeg[i] = p.primaryDeg;
    secondaryDeg[i] = p.secondaryDeg;
    toolMm[i] = p.toolMm ?? 0;
  });
  return { rows: n, primaryDeg, secondaryDeg, toolMm };
}

/**
 * Predict identifiability and uncertainty per µm of noise for candidate poses (method in the file
 * header). Throws GeometryError "too_few_rows" with fewer poses than unknowns, "bad_number" for a
 * non-finite angle or tool length.
 */
export function planHeadPoses(
  config: HeadConfig,
  poses: readonly HeadPose[] | PoseColumns,
  selection: ParameterSelection = {},
): HeadPlanResult {
  headAxes(config);
  const cols = Array.isArray(poses) ? poseColumns(poses as readonly HeadPose[]) : (poses as PoseColumns);
  const n = cols.rows;
  for (let i = 0; i < n; i++) {
    const t = cols.toolMm ? cols.toolMm[i]! : 0;
    if (
      !Number.isFinite(cols.primaryDeg[i]!) ||
      !Number.isFinite(cols.secondaryDeg[i]!) ||
      !Number.isFinite(t)
    ) {
      throw new GeometryError(
        "bad_number",
        `pose ${i + 1}: the angles and the tool length must be finite numbers`,
        [{ row: i + 2, message: "not a finite number" }],
      );
    }
  }
  const start = initialFreeSet(selection);
  if (n < 3 + start.length) {
    throw new GeometryError(
      "too_few_rows",
      `${n} poses for ${3 + start.length} unknowns (the sphere centre and ${start.length} parameters): plan at least ${3 + start.length} poses`,
    );
  }
  const ident = analyseHeadIdentifiability(config, cols, selection);
  const free = ident.freeIndices;
  const idx = [0, 1, 2, ...free.map((j) => 3 + j)];
  const m = idx.length;
  const N = 3 + NP;
  const sub = new Float64Array(m * m);
  for (let a = 0; a < m; a++)
    for (let b = 0; b < m; b++) sub[a * m + b] = ident.fullNormal[idx[a]! * N + idx[b]!]!;
  const cov = covarianceFromNormal(sub, m, 1);
  const parameters = parameterStandings(config, ident).map(({ column, ...standing }): HeadPlanParameter => ({
    ...standing,
    pinned: column < 0,
    u_per_um_noise: column < 0 ? null : Math.sqrt(cov[(3 + column) * m + 3 + column]!),
  }));
  const tools = cols.toolMm ? [...new Set(cols.toolMm)].sort((a, b) => a - b) : [0];
  const advice = [...ident.warnings];
  const clean = parameters.filter((p) => !p.pinned && p.identifiable === "yes");
  if (clean.length === parameters.filter((p) => !p.pinned).length) {
    advice.push(
      `all ${clean.length} fitted parameters are identifiable from these ${n} poses; multiply each u_per_um_noise by the probe's repeatability in µm (and by 2 for U) to forecast the uncertainty`,
    );
  }
  if (tools.length < 2)
    advice.push(
      "only one tool length: probing a second tool length separates the secondary zero from the gauge point's offset across the tilt plane",
    );
  advice.push("repeat the first pose at the end (with its own repeat index) to see drift (common practice)");
  return { parameters, poses: n, tool_lengths_mm: tools, advice };
}
