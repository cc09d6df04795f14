// The readiness check before issue (lib/report/readiness.ts). ISO/IEC 17025:2017 §7.8.1.1 (results
// reported accurately, clearly, unambiguously and objectively) and §7.8.6 (statement of
// conformity with the decision rule) are what the blockers protect: every result the report
// vouches for is measured, traceable (§7.8.4.1 / §6.5, instruments in calibration), signed and
// either conforming or declared as a deviation (§7.8.2.1 p: deviations from the method).
import { describe, expect, it } from "vitest";
import { carriedCount, countingPhase, readiness, type ReadinessInput } from "@/lib/report/readiness";

const ok = { decision: "pass" as const, instrumentSerial: "DTI-1" };
function ready(): ReadinessInput {
  return {
    jobId: "j",
    steps: [{ id: "s1", position: 1, title: "Run-out", pre: ok, post: null }],
    instruments: [{ serial: "DTI-1", calibrationDueOn: "2026-03-01", lastUsedOn: "2026-03-01" }],
    datasets: [{ id: "d1", kind: "sphere_probe", phase: "pre", filename: "probe.csv", evaluated: true }],
    requiresFit: true,
    approvedFit: { datasetId: "d1", phase: "pre", datasetStored: true },
    results: [{ subject: "parameter:pivot_length_error_um", label: "EZ", decision: "pass" }],
    signatures: [
      { meaning: "performed", signerName: "I", stateSha256: "h" },
      { meaning: "inspected", signerName: "N", stateSha256: "h" },
    ],
    currentStateSha256: "h",
    deviationSubjects: [],
  };
}
const codes = (i: ReadinessInput) => readiness(i).blockers.map((b) => b.code);

describe("readiness", () => {
  it("a complete, conforming, signed job is ready", () => {
    expect(readiness(ready())).toEqual({ ready: true, blockers: [] });
  });

  it("a step that asks for a photo blocks until it has one; answers and notes need no instrument", () => {
    const i = ready();
    const answer = { decision: "pass" as const, instrumentSerial: null };
    i.steps = [
      ...i.steps,
      { id: "s2", position: 2, title: "Locked out", pre: answer, post: null, needsInstrument: false },
      { id: "s3", position: 3, title: "Collar", pre: ok, post: null, photoRequired: true, photoCount: 0 },
    ];
    const b = readiness(i).blockers;
    expect(b.map((x) => x.code)).toEqual(["photo_missing"]);
    expect(b[0]!.message).toBe(
      'Step 3 "Collar" needs a photo (the dial, the set-up or the shims); add it on the checklist.',
    );
    expect(b[0]!.href).toBe("/jobs/j/checklist#step-3");
    i.steps = i.steps.map((s) => (s.id === "s3" ? { ...s, photoCount: 1 } : s));
    expect(readiness(i).ready).toBe(true);
    // A reading of a step read with an instrument still needs one.
    i.steps = i.steps.map((s) => (s.id === "s2" ? { ...s, needsInstrument: true } : s));
    expect(codes(i)).toEqual(["reading_without_instrument"]);
  });

  it("once anything is recorded after adjustment, every step needs its after-adjustment reading", () => {
    const i = ready();
    i.steps = [...i.steps, { id: "s2", position: 2, title: "Tram", pre: ok, post: ok }];
    expect(countingPhase(i)).toBe("post");
    const b = readiness(i).blockers;
    expect(b.filter((x) => x.code === "step_not_measured").map((x) => x.message)).toEqual([
      'Step 1 "Run-out" has no reading after adjustment.',
    ]);
    // and the fit from before adjustment no longer counts, nor does the pre sphere-probe data
    expect(b.map((x) => x.code)).toEqual(expect.arrayContaining(["dataset_missing", "fit_wrong_phase"]));
  });

  it("asks for an instrument on each reading, in calibration on the day it was used", () => {
    const i = ready();
    i.steps = [{ ...i.steps[0]!, pre: { decision: "pass", instrumentSerial: null } }];
    i.instruments = [{ serial: "DTI-1", calibrationDueOn: "2026-03-01", lastUsedOn: "2026-03-02" }];
    expect(codes(i)).toEqual(["reading_without_instrument", "instrument_out_of_calibration"]);
    expect(readiness(i).blockers[1]!.message).toContain("after its calibration fell due on 2026-03-01");
  });

  it("asks for the procedure's sphere-probe data, fitted, and an approved fit", () => {
    const i = ready();
    i.datasets = [];
    i.approvedFit = null;
    expect(codes(i)).toEqual(["dataset_missing", "fit_not_approved"]);
    const j = ready();
    j.datasets = [{ ...j.datasets[0]!, evaluated: false }];
    expect(codes(j)).toEqual(["dataset_not_evaluated"]);
    const k = ready();
    k.approvedFit = { ...k.approvedFit!, datasetStored: false };
    expect(codes(k)).toEqual(["fit_not_approved"]);
  });

  it("a procedure without parameter limits asks for no fit", () => {
    const i = ready();
    i.requiresFit = false;
    i.datasets = [];
    i.approvedFit = null;
    i.results = [];
    expect(readiness(i).ready).toBe(true);
  });

  it("asks for both pre-issue signatures, and again when the record changed after them", () => {
    const i = ready();
    i.signatures = [i.signatures[1]!];
    expect(codes(i)).toEqual(["signature_missing"]);
    const j = ready();
    j.currentStateSha256 = "h2";
    const b = readiness(j).blockers;
    expect(b.map((x) => x.code)).toEqual(["signature_stale", "signature_stale"]);
    expect(b[0]!.href).toBe("/jobs/j/report#sign");
    // a fresh signature after the change clears it
    j.signatures = [...j.signatures, { meaning: "performed", signerName: "I", stateSha256: "h2" }];
    expect(codes(j)).toEqual(["signature_stale"]);
  });

  it("a FAIL or undecided result blocks until a deviation carries it; a passing re-measurement needs none", () => {
    const i = ready();
    i.steps = [{ ...i.steps[0]!, pre: { decision: "fail", instrumentSerial: "DTI-1" } }];
    i.results = [{ subject: "test_part:d9:1", label: "Bore B", decision: "undecided" }];
    const b = readiness(i).blockers;
    expect(b.map((x) => x.code)).toEqual(["result_not_conforming", "result_not_conforming"]);
    expect(b[0]!.message).toContain("FAIL");
    expect(b[1]!.message).toContain("undecided");
    i.deviationSubjects = ["step:s1", "test_part:d9:1"];
    expect(readiness(i).ready).toBe(true);
  });
});

// ISO/IEC 17025:2017 §7.8.6.1: the statement of conformity says "conforms with the listed
// deviations" only when every FAIL or undecided result is itself carried; a count of deviations is
// not enough (one may belong to a result measured again since, or to another result).
describe("carriedCount", () => {
  const open = [{ subject: "step:a" }, { subject: "parameter:pivot_length_error_um" }];
  it("counts a deviation only for the result it was recorded for", () => {
    expect(carriedCount(open, ["step:a"])).toBe(1);
    expect(carriedCount(open, ["step:a", "parameter:pivot_length_error_um"])).toBe(2);
  });
  it("carries nothing with a deviation left over from another result", () => {
    // Two deviations, two open results, but neither deviation names an open result.
    expect(carriedCount(open, ["step:b", "test_part:x:1"])).toBe(0);
  });
});
