// `npm run geometry -- fit-head | plan`, in-process through the dispatcher's main (as cli.test.ts
// does for the other commands). Data synthesised from known errors; the fit must give them back.
import { describe, expect, it } from "vitest";
import { headPoseGrid, MM_PER_INCH, synthesiseSphereProbe } from "@/geometry";
import { runCli, sphereProbeCsvText, tempFiles } from "./cli-helpers";
import { HEAD_FIT_JSON_KEYS } from "./head-helpers";

const { file } = tempFiles("head-cli");
const cfg = { primary: "C", secondary: "A", pivotLengthMm: 152.4 } as const;
const poses = headPoseGrid({ primarySteps: 6, secondaryDeg: [-90, -45, 0, 45, 90], toolMm: [0, 100] });
const data = synthesiseSphereProbe(cfg, { pivot_length_error_um: 40, primary_zero_arcsec: -70 }, poses, {
  noiseUm: 0.5,
  seed: 9,
  centreMm: [300, 100, 200],
});
const mm = file("sphere.csv", sphereProbeCsvText(data));
const inch = file("sphere-in.csv", sphereProbeCsvText(data, MM_PER_INCH));
const head = file("head.json", JSON.stringify({ primary: "C", secondary: "A", pivot_length_mm: 152.4 }));
const badHead = file("bad.json", JSON.stringify({ primary: "C", secondary: "C", pivot_length_mm: 152.4 }));
const plan = file(
  "poses.csv",
  [
    "primary_deg,secondary_deg",
    ...poses.filter((p) => p.toolMm === 0).map((p) => `${p.primaryDeg},${p.secondaryDeg}`),
  ].join("\n"),
);

const run = runCli;

describe("head commands", () => {
  it("fit-head prints the documented JSON and gives the synthetic errors back, mm or inch input", async () => {
    const [a, b] = await Promise.all([
      run("fit-head", mm, "--head", head),
      run("fit-head", inch, "--head", head, "--units", "in"),
    ]);
    expect(a.code).toBe(0);
    const j = JSON.parse(a.stdout);
    expect(Object.keys(j)).toEqual(HEAD_FIT_JSON_KEYS);
    const L = j.parameters.find((p: { key: string }) => p.key === "pivot_length_error_um");
    expect(Math.abs(L.value - 40)).toBeLessThan(2 * L.U);
    const k = JSON.parse(b.stdout);
    j.parameters.forEach((p: { value: number }, i: number) =>
      expect(Math.abs(p.value - k.parameters[i].value)).toBeLessThan(1e-6),
    );
  });

  it("plan prints identifiability and u per µm of noise; bad head file and missing --head exit 2", async () => {
    const [p, bad, none] = await Promise.all([
      run("plan", plan, "--head", head),
      run("fit-head", mm, "--head", badHead),
      run("fit-head", mm),
    ]);
    expect(p.code).toBe(0);
    const j = JSON.parse(p.stdout);
    expect(j.poses).toBe(30);
    expect(j.parameters.find((x: { key: string }) => x.key === "tip_offset_n_um").identifiable).toBe("no");
    expect(j.advice.join(" ")).toContain("second tool length");
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain("column secondary");
    expect(none.code).toBe(2);
    expect(none.stderr).toContain("--head");
  });
});
