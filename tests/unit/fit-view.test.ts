// The analysis page's view model (lib/analysis/fit-view.ts): which fit is shown, which one is drawn
// beside it, which poses the 3D view draws, and why a fit may not be approved. Product rules,
// written out by hand.
import { describe, expect, it } from "vitest";
import {
  approvalNote,
  chooseShownFit,
  fittedErrors,
  headViewInput,
  otherPhaseFit,
  thinPoses,
} from "@/lib/analysis/fit-view";
import { nonConformingParameters, type ParameterRow } from "@/lib/fit-display";
import type { Actor, Role } from "@/lib/domain/roles";

const fit = (id: string, datasetId: string) => ({ analysis: { id, datasetId } });
// Newest first, as listJobAnalyses returns them.
const fits = [fit("a3", "post1"), fit("a2", "pre1"), fit("a1", "pre1")];
const phaseOf = new Map([
  ["pre1", "pre" as const],
  ["post1", "post" as const],
]);
const actor = (role: Role): Actor => ({ id: "u1", email: "x@y.example", name: "X", role, customerId: null });

describe("chooseShownFit", () => {
  it("shows the fit named in the address, else the approved one, else the newest", () => {
    expect(chooseShownFit(fits, "a1", "a2")?.analysis.id).toBe("a1");
    expect(chooseShownFit(fits, undefined, "a2")?.analysis.id).toBe("a2");
    expect(chooseShownFit(fits, "gone", undefined)?.analysis.id).toBe("a3");
    expect(chooseShownFit([], undefined, undefined)).toBeUndefined();
  });
});

describe("otherPhaseFit", () => {
  it("draws the newest fit of the other phase beside the shown one", () => {
    expect(otherPhaseFit(fits, fits[0], phaseOf)?.analysis.id).toBe("a2");
    expect(otherPhaseFit(fits, fits[2], phaseOf)?.analysis.id).toBe("a3");
  });
  it("draws nothing when every fit is of the same phase, or the phase is unknown", () => {
    expect(otherPhaseFit(fits.slice(1), fits[1], phaseOf)).toBeUndefined();
    expect(otherPhaseFit(fits, fit("a9", "deleted"), phaseOf)).toBeUndefined();
  });
});

describe("thinPoses", () => {
  it("keeps every pose up to the limit", () => {
    expect(thinPoses(5, 10)).toEqual({ step: 1, indices: [0, 1, 2, 3, 4] });
  });
  it("keeps every step-th pose, never more than the limit", () => {
    const t = thinPoses(25, 10);
    expect(t.step).toBe(3);
    expect(t.indices).toEqual([0, 3, 6, 9, 12, 15, 18, 21, 24]);
    expect(thinPoses(100_002).indices.length).toBeLessThanOrEqual(10_000);
    expect(thinPoses(0, 10)).toEqual({ step: 1, indices: [] });
  });
});

describe("approvalNote", () => {
  it("lets an engineer approve a job in review with nothing approved yet", () => {
    expect(approvalNote(actor("engineer"), { status: "in_review" }, undefined)).toBeNull();
  });
  it("names who approves, that one set is already approved, or what the status needs", () => {
    expect(approvalNote(actor("inspector"), { status: "in_review" }, undefined)).toMatch(
      /application engineer/,
    );
    expect(approvalNote(actor("engineer"), { status: "in_review" }, "a2")).toMatch(/already approved/);
    expect(approvalNote(actor("engineer"), { status: "measuring" }, undefined)).toMatch(
      /measuring: parameters are approved once the installer has submitted/,
    );
    expect(approvalNote(actor("engineer"), { status: "issued" }, undefined)).toMatch(/sent back for review/);
  });
});

// A fit with two separated parameters and one the data could not separate (U null).
const parameters = [
  { key: "pivot_length_error_um" as const, value: 12.5, U: 0.8 },
  { key: "primary_zero_arcsec" as const, value: -4, U: 1.1 },
  { key: "tip_offset_s_um" as const, value: 3, U: null },
];

describe("fittedErrors", () => {
  it("keeps the parameters the data separated and leaves the others out (drawn as 0)", () => {
    expect(fittedErrors(parameters)).toEqual({ pivot_length_error_um: 12.5, primary_zero_arcsec: -4 });
  });
});

describe("headViewInput", () => {
  const n = 25_000;
  const poses = {
    row: Array.from({ length: n }, (_, i) => i + 1),
    primary_deg: Array.from({ length: n }, (_, i) => i),
    secondary_deg: Array.from({ length: n }, () => 45),
    tool_mm: Array.from({ length: n }, () => 100),
    residual_um: Array.from({ length: n }, (_, i) => [i, 0, 0] as [number, number, number]),
  };
  const shown = {
    analysis: { id: "a3", datasetId: "post1", result: { fit: { parameters }, poses } },
    datasetFilename: "after.csv",
  };
  const other = {
    analysis: { id: "a2", datasetId: "pre1", result: { fit: { parameters: parameters.slice(1) } } },
    datasetFilename: "before.csv",
  };

  it("draws every third pose of 25 000 with its own residual, labelled by phase and dataset", () => {
    const v = headViewInput(shown, undefined, phaseOf);
    expect(v.step).toBe(3);
    expect(v.total).toBe(n);
    expect(v.viewer.poses).toHaveLength(Math.ceil(n / 3));
    expect(v.viewer.poses[1]).toEqual({ primaryDeg: 3, secondaryDeg: 45, toolMm: 100 });
    expect(v.viewer.residualsUm[1]).toEqual([3, 0, 0]);
    expect(v.viewer.shown).toEqual({ analysisId: "a3", phaseText: "after adjustment", dataset: "after.csv" });
    expect(v.viewer.overlay).toBeNull();
  });
  it("draws the other phase's fit over the same poses with its own errors", () => {
    const v = headViewInput(shown, other, phaseOf);
    expect(v.viewer.overlay).toEqual({
      analysisId: "a2",
      phaseText: "before adjustment",
      dataset: "before.csv",
      errors: { primary_zero_arcsec: -4 },
    });
  });
});

describe("nonConformingParameters", () => {
  const row = (key: ParameterRow["key"], decision: ParameterRow["decision"]) =>
    ({
      key,
      iso: `iso-${key}`,
      words: `words-${key}`,
      decision,
      decisionText: decision,
      valueText: "+1.00 µm",
      toleranceText: decision === "no_limit" ? null : "± 0.50 µm",
    }) as ParameterRow;
  it("warns of the fails and the undecided, named with their symbol and words, and of nothing else", () => {
    const out = nonConformingParameters([
      row("pivot_length_error_um", "pass"),
      row("primary_zero_arcsec", "fail"),
      row("tip_offset_s_um", "undecided"),
      row("tip_offset_n_um", "no_limit"),
      row("secondary_offset_um", "not_measured"),
    ]);
    expect(out.map((p) => p.key)).toEqual(["primary_zero_arcsec", "tip_offset_s_um"]);
    expect(out[0]).toEqual({
      key: "primary_zero_arcsec",
      label: "iso-primary_zero_arcsec (words-primary_zero_arcsec)",
      decisionText: "fail",
      valueText: "+1.00 µm",
      toleranceText: "± 0.50 µm",
    });
  });
});
