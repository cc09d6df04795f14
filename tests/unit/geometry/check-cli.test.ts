// The rotary-positioning and tcp-check commands of `npm run geometry`, in-process through `main`.
// rotary-positioning-iso230.csv holds the public ISO 230-2 worked data set of
// paulscherrerinstitute/ecmccfg (examples/test/fat_sat/report.md), its millimetres read as degrees.
import { describe, expect, it } from "vitest";
import { csvFixturePath, runCli } from "./cli-helpers";

const fx = csvFixturePath;
const cli = runCli;

describe("rotary-positioning and tcp-check commands", () => {
  it("rotary-positioning prints the ISO 230-2 figures in arc seconds (report's mm ×3600)", async () => {
    const r = await cli("rotary-positioning", fx("rotary-positioning-iso230.csv"));
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.unit).toBe("arcsec");
    expect(j.targets).toHaveLength(5);
    // Report (8 decimals of a unit): B 1.22e-5, B̄ 5.4e-6, M 2.77e-5, A 8.881e-5; ×3600 for arc seconds.
    expect(Math.abs(j.B - 1.22e-5 * 3600)).toBeLessThan(0.5e-8 * 3600);
    expect(Math.abs(j.B_mean - 5.4e-6 * 3600)).toBeLessThan(0.5e-8 * 3600);
    expect(Math.abs(j.M - 2.77e-5 * 3600)).toBeLessThan(0.5e-8 * 3600);
    expect(Math.abs(j.A - 8.881e-5 * 3600)).toBeLessThan(0.5e-8 * 3600);
    expect(j.warnings).toEqual([]);
  });

  it("tcp-check prints ranges and the worst row; in inches the ranges scale by 25.4", async () => {
    const mm = JSON.parse((await cli("tcp-check", fx("tcp-check-good.csv"))).stdout);
    // Hand-derived: x 99.997…100.004 → 7 µm, y 49.996…50.003 → 7 µm, z −20.003…−19.999 → 4 µm.
    expect(mm.range_um.x).toBeCloseTo(7, 9);
    expect(mm.range_um.y).toBeCloseTo(7, 9);
    expect(mm.range_um.z).toBeCloseTo(4, 9);
    expect(mm.poses).toBe(5);
    expect(mm.worst_row).toBeGreaterThanOrEqual(2);
    const inch = JSON.parse((await cli("tcp-check", fx("tcp-check-good.csv"), "--units", "in")).stdout);
    expect(inch.range_um.x).toBeCloseTo(7 * 25.4, 6);
    expect(inch.max_from_mean_um).toBeCloseTo(mm.max_from_mean_um * 25.4, 6);
  });

  it("bad input exits 2 with a message naming the row", async () => {
    const r = await cli("rotary-positioning", fx("tram-good.csv"));
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/required column 'target_deg' is missing/);
    const s = await cli("tcp-check", fx("sphere-bad-numbers.csv"));
    expect(s.code).toBe(2);
    expect(s.stderr).toMatch(/row \d+/);
  });
});
