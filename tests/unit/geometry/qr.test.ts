// geometry/qr.ts against ml-matrix (an independent general-purpose library): the column QR must
// give ml-matrix's least-squares solution bit for bit (same JAMA arithmetic, columns instead of
// row arrays), and an R whose RᵀR is XᵀX (A = QR with Q orthonormal).
import fc from "fast-check";
import { Matrix, QrDecomposition, solve } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { ColumnQr } from "@/geometry/qr";

const tall = fc
  .tuple(fc.integer({ min: 3, max: 4 }), fc.integer({ min: 5, max: 40 }))
  .chain(([k, m]) =>
    fc.tuple(
      fc.constant(k),
      fc.constant(m),
      fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: m * k, maxLength: m * k }),
      fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: m, maxLength: m }),
    ),
  );

describe("ColumnQr", () => {
  it("solves least squares exactly as ml-matrix's QR solve does (bit for bit)", () => {
    fc.assert(
      fc.property(tall, ([k, m, entries, y]) => {
        const rows = Array.from({ length: m }, (_, i) => entries.slice(i * k, i * k + k));
        const X = new Matrix(rows);
        if (!new QrDecomposition(X).isFullRank()) return;
        const theirs = solve(X, Matrix.columnVector(y)).to1DArray();
        const cols = Array.from({ length: k }, (_, j) => Float64Array.from(rows, (r) => r[j]!));
        const ours = Array.from(new ColumnQr(cols, m).solve(y));
        expect(ours).toEqual(theirs);
      }),
      { numRuns: 200 },
    );
  });

  it("R matches ml-matrix's upper triangle, and RᵀR = XᵀX", () => {
    // A fixed 5×3 design: 1, cos θ, sin θ at five angles (the sweep's design matrix).
    const angles = [0, 50, 130, 200, 310].map((d) => (d * Math.PI) / 180);
    const rows = angles.map((t) => [1, Math.cos(t), Math.sin(t)]);
    const cols = [0, 1, 2].map((j) => Float64Array.from(rows, (r) => r[j]!));
    const R = new ColumnQr(cols, 5).upperTriangular();
    const theirs = new QrDecomposition(new Matrix(rows)).upperTriangularMatrix.to1DArray();
    expect(Array.from(R)).toEqual(theirs);
    const X = new Matrix(rows);
    const XtX = X.transpose().mmul(X);
    const Rm = new Matrix([
      Array.from(R.subarray(0, 3)),
      Array.from(R.subarray(3, 6)),
      Array.from(R.subarray(6, 9)),
    ]);
    const RtR = Rm.transpose().mmul(Rm);
    for (let i = 0; i < 3; i++)
      for (let j = 0; j < 3; j++) expect(RtR.get(i, j)).toBeCloseTo(XtX.get(i, j), 12);
  });

  it("refuses a rank-deficient system as ml-matrix does", () => {
    const cols = [new Float64Array([1, 1, 1, 1]), new Float64Array([2, 2, 2, 2])];
    expect(() => new ColumnQr(cols, 4).solve([1, 2, 3, 4])).toThrow(/rank deficient/);
    expect(() =>
      solve(
        new Matrix([
          [1, 2],
          [1, 2],
          [1, 2],
          [1, 2],
        ]),
        Matrix.columnVector([1, 2, 3, 4]),
      ),
    ).toThrow(/rank deficient/);
  });
});
