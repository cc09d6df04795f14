import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { angleFromReading, fitTram, RAD_PER_ARCSEC, sineBarAngleDeg, sineBarHeightMm } from "@/geometry";
import { NORRIS_X, NORRIS_Y } from "./reference-data";
import { TRAM_JSON_KEYS } from "./cli-helpers";

// NIST Statistical Reference Datasets, linear regression, "Norris" (certified values, lower
// difficulty): y = B0 + B1·x. Here x is read as travel (mm) and y as reading (µm), so the slope in
// µm/mm is B1 and slope_um_per_m = 1000·B1.

describe("fitTram", () => {
  it("NIST StRD Norris: certified intercept, slope, their sd and residual sd", () => {
    const r = fitTram({ travelMm: NORRIS_X, readingUm: NORRIS_Y });
    const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
    expect(rel(r.slope_um_per_m / 1000, 1.00211681802045)).toBeLessThan(1e-12);
    expect(rel(r.intercept_um, -0.262323073774029)).toBeLessThan(1e-10);
    expect(rel(r.slope_u_um_per_m / 1000, 4.29796848199937e-4)).toBeLessThan(1e-10);
    expect(rel(r.intercept_u_um, 0.232818234301152)).toBeLessThan(1e-10);
    expect(rel(r.residual_sd_um, 0.884796396144373)).toBeLessThan(1e-10);
    expect(r.angle_arcsec).toBeCloseTo(Math.atan(1.00211681802045e-3) / RAD_PER_ARCSEC, 8);
    expect(r.tir_um).toBeCloseTo(998.5 - 0.1, 10);
  });

  it("straightness is the peak-to-valley of the residuals about the line (definition)", () => {
    // Line 0.01 µm/mm plus a bump of +2 µm at the middle reading.
    const x = [0, 100, 200, 300, 400];
    const y = x.map((t, i) => 0.01 * t + (i === 2 ? 2 : 0));
    const r = fitTram({ travelMm: x, readingUm: y });
    const res = Array.from(r.residuals_um);
    expect(r.straightness_um).toBeCloseTo(Math.max(...res) - Math.min(...res), 12);
    expect(r.straightness_um).toBeCloseTo(2, 12); // the bump is 1.6 above and 0.4 below the LS line's other points
  });

  it("a pure slope: 0.0005 in over 10 in of travel is 50 µm/m and 10.31″ (trade trigonometry; 1 in = 25.4 mm)", () => {
    const r = fitTram({ travelMm: [0, 127, 254], readingUm: [0, 6.35, 12.7] });
    expect(r.slope_um_per_m).toBeCloseTo(50, 9);
    expect(r.angle_arcsec).toBeCloseTo(10.31, 2);
    expect(r.straightness_um).toBeLessThan(1e-12);
  });

  it("row order does not change the result (property, within 1e-9)", () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.tuple(
            fc.double({ min: -500, max: 500, noNaN: true }),
            fc.double({ min: -50, max: 50, noNaN: true }),
          ),
          {
            minLength: 3,
            maxLength: 30,
          },
        ),
        fc.integer(),
        (pts, seed) => {
          const xs = pts.map((p) => p[0]);
          if (Math.max(...xs) - Math.min(...xs) < 1) return;
          const a = fitTram({ travelMm: xs, readingUm: pts.map((p) => p[1]) });
          const perm = pts
            .map((p, i) => ({ p, k: Math.sin(seed + i * 12.9898) }))
            .sort((u, v) => u.k - v.k)
            .map((e) => e.p);
          const b = fitTram({ travelMm: perm.map((p) => p[0]), readingUm: perm.map((p) => p[1]) });
          for (const key of TRAM_JSON_KEYS)
            expect(Math.abs(a[key] - b[key])).toBeLessThan(1e-9 * Math.max(1, Math.abs(a[key])));
        },
      ),
      { numRuns: 100 },
    );
  });

  it("refuses too few rows and a single travel", () => {
    expect(() => fitTram({ travelMm: [0, 1], readingUm: [0, 1] })).toThrow(/at least 3/);
    expect(() => fitTram({ travelMm: [5, 5, 5], readingUm: [0, 1, 2] })).toThrow(/same travel/);
  });
});

describe("single-reading angle and the sine bar", () => {
  // Handbook tables of sine-bar constants: h = L·sin θ; a 5 in bar at 1° needs 0.08726 in, at 27° 2.270 in.
  const L = 5 * 25.4;
  it("sine bar: 5 in at 1° → 0.08726 in, at 27° → 2.270 in (handbook sine-bar tables)", () => {
    expect(sineBarHeightMm(L, 1) / 25.4).toBeCloseTo(0.08726, 5);
    expect(sineBarHeightMm(L, 27) / 25.4).toBeCloseTo(2.27, 3);
    expect(sineBarAngleDeg(L, 0.08726 * 25.4)).toBeCloseTo(1, 4);
  });
  it("single reading over the sine bar's base run recovers the table angle: atan(h / (L cos θ))", () => {
    for (const [deg, hIn, tol] of [
      [1, 0.08726, 2e-4],
      [27, 2.27, 0.01],
    ] as const) {
      const hMm = hIn * 25.4;
      const base = Math.sqrt(L * L - hMm * hMm);
      const a = angleFromReading(hMm * 1000, base);
      expect(Math.abs(a.angle_deg - deg)).toBeLessThan(tol);
    }
  });
  it("tilt = TIR / distance: 12.7 µm over 254 mm is 50 µm/m, 10.31″ (trade trigonometry)", () => {
    const a = angleFromReading(12.7, 254);
    expect(a.slope_um_per_m).toBeCloseTo(50, 10);
    expect(a.angle_arcsec).toBeCloseTo(10.31, 2);
  });
});
