import fc from "fast-check";
import { lusolve, max, mean, min, multiply, transpose } from "mathjs";
import { describe, expect, it } from "vitest";
import { clockAngleDeg, GeometryError, multiPointAngles, multiPointValue } from "@/geometry";

const CLOCK4 = ["12", "3", "6", "9"];
const CLOCK8 = ["12", "1:30", "3", "4:30", "6", "7:30", "9", "10:30"];

/**
 * Independent reference: the least-squares plane a + b·cosθ + c·sinθ solved by mathjs through the
 * normal equations (XᵀX)β = Xᵀy with its LU solver, then the peak-to-valley of the residuals.
 */
function mathjsFlatness(anglesDeg: number[], y: number[]): number {
  const X = anglesDeg.map((d) => {
    const t = (d * Math.PI) / 180;
    return [1, Math.cos(t), Math.sin(t)];
  });
  const Xt = transpose(X);
  const beta = lusolve(multiply(Xt, X), multiply(Xt, y)) as number[][];
  const fitted = multiply(X, beta) as number[][];
  const res = y.map((v, i) => v - fitted[i]![0]!);
  return (max(res) as number) - (min(res) as number);
}

describe("clock positions", () => {
  it("place 12, 3, 6, 9 at 0°, 90°, 180°, 270° and half hours between (30° per hour on a clock face — definition)", () => {
    expect(CLOCK4.map(clockAngleDeg)).toEqual([0, 90, 180, 270]);
    expect(CLOCK8.map(clockAngleDeg)).toEqual([0, 45, 90, 135, 180, 225, 270, 315]);
    expect(clockAngleDeg("13")).toBeNull();
    expect(clockAngleDeg("P1")).toBeNull();
  });

  it("spaces non-clock names equally in the order given", () => {
    expect(multiPointAngles(["P1", "P2", "P3", "P4", "P5"])).toEqual([0, 72, 144, 216, 288]);
  });
});

describe("multiPointValue", () => {
  it("TIR is the largest minus the smallest reading (run-out as full indicator movement: ASME B89.3.4, ISO 230-1)", () => {
    // Collar readings in inches: 0.0002, −0.0001, 0.0004, 0.0000 → TIR 0.0005 in.
    const r = multiPointValue("tir", CLOCK4, [0.0002, -0.0001, 0.0004, 0]);
    expect(r.value).toBeCloseTo(0.0005, 12);
    expect(r.highPoint).toBe("6");
    expect(r.lowPoint).toBe("3");
    expect(r.residuals).toBeNull();
  });

  it("TIR agrees with mathjs max − min on random readings (independent library)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1000, max: 1000, noNaN: true }), { minLength: 2, maxLength: 12 }),
        (ys) => {
          const names = ys.map((_, i) => `P${i + 1}`);
          const r = multiPointValue("tir", names, ys);
          expect(r.value).toBeCloseTo((max(ys) as number) - (min(ys) as number), 9);
        },
      ),
    );
  });

  it("mean agrees with mathjs mean (independent library)", () => {
    const ys = [12.5, -3, 7.25, 0.5, 4];
    expect(multiPointValue("mean", ["P1", "P2", "P3", "P4", "P5"], ys).value).toBeCloseTo(
      mean(ys) as number,
      12,
    );
  });

  it("flatness at 12/3/6/9 is |y12 − y3 + y6 − y9| / 2 (closed form of the least-squares plane: the four cos/sin columns are orthogonal, the residual is the (1, −1, 1, −1) component)", () => {
    const ys = [10, 4, 7, 1];
    const r = multiPointValue("flatness", CLOCK4, ys);
    expect(r.value).toBeCloseTo(Math.abs(10 - 4 + 7 - 1) / 2, 12);
    expect(r.residuals).toHaveLength(4);
  });

  it("flatness of a tilted but flat face is zero (a plane fits it exactly)", () => {
    const angles = CLOCK8.map((p) => clockAngleDeg(p)!);
    const ys = angles.map((d) => 5 + 3 * Math.cos((d * Math.PI) / 180) - 2 * Math.sin((d * Math.PI) / 180));
    expect(multiPointValue("flatness", CLOCK8, ys).value).toBeLessThan(1e-12);
  });

  it("flatness agrees with mathjs normal equations on random 8-point faces (independent library)", () => {
    const angles = CLOCK8.map((p) => clockAngleDeg(p)!);
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -50, max: 50, noNaN: true }), { minLength: 8, maxLength: 8 }),
        (ys) => {
          const r = multiPointValue("flatness", CLOCK8, ys);
          expect(r.value).toBeCloseTo(mathjsFlatness(angles, ys), 8);
        },
      ),
    );
  });

  it("flatness on N equal points agrees with mathjs", () => {
    const names = ["P1", "P2", "P3", "P4", "P5", "P6"];
    const ys = [3, -1, 2.5, 0, 4, -2];
    expect(multiPointValue("flatness", names, ys).value).toBeCloseTo(
      mathjsFlatness(multiPointAngles(names), ys),
      10,
    );
  });

  it("refuses bad input and names the point", () => {
    const err = (f: () => unknown) => {
      try {
        f();
      } catch (e) {
        return e as GeometryError;
      }
      throw new Error("expected a GeometryError");
    };
    const missing = err(() => multiPointValue("tir", CLOCK4, [1, Number.NaN, 2, 3]));
    expect(missing).toBeInstanceOf(GeometryError);
    expect(missing.issues[0]!.column).toBe("3");
    expect(missing.message).toMatch(/point 3/);
    expect(err(() => multiPointValue("flatness", ["12", "4", "8"], [1, 2, 3])).code).toBe("too_few_rows");
    expect(err(() => multiPointValue("tir", ["12", "12"], [1, 2])).message).toMatch(/named twice/);
    expect(err(() => multiPointValue("mean", CLOCK4, [1, 2])).message).toMatch(/one reading per point/);
  });
});
