// Property tests (fast-check): no finite input crashes a command. Every run of circle, tram, sweep,
// rotary-positioning, tcp-check and test-part on random finite numbers (from tiny to 1e308, with
// repeats and single poses) ends in exit 0 with JSON whose numbers are all finite (null only where
// the JSON shape documents it), or exit 2 with a message — never an internal error (exit 1).
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { runCli, tempFiles } from "./cli-helpers";

const { file } = tempFiles("geometry-prop");
let k = 0;

/** Keys whose value may be null by the documented JSON shape. */
const NULLABLE = new Set([
  "flatness_ls_um",
  "flatness_mz_um",
  "radius_U_mm",
  "centre_U_mm",
  "normal_U_arcsec",
]);

function checkJson(v: unknown, key = ""): void {
  if (v === null) {
    expect(NULLABLE.has(key), `null at ${key}`).toBe(true);
  } else if (typeof v === "number") {
    expect(Number.isFinite(v), `${key} = ${v}`).toBe(true);
  } else if (Array.isArray(v)) {
    v.forEach((e) => checkJson(e, key));
  } else if (typeof v === "object") {
    for (const [kk, e] of Object.entries(v as object)) checkJson(e, kk);
  }
}

async function checkCommand(command: string, csv: string, ...opts: string[]) {
  const { code, stdout, stderr } = await runCli(command, file(`${k++}.csv`, csv), ...opts);
  expect(code, stderr).not.toBe(1);
  if (code === 0) checkJson(JSON.parse(stdout));
  else expect(stderr).toMatch(/^error: /);
}

// Finite doubles of every magnitude, with a bias to small integers and repeats.
const num = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.integer({ min: -3, max: 3 }),
  fc.double({ min: -1000, max: 1000, noNaN: true }),
  fc.constantFrom(1e155, -1e155, 1.7e308, -1.7e308, 5e-324),
);
const fmt = (x: number) => (Object.is(x, -0) ? "0" : String(x));
/** Tables of 1 to `max` rows of this shape. */
const tableOf = <T>(row: fc.Arbitrary<T>, max = 12) => fc.array(row, { minLength: 1, maxLength: max });
/** Tables of `cols` numbers a row. */
const rows = (cols: number, max = 12) => tableOf(fc.array(num, { minLength: cols, maxLength: cols }), max);
const csv = (header: string, rs: readonly (readonly (number | string)[])[]) =>
  [header, ...rs.map((r) => r.map((x) => (typeof x === "number" ? fmt(x) : x)).join(","))].join("\n") + "\n";
const RUNS = { numRuns: 150 };

describe("no finite input crashes a command (fast-check)", { timeout: 120_000 }, () => {
  it("circle", async () => {
    await fc.assert(
      fc.asyncProperty(rows(3), (rs) => checkCommand("circle", csv("x,y,z", rs))),
      RUNS,
    );
  });
  it("tram, single plane and two planes", async () => {
    await fc.assert(
      fc.asyncProperty(rows(2), (rs) => checkCommand("tram", csv("travel,reading", rs))),
      RUNS,
    );
    await fc.assert(
      fc.asyncProperty(
        tableOf(fc.tuple(num, num, fc.constantFrom("XZ", "YZ"), fc.constantFrom(0, 180)), 16),
        (rs) => checkCommand("tram", csv("travel,reading,plane,bar_deg", rs)),
      ),
      RUNS,
    );
  });
  it("sweep", async () => {
    await fc.assert(
      fc.asyncProperty(rows(2), fc.double({ min: 1e-300, max: 1e300, noNaN: true }), (rs, r) =>
        checkCommand("sweep", csv("angle_deg,reading", rs), "--radius-mm", String(r)),
      ),
      RUNS,
    );
  });
  it("rotary-positioning", async () => {
    await fc.assert(
      fc.asyncProperty(
        tableOf(
          fc.tuple(
            fc.oneof(num, fc.constantFrom(0, 90, 360)),
            fc.integer({ min: 1, max: 3 }),
            fc.constantFrom("pos", "neg"),
            num,
          ),
          24,
        ),
        (rs) => checkCommand("rotary-positioning", csv("target_deg,run,direction,measured_deg", rs)),
      ),
      RUNS,
    );
  });
  it("tcp-check", async () => {
    await fc.assert(
      fc.asyncProperty(rows(5), (rs) =>
        checkCommand("tcp-check", csv("primary_deg,secondary_deg,x,y,z", rs)),
      ),
      RUNS,
    );
  });
  it("test-part, both rules", async () => {
    await fc.assert(
      fc.asyncProperty(rows(4), fc.constantFrom("simple", "guarded"), (rs, rule) =>
        checkCommand(
          "test-part",
          csv(
            "feature,characteristic,nominal,measured,lower_tol,upper_tol",
            rs.map((r) => ["f", "c", r[0]!, r[1]!, -Math.abs(r[2]!), Math.abs(r[3]!)]),
          ),
          "--rule",
          rule,
        ),
      ),
      RUNS,
    );
  });
});
