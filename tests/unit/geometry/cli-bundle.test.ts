// The prebuilt CLI bundle (lib/cli/build.mjs → .data/cli/geometry.mjs, loaded by lib/cli/run.mjs):
// built here as `npm run build:cli` builds it, it must print exactly what the in-process CLI prints,
// including the unit factors it takes from mathjs at build time (inch input), and the loader must
// refuse a bundle older than the sources instead of running stale code.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, statSync, utimesSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { unit } from "mathjs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { headPoseGrid, MM_PER_INCH, RAD_PER_ARCSEC, RAD_PER_DEG, synthesiseSphereProbe } from "@/geometry";
import { main } from "@/lib/cli/geometry";

const root = join(import.meta.dirname, "../../..");
const bundle = join(root, ".data", "cli", "geometry.mjs");
const dir = mkdtempSync(join(tmpdir(), "trammel-cli-bundle-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const poses = headPoseGrid({ primarySteps: 8, secondaryDeg: [-90, -30, 30, 90], toolMm: [0, 100] });
const data = synthesiseSphereProbe(
  { primary: "C", secondary: "A", pivotLengthMm: 152.4 },
  { pivot_length_error_um: 30, secondary_tilt_arcsec: -20 },
  poses,
  { noiseUm: 0.5, seed: 3, centreMm: [100, 50, 20] },
);
const csv = join(dir, "sphere.csv");
writeFileSync(
  csv,
  [
    "primary_deg,secondary_deg,x,y,z,tool_mm",
    ...poses.map(
      (p, i) =>
        `${p.primaryDeg},${p.secondaryDeg},${data.xMm[i]! / MM_PER_INCH},${data.yMm[i]! / MM_PER_INCH},${data.zMm[i]! / MM_PER_INCH},${p.toolMm}`,
    ),
  ].join("\n"),
);
const head = join(dir, "head.json");
writeFileSync(head, JSON.stringify({ primary: "C", secondary: "A", pivot_length_mm: 152.4 }));
const args = ["fit-head", csv, "--head", head, "--units", "in"];

describe("the prebuilt geometry CLI bundle", () => {
  beforeAll(() => {
    execFileSync(process.execPath, ["lib/cli/build.mjs"], { cwd: root, stdio: "pipe" });
  }, 60_000);

  it("prints exactly what the in-process CLI prints (fit-head, inch input)", async () => {
    let inProcess = "";
    expect(
      await main(
        args,
        (s) => (inProcess += s),
        () => {},
      ),
    ).toBe(0);
    const r = spawnSync(process.execPath, ["lib/cli/run.mjs", ...args], { cwd: root, encoding: "utf8" });
    expect(r.status).toBe(0);
    expect(r.stdout).toBe(inProcess);
  });

  it("the unit factors are mathjs's own (computed at build time, same bits as at run time)", () => {
    expect(MM_PER_INCH).toBe(unit(1, "inch").toNumber("mm"));
    expect(RAD_PER_DEG).toBe(unit(1, "deg").toNumber("rad"));
    expect(RAD_PER_ARCSEC).toBe(unit(1, "arcsec").toNumber("rad"));
    expect(MM_PER_INCH).toBe(25.4); // exact by definition (NIST SP 811, B.8)
  });

  it("a bundle older than the sources is refused with the command that rebuilds it", () => {
    const old = statSync(bundle).mtime;
    try {
      utimesSync(bundle, new Date(1000), new Date(1000));
      const r = spawnSync(process.execPath, ["lib/cli/run.mjs", ...args], { cwd: root, encoding: "utf8" });
      expect(r.status).toBe(2);
      expect(r.stderr).toMatch(/bundle is older than .*; run `npm run build:cli`/);
      expect(r.stdout).toBe("");
    } finally {
      utimesSync(bundle, old, old);
    }
  });
});
