// Uncertainty budget (JCGM 100:2008, GUM). The checks are hand-derivable cases (marked "hand"),
// each from the GUM's rules: u_c² = Σ (c_k u_k)² for uncorrelated inputs (GUM eq. 10), a
// rectangular distribution of half-width a has u = a/√3 (GUM 4.3.7), U = k·u_c with k = 2.
// Expansion coefficient of steel 11.5e-6 /K: Swyt, J. Res. NIST 99(1), 1994.
import { describe, expect, it } from "vitest";
import { budgetToJson, GeometryError, uncertaintyBudget } from "@/geometry";

describe("uncertaintyBudget (JCGM 100)", () => {
  const params = [
    { key: "pivot_length_error_um", unit: "um" as const, uTypeA: 0.8, uPerUmNoise: 0.9 },
    { key: "secondary_tilt_arcsec", unit: "arcsec" as const, uTypeA: 1.2, uPerUmNoise: 1.5 },
  ];

  it("hand: pivot length with probe, presetter and a ±2 K temperature band over 152.4 mm of steel", () => {
    const b = uncertaintyBudget(params, { uProbeUm: 0.5, uToolUm: 1.5, deltaTK: 2, lengthMm: 152.4 });
    const pivot = b.rows[0]!;
    // a = 2 K × 11.5e-6 /K × 152.4 mm = 3.5052e-3 mm = 3.5052 µm; u = a/√3 = 2.02373 µm.
    const uT = 3.5052 / Math.sqrt(3);
    const temp = pivot.components.find((c) => c.name.startsWith("temperature"))!;
    expect(temp.u).toBeCloseTo(uT, 10);
    expect(temp.u).toBeCloseTo(2.02373, 5);
    // Probe: c = 0.9 µm/µm × 0.5 µm = 0.45 µm.
    expect(pivot.components.find((c) => c.name === "probe")!.contribution).toBeCloseTo(0.45, 12);
    const uc = Math.sqrt(0.8 ** 2 + 0.45 ** 2 + 1.5 ** 2 + uT ** 2);
    expect(pivot.u_c).toBeCloseTo(uc, 12);
    expect(pivot.U).toBeCloseTo(2 * uc, 12);
    // An angle: no presetter or temperature term (they act on the pivot length only).
    const tilt = b.rows[1]!;
    expect(tilt.components.map((c) => c.name)).toEqual(["fit (Type A)", "probe"]);
    expect(tilt.u_c).toBeCloseTo(Math.hypot(1.2, 0.75), 12);
    expect(b.typeAOnly).toBe(false);
  });

  it("hand: without Type B inputs the budget is the Type A alone and says so; the sphere's diameter adds nothing to a centre fit", () => {
    const a = uncertaintyBudget(params);
    expect(a.typeAOnly).toBe(true);
    expect(a.rows[0]!.U).toBeCloseTo(1.6, 12);
    expect(a.notes.join(" ")).toMatch(/Type A only/);
    const s = uncertaintyBudget(params, { uSphereUm: 0.25 });
    expect(s.rows[0]!.u_c).toBeCloseTo(0.8, 12);
    expect(s.rows[0]!.components[1]).toMatchObject({
      name: "reference sphere calibration",
      sensitivity: 0,
      contribution: 0,
    });
    expect(s.notes.join(" ")).toMatch(/insensitive to the reference sphere's diameter/);
    expect(Object.keys(budgetToJson(s)[0]!)).toEqual(["key", "components", "u_c", "U"]);
  });

  it("aluminium's coefficient (23.1e-6 /K, Swyt 1994) doubles the temperature term roughly; bad inputs are refused", () => {
    const al = uncertaintyBudget([params[0]!], { deltaTK: 1, alphaPerK: 23.1e-6, lengthMm: 100 });
    expect(al.rows[0]!.components[1]!.u).toBeCloseTo(2.31 / Math.sqrt(3), 12);
    expect(() => uncertaintyBudget(params, { deltaTK: 1 })).toThrow(/needs the length/);
    expect(() => uncertaintyBudget(params, { uProbeUm: -1 })).toThrow(GeometryError);
    expect(() => uncertaintyBudget([{ ...params[0]!, uTypeA: NaN }])).toThrow(/Type A/);
  });
});
