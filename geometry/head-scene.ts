/**
 * What the 3D view of a head fit draws, computed from the head model (geometry/README.md, "Head
 * model"): nominal and fitted axis lines, nominal and actual tool-tip paths over the probed poses,
 * and the measured tip positions, with every error multiplied by an exaggeration factor k so that
 * µm and arc-second errors become visible. Lengths in mm, angles at this edge in degrees, error
 * values in µm / arc seconds as their keys say. Pure: no framework; runs on the server or in the
 * browser.
 */
import {
  headAxes,
  HEAD_PARAMETER_KEYS,
  type HeadConfig,
  type HeadErrors,
  type HeadVec3 as Vec3,
} from "./head/config";
import { HeadKernel } from "./head/kernel";
import { headErrorVector, rodriguesRotate, type HeadPose } from "./head/model";

const RAD_PER_ARCSEC = Math.PI / 648000;
const RAD_PER_DEG = Math.PI / 180;

/** Every error value multiplied by k (k ≥ 0, finite). */
export function exaggerateErrors(errors: HeadErrors, k: number): HeadErrors {
  if (!Number.isFinite(k) || k < 0)
    throw new RangeError(`the exaggeration factor must be a finite number ≥ 0 (got ${k})`);
  const out: HeadErrors = {};
  for (const key of HEAD_PARAMETER_KEYS) {
    const v = errors[key];
    if (v !== undefined) out[key] = v * k;
  }
  return out;
}

/** A line through `pointMm` along the unit vector `direction`. */
export interface SceneLine {
  readonly pointMm: Vec3;
  readonly direction: Vec3;
}

/**
 * The primary axis and the secondary axis (at a commanded primary angle), nominal and with the
 * (exaggerated) errors: p′ = R(s, primary_tilt_s)·R(n, primary_tilt_n)·p through the origin;
 * the secondary axis line passes through R(p′, P + primary_zero)·o, o = secondary_offset·n, along
 * R(p′, P + primary_zero)·s′ with s′ = R(n, secondary_tilt)·R(p, secondary_yaw)·s. Nominal: p and
 * R(p, P)·s through the origin.
 */
export function headAxisLines(
  config: HeadConfig,
  errors: HeadErrors,
  primaryDeg = 0,
): {
  nominalPrimary: SceneLine;
  fittedPrimary: SceneLine;
  nominalSecondary: SceneLine;
  fittedSecondary: SceneLine;
} {
  const { p, s, n } = headAxes(config);
  const e = (key: keyof HeadErrors) => errors[key] ?? 0;
  const pPrime = rodriguesRotate(
    s,
    e("primary_tilt_s_arcsec") * RAD_PER_ARCSEC,
    rodriguesRotate(n, e("primary_tilt_n_arcsec") * RAD_PER_ARCSEC, p),
  );
  const sPrime = rodriguesRotate(
    n,
    e("secondary_tilt_arcsec") * RAD_PER_ARCSEC,
    rodriguesRotate(p, e("secondary_yaw_arcsec") * RAD_PER_ARCSEC, s),
  );
  const turn = primaryDeg * RAD_PER_DEG + e("primary_zero_arcsec") * RAD_PER_ARCSEC;
  const offMm = e("secondary_offset_um") / 1000;
  const o: Vec3 = [offMm * n[0], offMm * n[1], offMm * n[2]];
  return {
    nominalPrimary: { pointMm: [0, 0, 0], direction: p },
    fittedPrimary: { pointMm: [0, 0, 0], direction: pPrime },
    nominalSecondary: { pointMm: [0, 0, 0], direction: rodriguesRotate(p, primaryDeg * RAD_PER_DEG, s) },
    fittedSecondary: {
      pointMm: rodriguesRotate(pPrime, turn, o),
      direction: rodriguesRotate(pPrime, turn, sPrime),
    },
  };
}

export interface HeadSceneData {
  /** Nominal tips tip₀ per pose, mm, interleaved x, y, z. */
  readonly nominalTipsMm: Float32Array;
  /** Tips with the errors × k, mm, interleaved. */
  readonly actualTipsMm: Float32Array;
  /** Measured tips: actual tip − k·residual (the probe saw the fitted tip error less the residual), mm, interleaved. */
  readonly measuredTipsMm: Float32Array;
  /** |residual| per pose, µm (not exaggerated). */
  readonly residualUm: Float32Array;
  /** Segment end points joining consecutive poses of one secondary sweep (same primary angle and tool), mm. */
  readonly nominalPathMm: Float32Array;
  readonly actualPathMm: Float32Array;
  readonly axes: ReturnType<typeof headAxisLines>;
  /** Largest distance of any drawn point from the origin, mm (for framing the camera). */
  readonly extentMm: number;
}

/**
 * Everything the 3D view draws for a fit at exaggeration k. `residualsUm` (measured − modelled
 * sphere centre, µm, per pose) is optional; without it the measured tips equal the actual tips.
 * The measured centre is m = c − (tip − tip₀) + r, so the tip error the probe saw is
 * (tip − tip₀) − r, drawn × k about the nominal tip: tip₀ + k·((tip − tip₀) − r) to first order,
 * which is actual(k) − k·r.
 */
export function headScene(
  config: HeadConfig,
  errors: HeadErrors,
  poses: readonly HeadPose[],
  k: number,
  residualsUm?: readonly Vec3[],
): HeadSceneData {
  const ek = exaggerateErrors(errors, k);
  const n = poses.length;
  // One kernel each for the nominal and the exaggerated model (the same code as headTipMm, without re-building it per pose).
  const axes = headAxes(config);
  const k0 = new HeadKernel(axes, headErrorVector({}));
  const kk = new HeadKernel(axes, headErrorVector(ek));
  const nominal = new Float32Array(3 * n);
  const actual = new Float32Array(3 * n);
  const measured = new Float32Array(3 * n);
  const res = new Float32Array(n);
  let extent = 0;
  for (let i = 0; i < n; i++) {
    const pose = poses[i]!;
    k0.eval(pose.primaryDeg, pose.secondaryDeg, pose.toolMm ?? 0, false);
    kk.eval(pose.primaryDeg, pose.secondaryDeg, pose.toolMm ?? 0, false);
    const t0 = k0.tip;
    const t = kk.tip;
    const r = residualsUm?.[i] ?? [0, 0, 0];
    for (let c = 0; c < 3; c++) {
      nominal[3 * i + c] = t0[c]!;
      actual[3 * i + c] = t[c]!;
      measured[3 * i + c] = t[c]! - (k * r[c]!) / 1000;
    }
    res[i] = Math.hypot(r[0], r[1], r[2]);
    extent = Math.max(extent, Math.hypot(t0[0]!, t0[1]!, t0[2]!), Math.hypot(t[0]!, t[1]!, t[2]!));
  }
  // Sweeps: poses with the same primary angle and tool, in increasing secondary angle.
  const groups = new Map<string, number[]>();
  poses.forEach((p, i) => {
    const key = `${p.primaryDeg}|${p.toolMm ?? 0}`;
    const g = groups.get(key);
    if (g) g.push(i);
    else groups.set(key, [i]);
  });
  const segs: [number, number][] = [];
  for (const g of groups.values()) {
    g.sort((a, b) => poses[a]!.secondaryDeg - poses[b]!.secondaryDeg);
    for (let j = 1; j < g.length; j++) segs.push([g[j - 1]!, g[j]!]);
  }
  const path = (tips: Float32Array) => {
    const out = new Float32Array(6 * segs.length);
    segs.forEach(([a, b], j) => {
      for (let c = 0; c < 3; c++) {
        out[6 * j + c] = tips[3 * a + c]!;
        out[6 * j + 3 + c] = tips[3 * b + c]!;
      }
    });
    return out;
  };
  return {
    nominalTipsMm: nominal,
    actualTipsMm: actual,
    measuredTipsMm: measured,
    residualUm: res,
    nominalPathMm: path(nominal),
    actualPathMm: path(actual),
    axes: headAxisLines(config, ek, 0),
    extentMm: Math.max(extent, config.pivotLengthMm),
  };
}

/** Colour ramp for a residual: 0 → cool, ≥ maxUm → warm; returns r, g, b in [0, 1]. Stops are this product's own. */
export function residualColour(residualUm: number, maxUm: number): Vec3 {
  const stops: Vec3[] = [
    [0.23, 0.51, 0.64],
    [0.55, 0.72, 0.45],
    [0.93, 0.73, 0.2],
    [0.8, 0.25, 0.15],
  ];
  const x = maxUm > 0 ? Math.min(1, Math.max(0, residualUm / maxUm)) * (stops.length - 1) : 0;
  const i = Math.min(stops.length - 2, Math.floor(x));
  const f = x - i;
  const a = stops[i]!;
  const b = stops[i + 1]!;
  return [a[0] + (b[0] - a[0]) * f, a[1] + (b[1] - a[1]) * f, a[2] + (b[2] - a[2]) * f];
}

/** The other fit drawn beside the shown one (pre/post overlay): its fitted axis lines and actual tip path. */
export interface HeadOverlayData {
  /** Fitted primary axis and fitted secondary axis (at primary 0) of the other fit, errors × k. */
  readonly axes: { readonly primary: SceneLine; readonly secondary: SceneLine };
  /** Tips of the other fit's model × k over the shown poses, mm, interleaved x, y, z. */
  readonly actualTipsMm: Float32Array;
  /** Segment end points of the same sweeps as headScene's paths, mm. */
  readonly actualPathMm: Float32Array;
}

/**
 * The other fit of a pre/post pair at the same exaggeration k, over the *shown* fit's poses, so
 * both tool-tip paths join the same commanded poses and differ only by the two parameter sets
 * (the same forward model as headScene: tip = f(errors × k, pose)). Lengths in mm.
 */
export function headOverlayScene(
  config: HeadConfig,
  errors: HeadErrors,
  poses: readonly HeadPose[],
  k: number,
): HeadOverlayData {
  const s = headScene(config, errors, poses, k);
  return {
    axes: { primary: s.axes.fittedPrimary, secondary: s.axes.fittedSecondary },
    actualTipsMm: s.actualTipsMm,
    actualPathMm: s.actualPathMm,
  };
}

/**
 * How far the modelled gauge point moves between two parameter sets over the given poses, real
 * size (not exaggerated): |tip(b, pose) − tip(a, pose)| per pose, µm; returns the largest and the
 * RMS. Computed in float64 with the same kernel as headScene.
 */
export function tipChangeUm(
  config: HeadConfig,
  a: HeadErrors,
  b: HeadErrors,
  poses: readonly HeadPose[],
): { maxUm: number; rmsUm: number } {
  const axes = headAxes(config);
  const ka = new HeadKernel(axes, headErrorVector(a));
  const kb = new HeadKernel(axes, headErrorVector(b));
  let max = 0;
  let sum = 0;
  for (const pose of poses) {
    ka.eval(pose.primaryDeg, pose.secondaryDeg, pose.toolMm ?? 0, false);
    kb.eval(pose.primaryDeg, pose.secondaryDeg, pose.toolMm ?? 0, false);
    const d = 1000 * Math.hypot(kb.tip[0]! - ka.tip[0]!, kb.tip[1]! - ka.tip[1]!, kb.tip[2]! - ka.tip[2]!);
    max = Math.max(max, d);
    sum += d * d;
  }
  return { maxUm: max, rmsUm: poses.length ? Math.sqrt(sum / poses.length) : 0 };
}
