/**
 * Householder QR of a tall n×k matrix held as k column Float64Arrays (k small: 3 or 4), for least
 * squares on 10^6 rows in bounded memory. ml-matrix's Matrix keeps one typed array per row (about
 * 200 bytes a row with its buffer), so an n×3 design matrix of 10^6 rows and its QR copy cost more
 * than 400 MB; here the columns are the only storage (8 bytes per entry).
 *
 * The arithmetic is JAMA's QRDecomposition step for step (the algorithm ml-matrix's
 * QrDecomposition implements: column norms by a running hypotenuse, reflections applied column by
 * column, back substitution by the stored diagonal), so `solve` gives the same figures as
 * ml-matrix `solve(X, y)` on the same n×k system; tests/unit/geometry/qr.test.ts checks that.
 */

/** √(a² + b²) without overflow, computed as JAMA and ml-matrix compute it (same rounding). */
function hypotenuse(a: number, b: number): number {
  if (Math.abs(a) > Math.abs(b)) {
    const r = b / a;
    return Math.abs(a) * Math.sqrt(1 + r * r);
  }
  if (b !== 0) {
    const r = a / b;
    return Math.abs(b) * Math.sqrt(1 + r * r);
  }
  return 0;
}

export class ColumnQr {
  /** The k columns, overwritten by the Householder vectors and R's strict upper triangle. */
  private readonly qr: Float64Array[];
  private readonly m: number;
  /** R's diagonal. */
  readonly rdiag: Float64Array;

  /** Factorise in place: `columns` (each of length ≥ m; the first m entries are used) are overwritten. */
  constructor(columns: Float64Array[], m: number) {
    const n = columns.length;
    if (m < n) throw new Error("QR needs at least as many rows as columns");
    this.qr = columns;
    this.m = m;
    this.rdiag = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      const ck = columns[k]!;
      let nrm = 0;
      for (let i = k; i < m; i++) nrm = hypotenuse(nrm, ck[i]!);
      if (nrm !== 0) {
        if (ck[k]! < 0) nrm = -nrm;
        for (let i = k; i < m; i++) ck[i] = ck[i]! / nrm;
        ck[k] = ck[k]! + 1;
        for (let j = k + 1; j < n; j++) reflect(ck, columns[j]!, k, m);
      }
      this.rdiag[k] = -nrm;
    }
  }

  isFullRank(): boolean {
    return this.rdiag.every((d) => d !== 0);
  }

  /** Least-squares solution of X·β ≈ y (y of length ≥ m is not changed). Throws when rank deficient. */
  solve(y: ArrayLike<number>): Float64Array {
    if (!this.isFullRank()) throw new Error("Matrix is rank deficient");
    const n = this.qr.length;
    const m = this.m;
    const x = Float64Array.from({ length: m }, (_, i) => y[i]!);
    for (let k = 0; k < n; k++) reflect(this.qr[k]!, x, k, m);
    for (let k = n - 1; k >= 0; k--) {
      x[k] = x[k]! / this.rdiag[k]!;
      for (let i = 0; i < k; i++) x[i] = x[i]! - x[k]! * this.qr[k]![i]!;
    }
    return x.slice(0, n);
  }

  /** R (k×k, upper triangular, row-major): A = Q·R with Q's columns orthonormal. */
  upperTriangular(): Float64Array {
    const n = this.qr.length;
    const r = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      r[i * n + i] = this.rdiag[i]!;
      for (let j = i + 1; j < n; j++) r[i * n + j] = this.qr[j]![i]!;
    }
    return r;
  }
}

/** Apply the k-th Householder reflection (vector v = column k from row k down) to column c. */
function reflect(v: Float64Array, c: Float64Array, k: number, m: number): void {
  let s = 0;
  for (let i = k; i < m; i++) s += v[i]! * c[i]!;
  s = -s / v[k]!;
  for (let i = k; i < m; i++) c[i] = c[i]! + s * v[i]!;
}
