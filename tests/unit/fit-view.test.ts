// The analysis page's view model (lib/analysis/fit-view.ts): which fit is shown, which one is drawn
// beside it, which poses the 3D view draws, and why a fit may not be approved. Product rules,
// written out by hand.
import { describe, expect, it } from "vitest";
import { approvalNote, chooseShownFit, otherPhaseFit, thinPoses } from "@/lib/analysis/fit-view";
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
