/**
 * Circle fit per axis: points measured while one rotary axis turns lie on a circle whose normal is
 * the axis direction and whose centre is a point on the axis. No head model needed.
 */
import { inverse, Matrix, SVD, solve } from "ml-matrix";
import { GeometryError } from "./errors";
import { ColumnQr } from "./qr";
import type { NumberColumns, SphereProbeData } from "./types";
import { RAD_PER_ARCSEC } from "./units";

export type Vec3 = readonly [number, number, number];

/** Measured points in machine coordinates, mm (named as in sphere-probe data and the points reader's). */
export type PointsInput = NumberColumns<SphereProbeData, "xMm" | "yMm" | "zMm">;

export interface CircleFit {
  readonly n: number;
  /** Centre of the circle: a point on the fitted axis, mm. */
  readonly centre_mm: Vec3;
  /** Unit normal of the circle's plane = axis direction; sign: largest component positive. */
  readonly normal: Vec3;
  readonly radius_mm: number;
  /** RMS and max of each point's 3-D distance to the fitted circle (in-plane and out-of-plane), µm. */
  readonly rms_um: number;
  readonly max_um: number;
  /** RMS of the in-plane radial residuals, µm, and of the distances from the plane, µm. */
  readonly radial_rms_um: number;
  readonly plane_rms_um: number;
  /** Gauss–Newton/Levenberg–Marquardt iterations of the geometric refinement. */
  readonly iterations: number;
  /**
   * Expanded uncertainties (k = 2, JCGM 100) from the fit's covariance s²·(JᵀJ)⁻¹ scaled by the
   * residual variance (Type A only): radius (mm), centre per machine axis (mm), and the normal's
   * direction (arc seconds, 2·√(u_α² + u_β²) for its tilts α, β about the two in-plane axes).
   * null with exactly 3 points (a circle through 3 points has no residual to estimate s from).
   */
  readonly radius_U_mm: number | null;
  readonly centre_U_mm: Vec3 | null;
  readonly normal_U_arcsec: number | null;
  /** Angle covered by the points around the fitted centre (360° minus the largest gap), degrees. */
  readonly arc_deg: number;
  readonly warnings: readonly string[];
}

/** Fix the sign of an axis direction independently of point order: largest component positive. */
function orientNormal(v: [number, number, number]): Vec3 {
  let k = 0;
  if (Math.abs(v[1]) > Math.abs(v[k]!)) k = 1;
  if (Math.abs(v[2]) > Math.abs(v[k]!)) k = 2;
  return v[k]! < 0 ? [-v[0], -v[1], -v[2]] : [v[0], v[1], v[2]];
}

/**
 * Fit a circle to 3-D points (mm).
 * 1. Plane: centroid c̄; SVD of the centred n×3 matrix; the right singular vector of the smallest
 *    singular value is the normal (total least squares plane; e.g. Shakarji, J. Res. NIST 103,
 *    1998, "Least-squares fitting algorithms of the NIST algorithm testing system" — reference from memory), the other two
 *    span the plane (u, v).
 * 2. Circle in the plane on (ξ, η) = ((p − c̄)·u, (p − c̄)·v): algebraic start (Kåsa: linear least
 *    squares of ξ² + η² + Dξ + Eη + F = 0), then geometric refinement minimising
 *    Σ (√((ξ−a)² + (η−b)²) − r)² by Levenberg–Marquardt (Gander, Golub & Strebel, BIT 34, 1994).
 * 3. Centre = c̄ + a·u + b·v.
 * Needs ≥ 3 points not on one line.
 */
export function fitCircle(points: PointsInput): CircleFit {
  const n = points.xMm.length;
  if (points.yMm.length !== n || points.zMm.length !== n)
    throw new GeometryError("bad_option", "x, y, z lengths differ");
  if (n < 3) throw new GeometryError("too_few_rows", `a circle needs at least 3 points (got ${n})`);
  // Centroid by sums of x/n (no overflow for any finite input), then coordinates relative to it
  // scaled by their largest magnitude L, so the algebra never squares a huge number.
  let cx = 0;
  let cy = 0;
  let cz = 0;
  for (let i = 0; i < n; i++) {
    const x = points.xMm[i]!;
    const y = points.yMm[i]!;
    const z = points.zMm[i]!;
    if (!Number.isFinite(x) || !Number.isFinite(y) || !Number.isFinite(z))
      throw new GeometryError("bad_number", `point ${i + 1} is not finite`);
    cx += x / n;
    cy += y / n;
    cz += z / n;
  }
  let L = 0;
  for (let i = 0; i < n; i++) {
    L = Math.max(
      L,
      Math.abs(points.xMm[i]! - cx),
      Math.abs(points.yMm[i]! - cy),
      Math.abs(points.zMm[i]! - cz),
    );
  }
  if (!Number.isFinite(L))
    throw new GeometryError("bad_number", "the points span more than the number range; check the units");
  if (!(L > 0)) throw new GeometryError("degenerate", "all points coincide; no circle or axis can be fitted");
  // The centred, scaled coordinates as three columns (8 bytes a point; an n×3 ml-matrix Matrix
  // holds a typed array per row). The SVD is taken of R from their QR (./qr.ts), a 3×3 matrix with
  // the same singular values and right singular vectors as the n×3 matrix (A = QR, Q orthonormal),
  // as LAPACK does for tall matrices, so memory does not grow with a row array per point.
  const centred = [new Float64Array(n), new Float64Array(n), new Float64Array(n)] as const;
  for (let i = 0; i < n; i++) {
    centred[0][i] = (points.xMm[i]! - cx) / L;
    centred[1][i] = (points.yMm[i]! - cy) / L;
    centred[2][i] = (points.zMm[i]! - cz) / L;
  }
  const R = new ColumnQr(
    centred.map((c) => c.slice()),
    n,
  ).upperTriangular();
  const svd = new SVD(
    new Matrix([Array.from(R.subarray(0, 3)), Array.from(R.subarray(3, 6)), Array.from(R.subarray(6, 9))]),
    {
      computeLeftSingularVectors: false,
      autoTranspose: true,
    },
  );
  const sv = svd.diagonal;
  const V = svd.rightSingularVectors;
  // ml-matrix returns singular values in decreasing order.
  const order = [0, 1, 2].sort((p, q) => sv[q]! - sv[p]!);
  const [iu, iv, iw] = order as [number, number, number];
  if (!(sv[iv]! > 1e-9 * sv[iu]!))
    throw new GeometryError(
      "degenerate",
      "the points lie on a line (no spread across it); no circle or axis can be fitted — take points around the turn",
    );
  const u: Vec3 = [V.get(0, iu), V.get(1, iu), V.get(2, iu)];
  const v: Vec3 = [V.get(0, iv), V.get(1, iv), V.get(2, iv)];
  const w = orientNormal([V.get(0, iw), V.get(1, iw), V.get(2, iw)]);

  const xi = new Float64Array(n);
  const eta = new Float64Array(n);
  const h = new Float64Array(n);
  let scale = 0;
  for (let i = 0; i < n; i++) {
    const dx = centred[0][i]!;
    const dy = centred[1][i]!;
    const dz = centred[2][i]!;
    xi[i] = dx * u[0] + dy * u[1] + dz * u[2];
    eta[i] = dx * v[0] + dy * v[1] + dz * v[2];
    h[i] = dx * w[0] + dy * w[1] + dz * w[2];
    scale += xi[i]! * xi[i]! + eta[i]! * eta[i]!;
  }
  scale = Math.sqrt(scale / n);

  // Algebraic start (Kåsa), on coordinates scaled by their RMS radius for conditioning.
  const A = new Matrix(3, 3);
  const rhs = new Matrix(3, 1);
  for (let i = 0; i < n; i++) {
    const p = xi[i]! / scale;
    const q = eta[i]! / scale;
    const row = [p, q, 1];
    const t = -(p * p + q * q);
    for (let r = 0; r < 3; r++) {
      rhs.set(r, 0, rhs.get(r, 0) + row[r]! * t);
      for (let c = 0; c < 3; c++) A.set(r, c, A.get(r, c) + row[r]! * row[c]!);
    }
  }
  const sol = solve(A, rhs);
  let a = (-sol.get(0, 0) / 2) * scale;
  let b = (-sol.get(1, 0) / 2) * scale;
  let r = Math.sqrt(Math.max(0, (sol.get(0, 0) ** 2 + sol.get(1, 0) ** 2) / 4 - sol.get(2, 0))) * scale;
  if (!Number.isFinite(a) || !Number.isFinite(b) || !Number.isFinite(r) || r === 0) {
    a = 0;
    b = 0;
    r = scale;
  }

  // Geometric refinement: Levenberg–Marquardt on d_i = ρ_i − r, ρ_i = |(ξ_i, η_i) − (a, b)|.
  const cost = (a0: number, b0: number, r0: number) => {
    let s = 0;
    for (let i = 0; i < n; i++) {
      const d = Math.hypot(xi[i]! - a0, eta[i]! - b0) - r0;
      s += d * d;
    }
    return s;
  };
  const normalEquations = (a0: number, b0: number, r0: number) => {
    const JtJ = [0, 0, 0, 0, 0, 0, 0, 0, 0];
    const Jtr = [0, 0, 0];
    for (let i = 0; i < n; i++) {
      const dx = xi[i]! - a0;
      const dy = eta[i]! - b0;
      const rho = Math.hypot(dx, dy);
      const J = [rho > 0 ? -dx / rho : 0, rho > 0 ? -dy / rho : 0, -1];
      const d = rho - r0;
      for (let p = 0; p < 3; p++) {
        Jtr[p]! += J[p]! * d;
        for (let q = 0; q < 3; q++) JtJ[p * 3 + q]! += J[p]! * J[q]!;
      }
    }
    return { JtJ, Jtr };
  };
  let f = cost(a, b, r);
  let lambda = 1e-3;
  let iterations = 0;
  for (; iterations < 200; iterations++) {
    const { JtJ, Jtr } = normalEquations(a, b, r);
    let accepted = false;
    let step = 0;
    for (let tries = 0; tries < 30 && !accepted; tries++) {
      const M = new Matrix(3, 3);
      for (let p = 0; p < 3; p++)
        for (let q = 0; q < 3; q++) M.set(p, q, JtJ[p * 3 + q]! + (p === q ? lambda * JtJ[p * 3 + p]! : 0));
      const dlt = solve(M, Matrix.columnVector(Jtr.map((g) => -g)));
      const na = a + dlt.get(0, 0);
      const nb = b + dlt.get(1, 0);
      const nr = r + dlt.get(2, 0);
      const nf = cost(na, nb, nr);
      if (Number.isFinite(nf) && nf <= f) {
        step = Math.hypot(dlt.get(0, 0), dlt.get(1, 0), dlt.get(2, 0));
        a = na;
        b = nb;
        r = nr;
        f = nf;
        lambda = Math.max(lambda / 10, 1e-12);
        accepted = true;
      } else {
        lambda *= 10;
      }
    }
    if (!accepted || step <= 1e-13 * (Math.abs(r) + scale)) break;
  }
  // Polish with undamped Gauss–Newton steps while they contract: near the minimum the cost is flat
  // to rounding, but the gradient still locates the minimiser (makes the fit independent of row
  // order to ~1e-12 instead of ~1e-8 on short arcs).
  let lastStep = Infinity;
  for (let k = 0; k < 100; k++) {
    const { JtJ, Jtr } = normalEquations(a, b, r);
    let dlt: Matrix;
    try {
      dlt = solve(
        new Matrix([JtJ.slice(0, 3), JtJ.slice(3, 6), JtJ.slice(6, 9)]),
        Matrix.columnVector(Jtr.map((g) => -g)),
      );
    } catch {
      break;
    }
    const step = Math.hypot(dlt.get(0, 0), dlt.get(1, 0), dlt.get(2, 0));
    if (!(step < lastStep)) break;
    a += dlt.get(0, 0);
    b += dlt.get(1, 0);
    r += dlt.get(2, 0);
    iterations++;
    lastStep = step;
    if (step <= 1e-15 * (Math.abs(r) + scale)) break;
  }
  if (r < 0) r = -r;

  let sumD = 0;
  let maxD = 0;
  let sumR = 0;
  let sumH = 0;
  for (let i = 0; i < n; i++) {
    const dr = Math.hypot(xi[i]! - a, eta[i]! - b) - r;
    const d2 = dr * dr + h[i]! * h[i]!;
    sumD += d2;
    sumR += dr * dr;
    sumH += h[i]! * h[i]!;
    if (d2 > maxD) maxD = d2;
  }
  const unc = n > 3 ? circleUncertainty(xi, eta, a, b, r, sumR, sumH) : null;
  const arcDeg = coveredArcDeg(xi, eta, a, b);
  const warnings: string[] = [];
  if (n === 3)
    warnings.push("3 points fit a circle exactly: no uncertainty can be estimated; take 4 or more");
  if (arcDeg < 90)
    warnings.push(
      `the points cover only ${arcDeg.toFixed(0)}° of arc: centre and radius are weakly determined ` +
        "(their uncertainty grows roughly as 1/arc² as the arc shortens); turn the axis through 90° or more",
    );
  const k = 1000 * L; // scaled units → µm
  const result: CircleFit = {
    n,
    centre_mm: [
      cx + L * (a * u[0] + b * v[0]),
      cy + L * (a * u[1] + b * v[1]),
      cz + L * (a * u[2] + b * v[2]),
    ],
    normal: w,
    radius_mm: L * r,
    rms_um: Math.sqrt(sumD / n) * k,
    max_um: Math.sqrt(maxD) * k,
    radial_rms_um: Math.sqrt(sumR / n) * k,
    plane_rms_um: Math.sqrt(sumH / n) * k,
    iterations,
    radius_U_mm: unc ? 2 * L * Math.sqrt(unc.varR) : null,
    centre_U_mm: unc
      ? ([0, 1, 2].map(
          (c) =>
            2 *
            L *
            Math.sqrt(
              u[c]! * u[c]! * unc.cab[0] +
                2 * u[c]! * v[c]! * unc.cab[1] +
                v[c]! * v[c]! * unc.cab[2] +
                w[c]! * w[c]! * unc.varW,
            ),
        ) as unknown as Vec3)
      : null,
    normal_U_arcsec: unc ? (2 * Math.sqrt(unc.varTilt)) / RAD_PER_ARCSEC : null,
    arc_deg: arcDeg,
    warnings,
  };
  for (const [key, val] of Object.entries(result)) {
    const nums =
      typeof val === "number" ? [val] : Array.isArray(val) ? val.filter((x) => typeof x === "number") : [];
    if (!nums.every(Number.isFinite))
      throw new GeometryError(
        "bad_number",
        `the circle's ${key} is beyond the number range; check the units`,
      );
  }
  return result;
}

/**
 * Type A covariance of the circle (scaled units): in-plane (a, b, r) from s²·(JᵀJ)⁻¹ of the
 * geometric fit (J rows −(ξ−a)/ρ, −(η−b)/ρ, −1; s² = Σd²/(n − 3)); out of plane from the plane as a
 * regression h = h₀ + αξ + βη on the centred coordinates (s_h² = Σh²/(n − 3)): tilts (α, β) with
 * covariance s_h²·(XᵀX)⁻¹, and the plane's height at the centre, var = s_h²·(1/n + [a b](XᵀX)⁻¹[a b]ᵀ).
 * Returns var(r), the (a, b) covariance [aa, ab, bb], var of the centre along the normal, and
 * u_α² + u_β².
 */
function circleUncertainty(
  xi: Float64Array,
  eta: Float64Array,
  a: number,
  b: number,
  r: number,
  sumR: number,
  sumH: number,
): { varR: number; cab: [number, number, number]; varW: number; varTilt: number } {
  const n = xi.length;
  const JtJ = new Matrix(3, 3);
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = xi[i]! - a;
    const dy = eta[i]! - b;
    const rho = Math.hypot(dx, dy);
    const J = [rho > 0 ? -dx / rho : 0, rho > 0 ? -dy / rho : 0, -1];
    for (let p = 0; p < 3; p++) for (let q = 0; q < 3; q++) JtJ.set(p, q, JtJ.get(p, q) + J[p]! * J[q]!);
    sxx += xi[i]! * xi[i]!;
    sxy += xi[i]! * eta[i]!;
    syy += eta[i]! * eta[i]!;
  }
  const s2 = sumR / (n - 3);
  let cov: Matrix;
  try {
    cov = inverse(JtJ).mul(s2);
  } catch {
    throw new GeometryError(
      "degenerate",
      "the circle's centre and radius cannot be separated from these points",
    );
  }
  const sh2 = sumH / (n - 3);
  // (XᵀX)⁻¹ for X = [ξ η] (ξ, η are centred: the plane's SVD axes through the centroid).
  const det = sxx * syy - sxy * sxy;
  const i11 = syy / det;
  const i12 = -sxy / det;
  const i22 = sxx / det;
  return {
    varR: Math.max(0, cov.get(2, 2)),
    cab: [Math.max(0, cov.get(0, 0)), cov.get(0, 1), Math.max(0, cov.get(1, 1))],
    varW: sh2 * (1 / n + a * a * i11 + 2 * a * b * i12 + b * b * i22),
    varTilt: sh2 * (i11 + i22),
  };
}

/** Arc covered by the points around (a, b): 360° minus the largest angular gap, degrees. */
function coveredArcDeg(xi: Float64Array, eta: Float64Array, a: number, b: number): number {
  const ang = xi.map((x, i) => Math.atan2(eta[i]! - b, x - a)).sort();
  let gap = ang[0]! + 2 * Math.PI - ang[ang.length - 1]!;
  for (let k = 1; k < ang.length; k++) gap = Math.max(gap, ang[k]! - ang[k - 1]!);
  return ((2 * Math.PI - gap) * 180) / Math.PI;
}

export interface AxisLine {
  /** A point on the axis (mm) and its direction (any length > 0). */
  readonly centre_mm: Vec3;
  readonly normal: Vec3;
}

/**
 * Squareness of two fitted axes: the angle θ between their directions minus 90°, arc seconds,
 * θ − π/2 = −atan2(d₁·d₂, |d₁ × d₂|) (atan2 keeps full precision near 90°). The sign follows the
 * directions as given (flip one and the sign flips); `out_of_square_arcsec` is its magnitude.
 */
export function axisSquareness(
  a: Vec3,
  b: Vec3,
): { squareness_arcsec: number; out_of_square_arcsec: number } {
  const dot = a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
  const cx = a[1] * b[2] - a[2] * b[1];
  const cy = a[2] * b[0] - a[0] * b[2];
  const cz = a[0] * b[1] - a[1] * b[0];
  const cross = Math.hypot(cx, cy, cz);
  if (!(cross > 0) && !(Math.abs(dot) > 0))
    throw new GeometryError("degenerate", "an axis direction is zero");
  const rad = -Math.atan2(dot, cross);
  const arcsec = rad / RAD_PER_ARCSEC;
  return { squareness_arcsec: arcsec, out_of_square_arcsec: Math.abs(arcsec) };
}

/**
 * Independent pivot length: distance from the fitted secondary (tilt) axis line to a tip point,
 * |(P − c) × d| / |d| (mm), c a point on the axis and d its direction.
 */
export function pivotLengthMm(axis: AxisLine, tipMm: Vec3): number {
  const d = axis.normal;
  const len = Math.hypot(d[0], d[1], d[2]);
  if (!(len > 0)) throw new GeometryError("degenerate", "the axis direction is zero");
  const px = tipMm[0] - axis.centre_mm[0];
  const py = tipMm[1] - axis.centre_mm[1];
  const pz = tipMm[2] - axis.centre_mm[2];
  return Math.hypot(py * d[2] - pz * d[1], pz * d[0] - px * d[2], px * d[1] - py * d[0]) / len;
}
