// The Levenberg–Marquardt core against NIST StRD "Misra1a" (Statistical Reference Datasets,
// nonlinear regression, lower difficulty): model y = b1·(1 − exp(−b2·x)), both certified starts,
// certified b1, b2, their standard deviations, the residual standard deviation and the RSS.
import { describe, expect, it } from "vitest";
import { covarianceFromNormal, levenbergMarquardt, residualProblem } from "@/geometry/lm";

const x = [77.6, 114.9, 141.1, 190.8, 239.9, 289.0, 332.8, 378.4, 434.8, 477.3, 536.8, 593.1, 689.1, 760.0];
const y = [10.07, 14.73, 17.94, 23.93, 29.61, 35.18, 40.02, 44.82, 50.76, 55.05, 61.01, 66.4, 75.47, 81.78];
// NIST StRD Misra1a certified values.
const B1 = 238.94212918;
const B2 = 5.5015643181e-4;
const SD1 = 2.7070075241;
const SD2 = 7.2668688436e-6;
const RES_SD = 0.1018787633;
const RSS = 0.12455138894;

const misra = residualProblem(
  x.length,
  2,
  (b, r) => x.forEach((xi, i) => (r[i] = y[i]! - b[0]! * (1 - Math.exp(-b[1]! * xi)))),
  (b, jac) =>
    x.forEach((xi, i) => {
      const e = Math.exp(-b[1]! * xi);
      jac[2 * i] = -(1 - e);
      jac[2 * i + 1] = -b[0]! * xi * e;
    }),
);

describe("levenbergMarquardt on NIST StRD Misra1a", () => {
  for (const start of [
    [500, 1e-4],
    [250, 5e-4],
  ]) {
    it(`start (${start.join(", ")}) reaches the certified values (NIST StRD Misra1a)`, () => {
      const fit = levenbergMarquardt(misra, start);
      expect(fit.converged).toBe(true);
      // 9 significant digits (the certified values are given to 11).
      expect(Math.abs(fit.theta[0]! / B1 - 1)).toBeLessThan(1e-9);
      expect(Math.abs(fit.theta[1]! / B2 - 1)).toBeLessThan(1e-9);
      expect(Math.abs(fit.sumOfSquares / RSS - 1)).toBeLessThan(1e-9);
      const s2 = fit.sumOfSquares / (x.length - 2);
      expect(Math.abs(Math.sqrt(s2) / RES_SD - 1)).toBeLessThan(1e-9);
      const cov = covarianceFromNormal(fit.jtj, 2, s2);
      // Analytic Jacobian: the certified standard deviations to better than 1e-7 relative.
      expect(Math.abs(Math.sqrt(cov[0]!) / SD1 - 1)).toBeLessThan(1e-7);
      expect(Math.abs(Math.sqrt(cov[3]!) / SD2 - 1)).toBeLessThan(1e-7);
    });
  }

  it("reports non-convergence instead of a wrong answer when capped (NIST StRD Misra1a, start 1)", () => {
    const fit = levenbergMarquardt(misra, [500, 1e-4], { maxIterations: 1 });
    expect(fit.converged).toBe(false);
    expect(fit.reason).toBe("max_iterations");
  });
});

describe("levenbergMarquardt polish (NIST StRD Misra1a, start 1)", () => {
  it("without the polish the flat-cost stop leaves b1 about 2e-9 off; with it, below 1e-9", () => {
    const plain = levenbergMarquardt(misra, [500, 1e-4], { polish: false });
    const polished = levenbergMarquardt(misra, [500, 1e-4]);
    expect(plain.reason).toBe("cost");
    expect(Math.abs(plain.theta[0]! / B1 - 1)).toBeGreaterThan(1e-9);
    expect(Math.abs(polished.theta[0]! / B1 - 1)).toBeLessThan(1e-9);
    expect(polished.iterations).toBeGreaterThan(plain.iterations);
  });
});
