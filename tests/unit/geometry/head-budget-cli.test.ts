// fit-head with Type B inputs prints a JCGM 100 budget per fitted parameter: the fit's Type A
// (its own u), the probe through the pose plan's u per µm of noise, and on the pivot length the
// presetter and the temperature band ΔT·α·L (rectangular, u = a/√3, GUM 4.3.7; α of steel
// 11.5e-6 /K, Swyt 1994). Hand-derivable figures are recomputed from the printed components.
import { describe, expect, it } from "vitest";
import { headPoseGrid, synthesiseSphereProbe } from "@/geometry";
import { runCli, sphereProbeCsvText, tempFiles } from "./cli-helpers";

const { file } = tempFiles("budget-cli");
const cfg = { primary: "C", secondary: "A", pivotLengthMm: 152.4 } as const;
const poses = headPoseGrid({ primarySteps: 6, secondaryDeg: [-90, -45, 0, 45, 90], toolMm: [0, 100] });
const data = synthesiseSphereProbe(cfg, { pivot_length_error_um: 40 }, poses, { noiseUm: 1, seed: 3 });
const sphere = file("sphere.csv", sphereProbeCsvText(data));
const head = file("head.json", JSON.stringify({ primary: "C", secondary: "A", pivot_length_mm: 152.4 }));

const cli = runCli;

describe("fit-head budget", () => {
  it("prints budget rows whose u_c is the root sum of squares of the printed contributions", async () => {
    const r = await cli(
      "fit-head",
      sphere,
      "--head",
      head,
      "--u-probe-um",
      "0.5",
      "--u-tool-um",
      "2",
      "--delta-t-k",
      "1",
    );
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    const pivot = j.budget.find((b: { key: string }) => b.key === "pivot_length_error_um");
    const names = pivot.components.map((c: { name: string }) => c.name);
    expect(names).toEqual([
      "fit (Type A)",
      "probe",
      "tool-length presetter",
      "temperature (ΔT·α·L, rectangular)",
    ]);
    const temp = pivot.components[3];
    expect(temp.u).toBeCloseTo((1 * 11.5e-6 * 152.4 * 1000) / Math.sqrt(3), 10);
    const rss = Math.sqrt(
      pivot.components.reduce((s: number, c: { contribution: number }) => s + c.contribution ** 2, 0),
    );
    expect(pivot.u_c).toBeCloseTo(rss, 12);
    expect(pivot.U).toBeCloseTo(2 * rss, 12);
    const fitU = j.parameters.find((p: { key: string }) => p.key === "pivot_length_error_um").u;
    expect(pivot.components[0].u).toBe(fitU);
    expect(pivot.components[1].sensitivity).toBeGreaterThan(0);
  });

  it("without Type B inputs the JSON is unchanged and stderr says U is Type A only", async () => {
    const r = await cli("fit-head", sphere, "--head", head);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).budget).toBeUndefined();
    expect(r.stderr).toMatch(/Type A only/);
    const bad = await cli("fit-head", sphere, "--head", head, "--u-probe-um", "-1");
    expect(bad.code).toBe(2);
  });
});
