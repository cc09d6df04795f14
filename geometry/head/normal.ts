/**
 * Normal equations of the sphere-probe fit, built in one pass over the poses on Float64Array with
 * the analytic Jacobian of kernel.ts (geometry/README.md, "The fit" and "Performance"). Internal to
 * geometry/head.
 *
 * Unknowns θ = [δc_x, δc_y, δc_z (µm, the sphere centre minus a start c₀), free parameters (µm or
 * arcsec, HEAD_PARAMETER_KEYS order)]. Residual of pose i, coordinate k, in µm:
 *   r_ik = 1000·(m_ik − c₀_k) − δc_k + 1000·(tip_k(θ) − tip₀_k)
 * i.e. measured minus modelled centre, with the model m = c − (tip − tip₀).
 * So ∂r_ik/∂δc_l = −[k = l] and ∂r_ik/∂θ_j = 1000·∂tip_k/∂θ_j.
 */
import { RAD_PER_DEG } from "../units";
import type { HeadAxes } from "./config";
import { HeadKernel, NP } from "./kernel";

/** Poses as columns: angles in degrees, tool length in mm (absent = 0). */
export interface PoseColumns {
  readonly rows: number;
  readonly primaryDeg: Float64Array;
  readonly secondaryDeg: Float64Array;
  readonly toolMm?: Float64Array;
  /** Optional poseTrig(this): the passes then use it instead of evaluating cos and sin per pass. */
  readonly trig?: Float64Array;
}

/**
 * cos and sin of the commanded angles, interleaved per pose [cos P, sin P, cos S, sin S] (4·rows),
 * computed once per fit: trigonometry was most of a pass's cost when done in every pass.
 */
export function poseTrig(poses: PoseColumns): Float64Array {
  const out = new Float64Array(4 * poses.rows);
  const P = poses.primaryDeg;
  const S = poses.secondaryDeg;
  for (let i = 0; i < poses.rows; i++) {
    const a = P[i]! * RAD_PER_DEG;
    const b = S[i]! * RAD_PER_DEG;
    out[4 * i] = Math.cos(a);
    out[4 * i + 1] = Math.sin(a);
    out[4 * i + 2] = Math.cos(b);
    out[4 * i + 3] = Math.sin(b);
  }
  return out;
}

/** Measured centres minus the start c₀, in µm, interleaved x, y, z per pose. */
export type CentredMeasurements = Float64Array;

/** tip₀ per pose (mm, interleaved), the nominal tip. */
export function nominalTips(axes: HeadAxes, poses: PoseColumns): Float64Array {
  const k = new HeadKernel(axes, new Float64Array(NP));
  const out = new Float64Array(3 * poses.rows);
  const trig = poses.trig;
  for (let i = 0; i < poses.rows; i++) {
    const tool = poses.toolMm ? poses.toolMm[i]! : 0;
    if (trig) k.evalTrig(trig[4 * i]!, trig[4 * i + 1]!, trig[4 * i + 2]!, trig[4 * i + 3]!, tool, false);
    else k.eval(poses.primaryDeg[i]!, poses.secondaryDeg[i]!, tool, false);
    out[3 * i] = k.tip[0]!;
    out[3 * i + 1] = k.tip[1]!;
    out[3 * i + 2] = k.tip[2]!;
  }
  return out;
}

/**
 * Fill jtj ((3+f)², row-major, full) and jtr (3+f) at θ and return S = Σ r² (µm²).
 * `params10` holds the values of all ten parameters (pinned ones stay as given, normally 0) and is
 * overwritten with θ's free values; `free` lists the free parameters' indices. With `meas` null
 * the residuals are taken as 0 (planner and identifiability: only JᵀJ matters). `residuals`, when
 * given (length 3·rows), receives r. With `jtj` null only S is computed (no Jacobian).
 * With `meas` given and `tip0` null, the parameters must all be 0 (the nominal head): the tips are
 * then the nominal tips and r = meas − δc; with `fold` the pass then rewrites meas in place as
 * meas − 1000·tip₀ — the fit's first pass, which gives the start's normal equations and
 * identifiability at once. Later passes take `tip0` = "folded" (r = meas − δc + 1000·tip), so the
 * fit holds no separate tip₀ array (24 MB at 10^6 poses).
 */
export function headNormalEquations(
  axes: HeadAxes,
  poses: PoseColumns,
  tip0: Float64Array | "folded" | null,
  meas: CentredMeasurements | null,
  free: readonly number[],
  params10: Float64Array,
  theta: Float64Array,
  jtj: Float64Array | null,
  jtr: Float64Array | null,
  residuals?: Float64Array,
  fold = false,
): number {
  const f = free.length;
  const np = 3 + f;
  for (let j = 0; j < f; j++) params10[free[j]!] = theta[3 + j]!;
  const kernel = new HeadKernel(axes, params10);
  const jac = kernel.jac;
  const tip = kernel.tip;
  const withJ = jtj !== null;
  const g = new Float64Array(3 * f); // 1000·∂tip_k/∂θ_j for the free columns
  // Param–param block accumulated in an upper-triangle buffer; centre blocks by sums.
  const pp = new Float64Array(f * f);
  const cp = new Float64Array(3 * f); // Σ_i ∂r_ik/∂δc_k · g_kj = −Σ_i g_kj
  const gr = new Float64Array(f);
  let rc0 = 0;
  let rc1 = 0;
  let rc2 = 0;
  let S = 0;
  const dc0 = theta[0]!;
  const dc1 = theta[1]!;
  const dc2 = theta[2]!;
  const T = poses.toolMm;
  const P = poses.primaryDeg;
  const Sd = poses.secondaryDeg;
  const trig = poses.trig;
  for (let i = 0; i < poses.rows; i++) {
    if (trig)
      kernel.evalTrig(
        trig[4 * i]!,
        trig[4 * i + 1]!,
        trig[4 * i + 2]!,
        trig[4 * i + 3]!,
        T ? T[i]! : 0,
        withJ,
      );
    else kernel.eval(P[i]!, Sd[i]!, T ? T[i]! : 0, withJ);
    let r0 = 0;
    let r1 = 0;
    let r2 = 0;
    if (meas !== null) {
      const b = 3 * i;
      if (tip0 === "folded") {
        r0 = meas[b]! - dc0 + 1000 * tip[0]!;
        r1 = meas[b + 1]! - dc1 + 1000 * tip[1]!;
        r2 = meas[b + 2]! - dc2 + 1000 * tip[2]!;
      } else if (tip0 !== null) {
        r0 = meas[b]! - dc0 + 1000 * (tip[0]! - tip0[b]!);
        r1 = meas[b + 1]! - dc1 + 1000 * (tip[1]! - tip0[b + 1]!);
        r2 = meas[b + 2]! - dc2 + 1000 * (tip[2]! - tip0[b + 2]!);
      } else {
        r0 = meas[b]! - dc0;
        r1 = meas[b + 1]! - dc1;
        r2 = meas[b + 2]! - dc2;
        if (fold) {
          meas[b] = meas[b]! - 1000 * tip[0]!;
          meas[b + 1] = meas[b + 1]! - 1000 * tip[1]!;
          meas[b + 2] = meas[b + 2]! - 1000 * tip[2]!;
        }
      }
      S += r0 * r0 + r1 * r1 + r2 * r2;
      if (residuals) {
        residuals[b] = r0;
        residuals[b + 1] = r1;
        residuals[b + 2] = r2;
      }
    }
    if (!withJ) continue;
    rc0 -= r0;
    rc1 -= r1;
    rc2 -= r2;
    for (let j = 0; j < f; j++) {
      const c = free[j]!;
      const g0 = 1000 * jac[c]!;
      const g1 = 1000 * jac[NP + c]!;
      const g2 = 1000 * jac[2 * NP + c]!;
      g[j] = g0;
      g[f + j] = g1;
      g[2 * f + j] = g2;
      cp[j] = cp[j]! - g0;
      cp[f + j] = cp[f + j]! - g1;
      cp[2 * f + j] = cp[2 * f + j]! - g2;
      gr[j] = gr[j]! + g0 * r0 + g1 * r1 + g2 * r2;
    }
    for (let a = 0; a < f; a++) {
      const a0 = g[a]!;
      const a1 = g[f + a]!;
      const a2 = g[2 * f + a]!;
      const row = a * f;
      for (let b = a; b < f; b++)
        pp[row + b] = pp[row + b]! + a0 * g[b]! + a1 * g[f + b]! + a2 * g[2 * f + b]!;
    }
  }
  if (jtj !== null && jtr !== null) {
    const n = poses.rows;
    for (let k = 0; k < 3; k++) jtj[k * np + k] = n;
    for (let k = 0; k < 3; k++) {
      for (let j = 0; j < f; j++) {
        jtj[k * np + 3 + j] = cp[k * f + j]!;
        jtj[(3 + j) * np + k] = cp[k * f + j]!;
      }
    }
    for (let a = 0; a < f; a++) {
      for (let b = a; b < f; b++) {
        jtj[(3 + a) * np + 3 + b] = pp[a * f + b]!;
        jtj[(3 + b) * np + 3 + a] = pp[a * f + b]!;
      }
    }
    jtr[0] = rc0;
    jtr[1] = rc1;
    jtr[2] = rc2;
    for (let j = 0; j < f; j++) jtr[3 + j] = gr[j]!;
  }
  return S;
}
