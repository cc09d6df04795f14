/**
 * The head's forward model for callers (geometry/README.md, "The head model" and
 * "Sphere-probe measurement model"). Angles at this edge in degrees, lengths in mm, error values
 * in µm and arc seconds as their keys say.
 */
import { GeometryError } from "../errors";
import {
  headAxes,
  HEAD_PARAMETER_KEYS,
  type HeadConfig,
  type HeadErrors,
  type HeadVec3 as Vec3,
} from "./config";
import { HeadKernel } from "./kernel";

export { rodriguesRotate } from "./kernel";

/** One probed pose: commanded angles (degrees) and tool length (mm, added to the pivot length; default 0). */
export interface HeadPose {
  readonly primaryDeg: number;
  readonly secondaryDeg: number;
  readonly toolMm?: number;
}

/** The 10 error values in µm / arcsec, HEAD_PARAMETER_KEYS order; missing keys are 0. */
export function headErrorVector(errors: HeadErrors = {}): Float64Array {
  const v = new Float64Array(HEAD_PARAMETER_KEYS.length);
  HEAD_PARAMETER_KEYS.forEach((k, j) => {
    const x = errors[k] ?? 0;
    if (!Number.isFinite(x)) throw new GeometryError("bad_value", `${k} must be a finite number (got ${x})`);
    v[j] = x;
  });
  for (const k of Object.keys(errors)) {
    if (!(HEAD_PARAMETER_KEYS as readonly string[]).includes(k))
      throw new GeometryError("bad_value", `unknown error parameter '${k}'`);
  }
  return v;
}

/**
 * Gauge-point (tip) position in mm, machine frame, at a pose:
 * tip(P, S) = R(p′, P + primary_zero)·(o + R(s′, S + secondary_zero)·(q − o)), with
 * q = (L0 + pivot_length_error + tool)·t + tip_offset_s·s + tip_offset_n·n and o = secondary_offset·n
 * (geometry/README.md; rotations by Rodrigues' formula). With no errors this is the nominal tip₀.
 */
export function headTipMm(config: HeadConfig, errors: HeadErrors, pose: HeadPose): Vec3 {
  const k = new HeadKernel(headAxes(config), headErrorVector(errors));
  k.eval(pose.primaryDeg, pose.secondaryDeg, pose.toolMm ?? 0, false);
  return [k.tip[0]!, k.tip[1]!, k.tip[2]!];
}

/** Nominal tip₀(P, S) in mm: headTipMm with every error zero. */
export function nominalTipMm(config: HeadConfig, pose: HeadPose): Vec3 {
  return headTipMm(config, {}, pose);
}

/**
 * Sphere centre the probe reports at a pose, mm: m = c − (tip − tip₀). The control keeps the
 * nominal tip on a fixed sphere of centre c (mm), so a tip error moves the measured centre the
 * other way (geometry/README.md, "The head model").
 */
export function measuredSphereCentreMm(
  config: HeadConfig,
  errors: HeadErrors,
  centreMm: Vec3,
  pose: HeadPose,
): Vec3 {
  const tip = headTipMm(config, errors, pose);
  const tip0 = nominalTipMm(config, pose);
  return [
    centreMm[0] - (tip[0] - tip0[0]),
    centreMm[1] - (tip[1] - tip0[1]),
    centreMm[2] - (tip[2] - tip0[2]),
  ];
}
