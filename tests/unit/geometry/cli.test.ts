// The command line: JSON on stdout, exit code 2 and a message on stderr for bad input. Two runs go
// through a real child process (`npx tsx lib/cli/geometry.ts`, as a user runs it); the rest call the
// same `main` in-process with captured output, which keeps the unit suite fast.
import { describe, expect, it } from "vitest";
import { csvFixturePath, runCli, runCliProcess, SWEEP_JSON_KEYS, TRAM_JSON_KEYS } from "./cli-helpers";

const fx = csvFixturePath;
const run = runCliProcess;
const inProcess = runCli;

describe("npm run geometry", { timeout: 60_000 }, () => {
  it("child process: tram prints the documented JSON (NIST Norris); bad input exits 2 with stderr", async () => {
    const [tram, bad] = await Promise.all([
      run("tram", fx("tram-norris.csv")),
      run("tram", fx("sphere-ragged.csv")),
    ]);
    expect(tram.code).toBe(0);
    const t = JSON.parse(tram.stdout);
    expect(Object.keys(t)).toEqual(TRAM_JSON_KEYS);
    // NIST StRD Norris: slope 1.00211681802045 µm/mm = 1002.11681802045 µm/m.
    expect(t.slope_um_per_m).toBeCloseTo(1002.11681802045, 8);
    expect(bad.code).toBe(2);
    expect(bad.stdout).toBe("");
    expect(bad.stderr).toContain("row 1, column travel: the required column 'travel' is missing");
  });

  it("circle, tram, sweep, test-part print the documented JSON; bad input exits 2 with a message", async () => {
    const [circle, circleIn, tram, sweep, part, bad, badNumber, noRadius, unknown, missing] =
      await Promise.all([
        inProcess("circle", fx("circle-gander.csv")),
        inProcess("circle", fx("circle-gander.csv"), "--units", "in"),
        inProcess("tram", fx("tram-norris.csv")),
        inProcess("sweep", fx("sweep-good.csv"), "--radius-mm", "100"),
        inProcess("test-part", fx("test-part-good.csv"), "--rule", "guarded", "--u-mm", "0.003"),
        inProcess("tram", fx("sphere-ragged.csv")),
        inProcess("circle", fx("sphere-bad-numbers.csv")),
        inProcess("sweep", fx("sweep-good.csv")),
        inProcess("bogus", fx("sweep-good.csv")),
        inProcess("tram", fx("no-such-file.csv")),
      ]);

    // Gander, Golub & Strebel (1994) six points in the plane z = 10: centre (4.7398, 2.9835), r 4.7142.
    expect(circle.code).toBe(0);
    const c = JSON.parse(circle.stdout);
    expect(Object.keys(c)).toEqual([
      "centre_mm",
      "normal",
      "radius_mm",
      "rms_um",
      "max_um",
      "radius_U_mm",
      "centre_U_mm",
      "normal_U_arcsec",
    ]);
    expect(c.radius_U_mm).toBeGreaterThan(0);
    expect(c.centre_U_mm).toHaveLength(3);
    expect(c.centre_mm[0]).toBeCloseTo(4.739782, 5);
    expect(c.centre_mm[1]).toBeCloseTo(2.983533, 5);
    expect(c.centre_mm[2]).toBeCloseTo(10, 9);
    expect(c.radius_mm).toBeCloseTo(4.714226, 5);
    expect(c.normal[2]).toBeCloseTo(1, 12);
    // Same numbers read as inches: everything scales by 25.4 (NIST SP 811).
    const ci = JSON.parse(circleIn.stdout);
    expect(ci.radius_mm).toBeCloseTo(4.714226 * 25.4, 4);

    // NIST StRD Norris: slope 1.00211681802045 (µm per mm → µm/m × 1000), sd 4.29796848199937e-4.
    expect(tram.code).toBe(0);
    const t = JSON.parse(tram.stdout);
    expect(Object.keys(t)).toEqual(TRAM_JSON_KEYS);
    expect(t.slope_um_per_m).toBeCloseTo(1002.11681802045, 8);
    expect(t.slope_u_um_per_m).toBeCloseTo(0.429796848199937, 10);

    // tilt = TIR / sweep diameter (trade trigonometry): 20 µm over 200 mm = 100 µm/m, high side at 90°.
    expect(sweep.code).toBe(0);
    const s = JSON.parse(sweep.stdout);
    expect(Object.keys(s)).toEqual(SWEEP_JSON_KEYS);
    expect(s.tilt_um_per_m).toBeCloseTo(100, 9);
    expect(s.direction_deg).toBeCloseTo(90, 9);
    expect(s.tir_um).toBe(20);

    // ISO 14253-1 guarded acceptance (see decision.test.ts for the cases).
    expect(part.code).toBe(0);
    const p = JSON.parse(part.stdout);
    expect(p.rule).toBe("guarded");
    // bore 25.004 in [25.003, 25.018] → pass; flatness 0.008 > 0.01 − 0.003 → undecided; the arcsec
    // row has no U (a mm default does not apply to angles) → the guarded rule cannot decide it:
    // undecided — U missing (ISO 14253-1 needs U to prove conformance; never a silent simple rule).
    expect(p.rows.map((r: { decision: string }) => r.decision)).toEqual(["pass", "undecided", "undecided"]);
    expect(p.rows[2].reason).toBe("U missing");
    expect(part.stderr).toContain("no expanded uncertainty given for rows in arcsec");

    expect(bad.code).toBe(2);
    expect(bad.stdout).toBe("");
    expect(bad.stderr).toContain("row 1, column travel: the required column 'travel' is missing");
    expect(badNumber.code).toBe(2);
    expect(badNumber.stderr).toContain("row 2, column x: 'abc' is not a number");
    expect(badNumber.stderr).toContain("row 4, column z: 'Infinity' is not a finite number");
    expect(noRadius.code).toBe(2);
    expect(noRadius.stderr).toContain("--radius-mm is required");
    expect(unknown.code).toBe(2);
    expect(unknown.stderr).toContain("unknown command 'bogus'");
    expect(missing.code).toBe(2);
    expect(missing.stderr).toContain("cannot read");
  });
});
