/**
 * The head's forward model and its analytic Jacobian, on plain numbers for the per-pose loops of
 * the fit and the planner (geometry/README.md, "The head model"). Internal to geometry/head;
 * model.ts wraps it for callers.
 *
 * All lengths mm, all angles rad inside; parameter values come in as µm and arcsec (the API units)
 * in HEAD_PARAMETER_KEYS order.
 *
 * Model (Rodrigues' rotation formula R(a, φ)x = x cos φ + (a × x) sin φ + a (a·x)(1 − cos φ)):
 *   q = (L + tool)·t + δs·s + δn·n;  o = e·n;  w = q − o
 *   s′ = R(n, εst)·R(p, εsy)·s;  p′ = R(s, εpts)·R(n, εptn)·p
 *   tip(P, S) = R(p′, P + εpz)·v,  v = o + R(s′, S + εsz)·w
 * Derivatives (d/dφ R(a, φ)x = a × R(a, φ)x; and, for an axis turned by a leading rotation about u,
 * R(Qa, φ) = Q R(a, φ) Qᵀ gives d/dε [R x] = u × (R x) − R (u × x)):
 *   ∂tip/∂L = Rp Rs t,  ∂/∂δs = Rp Rs s,  ∂/∂δn = Rp Rs n,  ∂/∂e = Rp (n − Rs n)
 *   ∂/∂εpz = p′ × tip,  ∂/∂εsz = Rp (s′ × Rs w)
 *   ∂/∂εst = Rp (n × Rs w − Rs (n × w))                      (leading rotation about n)
 *   ∂/∂εsy = Rp (u × Rs w − Rs (u × w)),  u = R(n, εst) p     (rotation about p, carried by R(n, εst))
 *   ∂/∂εpts = s × tip − Rp (s × v)                           (leading rotation about s)
 *   ∂/∂εptn = u × tip − Rp (u × v),  u = R(s, εpts) n
 * The test (tests/unit/geometry/head-model.test.ts) checks these against central differences.
 */
import { RAD_PER_ARCSEC, RAD_PER_DEG } from "../units";
import type { HeadAxes, HeadVec3 as Vec3 } from "./config";

/** Number of error parameters. */
export const NP = 10;
const MM_PER_UM = 1e-3;

/** R(a, φ) as a row-major 3×3 into out (Rodrigues). a must be a unit vector. */
export function rotationMatrix(ax: number, ay: number, az: number, phi: number, out: Float64Array): void {
  // cos(φ + 0) = cos φ·1 − sin φ·0 exactly, so this is the same matrix bit for bit.
  rotationMatrixSum(ax, ay, az, Math.cos(phi), Math.sin(phi), 1, 0, out);
}

/**
 * R(a, φ₀ + ε) as in rotationMatrix, from cos φ₀ and sin φ₀ (precomputed once per pose) and ε's own
 * cosine and sine, by the angle-addition formulas: the per-pose loops then need no trigonometry.
 */
export function rotationMatrixSum(
  ax: number,
  ay: number,
  az: number,
  c0: number,
  s0: number,
  ce: number,
  se: number,
  out: Float64Array,
): void {
  const c = c0 * ce - s0 * se;
  const s = s0 * ce + c0 * se;
  const k = 1 - c;
  out[0] = c + ax * ax * k;
  out[1] = ax * ay * k - az * s;
  out[2] = ax * az * k + ay * s;
  out[3] = ay * ax * k + az * s;
  out[4] = c + ay * ay * k;
  out[5] = ay * az * k - ax * s;
  out[6] = az * ax * k - ay * s;
  out[7] = az * ay * k + ax * s;
  out[8] = c + az * az * k;
}

/** Rodrigues' formula applied to one vector: R(a, φ)·x (a unit; φ rad). */
export function rodriguesRotate(a: Vec3, phi: number, x: Vec3): Vec3 {
  const c = Math.cos(phi);
  const s = Math.sin(phi);
  const d = (a[0] * x[0] + a[1] * x[1] + a[2] * x[2]) * (1 - c);
  return [
    x[0] * c + (a[1] * x[2] - a[2] * x[1]) * s + a[0] * d,
    x[1] * c + (a[2] * x[0] - a[0] * x[2]) * s + a[1] * d,
    x[2] * c + (a[0] * x[1] - a[1] * x[0]) * s + a[2] * d,
  ];
}

/**
 * The model at fixed parameter values, evaluated pose by pose. `tip` (mm) and, when asked, `jac`
 * (3×10 row-major by component: jac[k·10 + j] = ∂tip_k/∂param_j in mm per µm or mm per arcsec).
 */
export class HeadKernel {
  readonly tip = new Float64Array(3);
  readonly jac = new Float64Array(3 * NP);
  private readonly ax: HeadAxes;
  private readonly L: number;
  private readonly qBase: Float64Array; // δs·s + δn·n (mm)
  private readonly o: Float64Array; // e·n (mm)
  private readonly sp: Vec3;
  private readonly pp: Vec3;
  private readonly uYaw: Vec3;
  private readonly uPtn: Vec3;
  private readonly zp: number;
  private readonly zs: number;
  private readonly czp: number;
  private readonly szp: number;
  private readonly czs: number;
  private readonly szs: number;
  private readonly Rs = new Float64Array(9);
  private readonly Rp = new Float64Array(9);

  /** params: the 10 error values in µm / arcsec, HEAD_PARAMETER_KEYS order. */
  constructor(axes: HeadAxes, params: ArrayLike<number>) {
    this.ax = axes;
    const { p, s, n } = axes;
    const um = (j: number) => params[j]! * MM_PER_UM;
    const rad = (j: number) => params[j]! * RAD_PER_ARCSEC;
    this.L = axes.pivotLengthMm + um(0);
    const ds = um(1);
    const dn = um(2);
    const e = um(3);
    this.qBase = Float64Array.of(ds * s[0] + dn * n[0], ds * s[1] + dn * n[1], ds * s[2] + dn * n[2]);
    this.o = Float64Array.of(e * n[0], e * n[1], e * n[2]);
    this.zp = rad(4);
    this.zs = rad(5);
    this.czp = Math.cos(this.zp);
    this.szp = Math.sin(this.zp);
    this.czs = Math.cos(this.zs);
    this.szs = Math.sin(this.zs);
    const st = rad(6);
    const sy = rad(7);
    const pts = rad(8);
    const ptn = rad(9);
    this.sp = rodriguesRotate(n, st, rodriguesRotate(p, sy, s));
    this.pp = rodriguesRotate(s, pts, rodriguesRotate(n, ptn, p));
    this.uYaw = rodriguesRotate(n, st, p);
    this.uPtn = rodriguesRotate(s, pts, n);
  }

  /**
   * Evaluate at one pose: angles in degrees, tool length in mm. Fills `tip` (mm) and, if
   * `withJacobian`, `jac`.
   */
  eval(primaryDeg: number, secondaryDeg: number, toolMm: number, withJacobian: boolean): void {
    const sp = this.sp;
    const pp = this.pp;
    rotationMatrix(sp[0], sp[1], sp[2], secondaryDeg * RAD_PER_DEG + this.zs, this.Rs);
    rotationMatrix(pp[0], pp[1], pp[2], primaryDeg * RAD_PER_DEG + this.zp, this.Rp);
    this.evalRotated(toolMm, withJacobian);
  }

  /**
   * As eval, from the cosines and sines of the commanded angles (see poseTrig in normal.ts): the
   * fit's passes over 10^5–10^6 poses compute them once instead of once per pass.
   */
  evalTrig(
    cosPrimary: number,
    sinPrimary: number,
    cosSecondary: number,
    sinSecondary: number,
    toolMm: number,
    withJacobian: boolean,
  ): void {
    const sp = this.sp;
    const pp = this.pp;
    rotationMatrixSum(sp[0], sp[1], sp[2], cosSecondary, sinSecondary, this.czs, this.szs, this.Rs);
    rotationMatrixSum(pp[0], pp[1], pp[2], cosPrimary, sinPrimary, this.czp, this.szp, this.Rp);
    this.evalRotated(toolMm, withJacobian);
  }

  private evalRotated(toolMm: number, withJacobian: boolean): void {
    const { t, s, n } = this.ax;
    const Rs = this.Rs;
    const Rp = this.Rp;
    const sp = this.sp;
    const pp = this.pp;
    const len = this.L + toolMm;
    const o0 = this.o[0]!;
    const o1 = this.o[1]!;
    const o2 = this.o[2]!;
    const w0 = len * t[0] + this.qBase[0]! - o0;
    const w1 = len * t[1] + this.qBase[1]! - o1;
    const w2 = len * t[2] + this.qBase[2]! - o2;
    const rw0 = Rs[0]! * w0 + Rs[1]! * w1 + Rs[2]! * w2;
    const rw1 = Rs[3]! * w0 + Rs[4]! * w1 + Rs[5]! * w2;
    const rw2 = Rs[6]! * w0 + Rs[7]! * w1 + Rs[8]! * w2;
    const v0 = o0 + rw0;
    const v1 = o1 + rw1;
    const v2 = o2 + rw2;
    const tip = this.tip;
    const t0 = Rp[0]! * v0 + Rp[1]! * v1 + Rp[2]! * v2;
    const t1 = Rp[3]! * v0 + Rp[4]! * v1 + Rp[5]! * v2;
    const t2 = Rp[6]! * v0 + Rp[7]! * v1 + Rp[8]! * v2;
    tip[0] = t0;
    tip[1] = t1;
    tip[2] = t2;
    if (!withJacobian) return;
    // Written out in scalars (no closures or small arrays): this runs 10^5 times per iteration.
    const J = this.jac;
    const A = RAD_PER_ARCSEC;
    const U = MM_PER_UM;
    const r0 = Rp[0]!,
      r1 = Rp[1]!,
      r2 = Rp[2]!,
      r3 = Rp[3]!,
      r4 = Rp[4]!,
      r5 = Rp[5]!,
      r6 = Rp[6]!,
      r7 = Rp[7]!,
      r8 = Rp[8]!;
    const s0 = Rs[0]!,
      s1 = Rs[1]!,
      s2 = Rs[2]!,
      s3 = Rs[3]!,
      s4 = Rs[4]!,
      s5 = Rs[5]!,
      s6 = Rs[6]!,
      s7 = Rs[7]!,
      s8 = Rs[8]!;
    let x0 = 0,
      x1 = 0,
      x2 = 0;
    // Column j = f·Rp·(x0, x1, x2).
    // 0, 1, 2: Rp Rs u for u = t, s, n (the loop leaves x = Rs n for column 3)
    for (let j = 0; j <= 2; j++) {
      const u = j === 0 ? t : j === 1 ? s : n;
      x0 = s0 * u[0] + s1 * u[1] + s2 * u[2];
      x1 = s3 * u[0] + s4 * u[1] + s5 * u[2];
      x2 = s6 * u[0] + s7 * u[1] + s8 * u[2];
      J[j] = U * (r0 * x0 + r1 * x1 + r2 * x2);
      J[10 + j] = U * (r3 * x0 + r4 * x1 + r5 * x2);
      J[20 + j] = U * (r6 * x0 + r7 * x1 + r8 * x2);
    }
    // 3: Rp (n − Rs n)
    x0 = n[0] - x0;
    x1 = n[1] - x1;
    x2 = n[2] - x2;
    J[3] = U * (r0 * x0 + r1 * x1 + r2 * x2);
    J[13] = U * (r3 * x0 + r4 * x1 + r5 * x2);
    J[23] = U * (r6 * x0 + r7 * x1 + r8 * x2);
    // 4: primary zero, p′ × tip
    J[4] = A * (pp[1] * t2 - pp[2] * t1);
    J[14] = A * (pp[2] * t0 - pp[0] * t2);
    J[24] = A * (pp[0] * t1 - pp[1] * t0);
    // 5: secondary zero, Rp (s′ × Rs w)
    x0 = sp[1] * rw2 - sp[2] * rw1;
    x1 = sp[2] * rw0 - sp[0] * rw2;
    x2 = sp[0] * rw1 - sp[1] * rw0;
    J[5] = A * (r0 * x0 + r1 * x1 + r2 * x2);
    J[15] = A * (r3 * x0 + r4 * x1 + r5 * x2);
    J[25] = A * (r6 * x0 + r7 * x1 + r8 * x2);
    // 6, 7: secondary tilt (u = n) and yaw (u = R(n, εst) p): Rp (u × Rs w − Rs (u × w))
    for (let j = 6; j <= 7; j++) {
      const u = j === 6 ? n : this.uYaw;
      const b0 = u[1] * w2 - u[2] * w1;
      const b1 = u[2] * w0 - u[0] * w2;
      const b2 = u[0] * w1 - u[1] * w0;
      x0 = u[1] * rw2 - u[2] * rw1 - (s0 * b0 + s1 * b1 + s2 * b2);
      x1 = u[2] * rw0 - u[0] * rw2 - (s3 * b0 + s4 * b1 + s5 * b2);
      x2 = u[0] * rw1 - u[1] * rw0 - (s6 * b0 + s7 * b1 + s8 * b2);
      J[j] = A * (r0 * x0 + r1 * x1 + r2 * x2);
      J[10 + j] = A * (r3 * x0 + r4 * x1 + r5 * x2);
      J[20 + j] = A * (r6 * x0 + r7 * x1 + r8 * x2);
    }
    // 8, 9: primary tilts (u = s, and u = R(s, εpts) n): u × tip − Rp (u × v)
    for (let j = 8; j <= 9; j++) {
      const u = j === 8 ? s : this.uPtn;
      const b0 = u[1] * v2 - u[2] * v1;
      const b1 = u[2] * v0 - u[0] * v2;
      const b2 = u[0] * v1 - u[1] * v0;
      J[j] = A * (u[1] * t2 - u[2] * t1 - (r0 * b0 + r1 * b1 + r2 * b2));
      J[10 + j] = A * (u[2] * t0 - u[0] * t2 - (r3 * b0 + r4 * b1 + r5 * b2));
      J[20 + j] = A * (u[0] * t1 - u[1] * t0 - (r6 * b0 + r7 * b1 + r8 * b2));
    }
  }
}
