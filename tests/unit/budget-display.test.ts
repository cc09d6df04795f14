// The fit's uncertainty budget as shown: geometry's JCGM 100 combination (GUM eq. 10, root sum of
// squared contributions; U = 2 u_c) fed from register figures. Values worked by hand beside each case.
import { describe, expect, it } from "vitest";
import { headFitJson, param } from "./fit-builders";
import { budgetTable, resolveTypeB } from "@/lib/budget-display";

const fit = headFitJson([
  param("pivot_length_error_um", 38, 0.6, "ΔL"),
  param("secondary_zero_arcsec", -22, 0.8, "EA0A"),
  param("secondary_yaw_arcsec", 0, null, "EC0A"),
]);

describe("budget inputs from the registers", () => {
  it("converts register figures in mm to µm and fills steel's α (11.5e-6 /K) for a temperature band", () => {
    const t = resolveTypeB({
      probe: { id: "p", label: "probe", standardUncertaintyMm: 0.0005 },
      sphere: null,
      presetter: { id: "t", label: "presetter", standardUncertaintyMm: 0.002 },
      deltaTK: 1,
      alphaPerK: null,
      lengthMm: 152.4,
    });
    expect(t.uProbeUm).toBeCloseTo(0.5, 12);
    expect(t.uToolUm).toBeCloseTo(2, 12);
    expect(t).toMatchObject({ deltaTK: 1, alphaPerK: 11.5e-6, lengthMm: 152.4 });
    expect("uSphereUm" in t).toBe(false);
  });
});

describe("budget table", () => {
  it("combines Type A, probe, presetter and temperature for the pivot length (worked by hand)", () => {
    // Probe: 0.5 µm × 0.8 = 0.4 µm; presetter 2 µm; temperature a = 1 K × 11.5e-6 × 152.4 mm = 1.7526 µm,
    // u = a/√3 = 1.01186 µm (GUM 4.3.7). u_c = √(0.09 + 0.16 + 4 + 1.02386) = 2.29649 µm; U = 4.59 µm.
    const t = budgetTable(
      fit,
      { pivot_length_error_um: 0.8, secondary_zero_arcsec: 1.5 },
      { uProbeUm: 0.5, uToolUm: 2, deltaTK: 1, alphaPerK: 11.5e-6, lengthMm: 152.4 },
    );
    expect(t.rows).toHaveLength(2);
    const pivot = t.rows[0]!;
    expect(pivot.components.map((c) => [c.name, c.contribution])).toEqual([
      ["fit (Type A)", "0.300"],
      ["probe", "0.400"],
      ["tool-length presetter", "2.000"],
      ["temperature (ΔT·α·L, rectangular)", "1.012"],
    ]);
    expect(pivot.uc).toBe("2.296");
    expect(pivot.U).toBe("4.59");
    // The angle: Type A 0.4″ and probe 0.5 µm × 1.5 ″/µm = 0.75″; u_c = 0.85″, U = 1.70″.
    expect(t.rows[1]!.uc).toBe("0.850");
    expect(t.rows[1]!.U).toBe("1.70");
    expect(t.rows[1]!.unit).toBe("″");
  });

  it("says so when only the fit's Type A is in the budget", () => {
    const t = budgetTable(fit, {}, {});
    expect(t.notes.join(" ")).toMatch(/Type A only/);
    expect(t.rows[0]!.U).toBe("0.60");
  });
});
