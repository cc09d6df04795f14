/**
 * A small Levenberg–Marquardt core for nonlinear least squares, min S(θ) = Σ rᵢ(θ)², used by the
 * head fit (geometry/head/fit.ts) and checked on NIST StRD Misra1a (tests/unit/geometry/lm.test.ts).
 *
 * The problem supplies the normal equations itself (JᵀJ and Jᵀr at θ, in one pass over its data,
 * with its own analytic Jacobian) so that a 10^5-pose fit never holds the m×p Jacobian; the core
 * only does the p×p algebra, through ml-matrix (Cholesky for the damped step, and the inverse for
 * the covariance).
 *
 * Method (Marquardt 1963; scaling and stopping tests as in Moré, "The Levenberg–Marquardt
 * algorithm: implementation and theory", 1978, and MINPACK's lmder; damping update of Nielsen 1999):
 * - columns scaled by their norms dⱼ = √(JᵀJ)ⱼⱼ: A = D⁻¹JᵀJD⁻¹ (unit diagonal), g = D⁻¹Jᵀr;
 * - damped step in scaled variables (A + λI)·δₛ = −g, δ = D⁻¹δₛ;
 * - gain ratio ρ = (S − S(θ+δ)) / (−2δᵀJᵀr − δᵀJᵀJδ); accept when ρ > 0 and then
 *   λ ← λ·max(1/3, 1 − (2ρ − 1)³), else λ ← λ·ν, ν ← 2ν;
 * - stop when the scaled step is small, ‖Dδ‖ ≤ xtol·(‖Dθ‖ + xtol); or when the gradient is
 *   orthogonal to every column, maxⱼ |(Jᵀr)ⱼ| / (dⱼ·√S) ≤ gtol; or when the actual and predicted
 *   relative reductions of S are both ≤ ftol, or the predicted one alone (the step would only move
 *   θ within the rounding of S);
 * - then polish with undamped Gauss–Newton steps while they contract (see the end of
 *   levenbergMarquardt): NIST StRD Misra1a then reaches its certified values to 1e-9 from both starts.
 * Covariance of the estimate: s²·(JᵀJ)⁻¹ with s² = S / (m − p) (e.g. NIST StRD's certified
 * standard deviations are computed this way).
 */
import { CholeskyDecomposition, inverse, Matrix } from "ml-matrix";
import { GeometryError } from "./errors";

/** A least-squares problem given by its normal equations. θ and every array are in the problem's own units. */
export interface LmProblem {
  /** Number of unknowns p. */
  readonly parameters: number;
  /**
   * Fill `jtj` (p×p, row-major, full symmetric) with JᵀJ and `jtr` (p) with Jᵀr at θ, where
   * J = ∂r/∂θ; return S = Σ r². Arrays arrive zeroed.
   */
  normalEquations(theta: Float64Array, jtj: Float64Array, jtr: Float64Array): number;
  /** S(θ) = Σ r² alone (cheaper: no Jacobian). */
  sumOfSquares(theta: Float64Array): number;
}

export interface LmOptions {
  /** Maximum number of iterations (accepted or rejected steps). Default 100. */
  readonly maxIterations?: number;
  /** Relative scaled step tolerance xtol. Default 1e-10. */
  readonly stepTolerance?: number;
  /** Gradient (cosine) tolerance gtol. Default 1e-10. */
  readonly gradientTolerance?: number;
  /** Relative reduction tolerance ftol on S. Default 1e-14. */
  readonly costTolerance?: number;
  /** Initial damping λ of the scaled system (unit diagonal). Default 1e-3. */
  readonly initialDamping?: number;
  /**
   * After a stop on a flat cost, polish with undamped Gauss–Newton steps (see levenbergMarquardt).
   * Default true. It costs one more normal-equations pass when it runs; a caller whose figures
   * need no more than ~1e-8 relative may turn it off.
   */
  readonly polish?: boolean;
}

export type LmStopReason = "step" | "gradient" | "cost" | "exact" | "max_iterations";

export interface LmResult {
  /** The estimate, in the problem's units. */
  readonly theta: Float64Array;
  /** S = Σ r² at the estimate (residual units squared). */
  readonly sumOfSquares: number;
  /** JᵀJ at the estimate (p×p row-major). */
  readonly jtj: Float64Array;
  readonly iterations: number;
  readonly converged: boolean;
  readonly reason: LmStopReason;
}

/**
 * Minimise Σ r(θ)² from `initial` by Levenberg–Marquardt (method and sources in the file header).
 * Returns `converged: false` with reason "max_iterations" rather than throwing; callers decide.
 */
export function levenbergMarquardt(
  problem: LmProblem,
  initial: ArrayLike<number>,
  options: LmOptions = {},
): LmResult {
  const p = problem.parameters;
  if (initial.length !== p)
    throw new GeometryError("bad_option", `the start has ${initial.length} values for ${p} unknowns`);
  const maxIterations = options.maxIterations ?? 100;
  const xtol = options.stepTolerance ?? 1e-10;
  const gtol = options.gradientTolerance ?? 1e-10;
  const ftol = options.costTolerance ?? 1e-14;
  let lambda = options.initialDamping ?? 1e-3;
  let nu = 2;

  let theta = Float64Array.from(initial);
  let jtj = new Float64Array(p * p);
  let jtr = new Float64Array(p);
  let S = problem.normalEquations(theta, jtj, jtr);
  if (!Number.isFinite(S))
    throw new GeometryError("bad_number", "the residuals at the start are not finite numbers");
  const d = new Float64Array(p);
  const trial = new Float64Array(p);
  const step = new Float64Array(p);
  let iterations = 0;
  let reason: LmStopReason = "max_iterations";

  const scale = () => {
    for (let j = 0; j < p; j++) {
      const v = Math.sqrt(jtj[j * p + j]!);
      d[j] = v > 0 ? v : 1;
    }
  };
  scale();

  const gradientSmall = () => {
    if (S === 0) return true;
    const rs = Math.sqrt(S);
    let g = 0;
    for (let j = 0; j < p; j++) g = Math.max(g, Math.abs(jtr[j]!) / (d[j]! * rs));
    return g <= gtol;
  };

  /**
   * Solves the scaled damped system (A + λI) δs = −g at θ: δ = D⁻¹δs into `step`, θ + δ into
   * `trial`; returns ‖δs‖ and ‖Dθ‖, or null when A + λI is not positive definite.
   */
  const dampedStep = (damping: number) => {
    const a = new Matrix(p, p);
    for (let i = 0; i < p; i++) {
      for (let j = 0; j < p; j++) a.set(i, j, jtj[i * p + j]! / (d[i]! * d[j]!) + (i === j ? damping : 0));
    }
    const chol = new CholeskyDecomposition(a);
    if (!chol.isPositiveDefinite()) return null;
    const g = new Matrix(p, 1);
    for (let j = 0; j < p; j++) g.set(j, 0, -jtr[j]! / d[j]!);
    const ds = chol.solve(g);
    let stepNorm = 0;
    let thetaNorm = 0;
    for (let j = 0; j < p; j++) {
      step[j] = ds.get(j, 0) / d[j]!;
      trial[j] = theta[j]! + step[j]!;
      stepNorm += ds.get(j, 0) ** 2;
      thetaNorm += (d[j]! * theta[j]!) ** 2;
    }
    return { stepNorm: Math.sqrt(stepNorm), thetaNorm: Math.sqrt(thetaNorm) };
  };

  if (S === 0) reason = "exact";
  else if (gradientSmall()) reason = "gradient";
  else {
    while (iterations < maxIterations) {
      iterations++;
      const solved = dampedStep(lambda);
      if (!solved) {
        lambda *= nu;
        nu *= 2;
        continue;
      }
      const { stepNorm, thetaNorm } = solved;
      // Predicted reduction of S for the linear model: −2δᵀJᵀr − δᵀJᵀJδ.
      let pred = 0;
      for (let i = 0; i < p; i++) {
        let row = 0;
        for (let j = 0; j < p; j++) row += jtj[i * p + j]! * step[j]!;
        pred -= 2 * step[i]! * jtr[i]! + step[i]! * row;
      }
      // A predicted reduction at the level of rounding in S: θ is as good as the data allow.
      if (pred <= ftol * S) {
        reason = "cost";
        break;
      }
      const Snew = problem.sumOfSquares(trial);
      const actual = S - Snew;
      const rho = pred > 0 && Number.isFinite(Snew) ? actual / pred : -1;
      if (rho > 0) {
        theta = Float64Array.from(trial);
        const njtj = new Float64Array(p * p);
        const njtr = new Float64Array(p);
        S = problem.normalEquations(theta, njtj, njtr);
        jtj = njtj;
        jtr = njtr;
        scale();
        lambda *= Math.max(1 / 3, 1 - (2 * rho - 1) ** 3);
        nu = 2;
        if (S === 0) {
          reason = "exact";
          break;
        }
        if (gradientSmall()) {
          reason = "gradient";
          break;
        }
        if (Math.abs(actual) <= ftol * (S + actual) && pred <= ftol * (S + actual)) {
          reason = "cost";
          break;
        }
        if (stepNorm <= xtol * (thetaNorm + xtol)) {
          reason = "step";
          break;
        }
      } else {
        // A rejected step that is already below the step tolerance means θ cannot be improved.
        if (stepNorm <= xtol * (thetaNorm + xtol)) {
          reason = "step";
          break;
        }
        lambda *= nu;
        nu *= 2;
      }
    }
  }
  if (reason === "cost" && options.polish !== false) {
    // Polish: near the minimum of a long, flat valley (e.g. Misra1a from its first start) S is
    // constant to its rounding while θ is still 1e-9 off, so the cost test stops early. The
    // gradient still locates the minimiser: take undamped Gauss–Newton steps while they contract,
    // stay above the step tolerance and at least halve the scaled gradient.
    let last = Infinity;
    for (let k = 0; k < 20; k++) {
      const solved = dampedStep(0);
      if (!solved) break;
      const { stepNorm, thetaNorm } = solved;
      if (!(stepNorm < last) || stepNorm <= xtol * (thetaNorm + xtol)) break;
      const njtj = new Float64Array(p * p);
      const njtr = new Float64Array(p);
      const Snew = problem.normalEquations(trial, njtj, njtr);
      // S is flat to its rounding here (1e-12 relative in a 10^5-pose fit): it only guards against
      // a step that makes things clearly worse; progress is judged by the gradient.
      if (!(Snew <= S * (1 + 1e-10))) break;
      // Only a step that clearly shrinks the scaled gradient is progress; at the rounding level
      // of the gradient a step is noise (a weak direction would wander) and is not taken.
      if (!(gradientMeasure(njtj, njtr, Snew) < 0.5 * gradientMeasure(jtj, jtr, S))) break;
      theta = Float64Array.from(trial);
      S = Snew;
      jtj = njtj;
      jtr = njtr;
      scale();
      iterations++;
      last = stepNorm;
    }
  }
  return { theta, sumOfSquares: S, jtj, iterations, converged: reason !== "max_iterations", reason };
}

/** maxⱼ |(Jᵀr)ⱼ| / (√(JᵀJ)ⱼⱼ·√S): the cosine of the worst angle between r and a column of J. */
function gradientMeasure(jtj: Float64Array, jtr: Float64Array, S: number): number {
  const p = jtr.length;
  if (!(S > 0)) return 0;
  let g = 0;
  for (let j = 0; j < p; j++)
    g = Math.max(g, Math.abs(jtr[j]!) / ((Math.sqrt(jtj[j * p + j]!) || 1) * Math.sqrt(S)));
  return g;
}

/**
 * Covariance s²·(JᵀJ)⁻¹ (p×p row-major, in θ's units squared) from JᵀJ and s² (residual units²).
 * Inverted in column-scaled form D⁻¹(D⁻¹JᵀJD⁻¹)⁻¹D⁻¹ for conditioning; ml-matrix `inverse`.
 */
export function covarianceFromNormal(jtj: Float64Array, p: number, s2: number): Float64Array {
  const d = new Float64Array(p);
  for (let j = 0; j < p; j++) d[j] = Math.sqrt(jtj[j * p + j]!) || 1;
  const a = new Matrix(p, p);
  for (let i = 0; i < p; i++) for (let j = 0; j < p; j++) a.set(i, j, jtj[i * p + j]! / (d[i]! * d[j]!));
  const inv = inverse(a);
  const out = new Float64Array(p * p);
  for (let i = 0; i < p; i++)
    for (let j = 0; j < p; j++) out[i * p + j] = (s2 * inv.get(i, j)) / (d[i]! * d[j]!);
  return out;
}

/**
 * An LmProblem from a residual function and its analytic Jacobian, for small problems (m rows held
 * in memory). `residuals(θ, r)` fills r (length m); `jacobian(θ, J)` fills J = ∂r/∂θ (m×p row-major).
 */
export function residualProblem(
  m: number,
  p: number,
  residuals: (theta: Float64Array, r: Float64Array) => void,
  jacobian: (theta: Float64Array, jac: Float64Array) => void,
): LmProblem {
  const r = new Float64Array(m);
  const jac = new Float64Array(m * p);
  const ss = () => {
    let s = 0;
    for (let i = 0; i < m; i++) s += r[i]! * r[i]!;
    return s;
  };
  return {
    parameters: p,
    sumOfSquares(theta) {
      residuals(theta, r);
      return ss();
    },
    normalEquations(theta, jtj, jtr) {
      residuals(theta, r);
      jacobian(theta, jac);
      for (let k = 0; k < m; k++) {
        const rk = r[k]!;
        for (let i = 0; i < p; i++) {
          const ji = jac[k * p + i]!;
          jtr[i] = jtr[i]! + ji * rk;
          for (let j = i; j < p; j++) jtj[i * p + j] = jtj[i * p + j]! + ji * jac[k * p + j]!;
        }
      }
      for (let i = 0; i < p; i++) for (let j = 0; j < i; j++) jtj[i * p + j] = jtj[j * p + i]!;
      return ss();
    },
  };
}
