/**
 * Is a job ready for its report to be issued? One pure function over what the job has recorded,
 * used by the Report tab (the list of blockers with links), by GET /api/jobs/{id}/readiness and by
 * issueReport, which refuses (409) while any blocker stands. db/queries/readiness.ts gathers the
 * input. The rules:
 * - The phase that counts: once anything was recorded after adjustment, the as-left (after)
 *   state is what the report vouches for, so every step needs an after-adjustment reading and the
 *   fit must come from after-adjustment data; otherwise the before-adjustment (as-found) state.
 * - Each counting reading names its instrument (answers, records and notes need none), and each
 *   instrument was in calibration when used; a step that asks for a photo has one.
 * - Each dataset the procedure asks for (sphere-probe data when it sets limits for the head
 *   parameters) is present in the phase that counts and evaluated; every test part is evaluated.
 * - The fit is approved; the "performed" and "inspected" signatures are present and still match
 *   the job's recorded state (a later reading or dataset makes them stale).
 * - A procedure that asks for a tool-centre-point check after compensation has one stored; its
 *   latest check is judged like any other result (FAIL: check again, or carry it as a deviation).
 * - A procedure that sets ISO 230-2 positioning limits for a rotary axis has a positioning test of
 *   that axis stored; the test that counts is judged like any other result.
 * - Every FAIL or undecided result is either measured again and passing (the current reading or
 *   fit is what is judged) or carried as a deviation with a written justification.
 * - The issuer's name and address are filled in (ISO/IEC 17025:2017 §7.8.2.1 b).
 */
import { HEAD_AXIS_ROLE_WORDS, type HeadAxisRole } from "@/lib/domain/positioning";
import { AppError } from "@/lib/errors";
import type { Decision } from "@/lib/report/types";

export const BLOCKER_CODES = [
  "step_not_measured",
  "reading_without_instrument",
  "instrument_out_of_calibration",
  "dataset_missing",
  "dataset_not_evaluated",
  "fit_not_approved",
  "fit_wrong_phase",
  "signature_missing",
  "signature_stale",
  "result_not_conforming",
  "photo_missing",
  "issuer_details_missing",
  "tcp_check_missing",
  "rotary_positioning_missing",
] as const;
export type BlockerCode = (typeof BLOCKER_CODES)[number];

export interface Blocker {
  code: BlockerCode;
  message: string;
  /** Where in the app the blocker is resolved. */
  href: string;
}

export interface Readiness {
  ready: boolean;
  blockers: Blocker[];
}

export type Phase = "pre" | "post";
export const PHASE_WORDS: Record<Phase, string> = { pre: "before adjustment", post: "after adjustment" };

/** A judged result that may need a deviation: its subject key, its name in words and its decision. */
export interface JudgedResult {
  subject: string;
  label: string;
  decision: Decision;
}

export interface ReadinessInput {
  jobId: string;
  steps: ReadonlyArray<{
    id: string;
    position: number;
    title: string;
    pre: { decision: Decision; instrumentSerial: string | null } | null;
    post: { decision: Decision; instrumentSerial: string | null } | null;
    /** False for answers, records and notes (taken without an instrument); default true. */
    needsInstrument?: boolean;
    /** The procedure asks for a photo of this step; photoCount is how many the job has of it. */
    photoRequired?: boolean;
    photoCount?: number;
  }>;
  /** Every instrument named by a current reading, with the day (YYYY-MM-DD, UTC) of its latest such reading. */
  instruments: ReadonlyArray<{ serial: string; calibrationDueOn: string; lastUsedOn: string }>;
  /** Stored (not deleted) datasets; `evaluated`: a fit was run (sphere probe) or the evaluation exists (test part). */
  datasets: ReadonlyArray<{ id: string; kind: string; phase: Phase; filename: string; evaluated: boolean }>;
  /** The procedure sets limits for the head parameters, so it asks for sphere-probe data and a fit. */
  requiresFit: boolean;
  approvedFit: { datasetId: string; phase: Phase; datasetStored: boolean } | null;
  /** The approved fit's parameters and the counting test part's rows, as judged. */
  results: readonly JudgedResult[];
  /** Pre-issue signatures, with the state hash each was given over (null: not comparable). */
  signatures: ReadonlyArray<{
    meaning: "performed" | "inspected";
    signerName: string;
    stateSha256: string | null;
  }>;
  currentStateSha256: string;
  /** Subjects carried as deviations. */
  deviationSubjects: readonly string[];
  /** The issuer's details that are empty ("name", "address"): lib/policy/issuer.issuerDetailsMissing. */
  issuerMissing?: readonly string[];
  /** The procedure asks for a TCP check, and the latest stored one (its judged result is in `results`). */
  tcpCheck?: { required: boolean; latest: { datasetId: string; filename: string } | null };
  /** The axes the procedure sets positioning limits for, and the axes with a stored test (its result is in `results`). */
  rotaryPositioning?: { required: readonly HeadAxisRole[]; present: readonly HeadAxisRole[] };
}

/** The phase whose state the report vouches for. */
export function countingPhase(input: Pick<ReadinessInput, "steps" | "datasets">): Phase {
  return input.steps.some((s) => s.post) || input.datasets.some((d) => d.phase === "post") ? "post" : "pre";
}

/** Subject key of a checklist step's result, shared by the readiness check and the deviation form. */
export const stepSubject = (stepId: string) => `step:${stepId}`;
export const parameterSubject = (key: string) => `parameter:${key}`;
export const testPartSubject = (datasetId: string, row: number) => `test_part:${datasetId}:${row}`;

const NOT_CONFORMING: ReadonlySet<Decision> = new Set(["fail", "undecided"]);

/** Every judged result of the job that is FAIL or undecided, steps first. */
export function nonConformingResults(
  input: Pick<ReadinessInput, "steps" | "datasets" | "results">,
): JudgedResult[] {
  const phase = countingPhase(input);
  const steps = input.steps.flatMap((s) => {
    const r = s[phase];
    return r && NOT_CONFORMING.has(r.decision)
      ? [{ subject: stepSubject(s.id), label: `Step ${s.position}: ${s.title}`, decision: r.decision }]
      : [];
  });
  return [...steps, ...input.results.filter((r) => NOT_CONFORMING.has(r.decision))];
}

/**
 * How many FAIL or undecided results a recorded deviation carries: only a deviation recorded for
 * that same result (its subject) counts; one left over from a result measured again since, or
 * recorded for another result, carries nothing. What the statement of conformity counts.
 */
export function carriedCount(
  results: readonly Pick<JudgedResult, "subject">[],
  deviationSubjects: readonly string[],
): number {
  const subjects = new Set(deviationSubjects);
  return results.filter((r) => subjects.has(r.subject)).length;
}

export function readiness(input: ReadinessInput): Readiness {
  const job = `/jobs/${input.jobId}`;
  const blockers: Blocker[] = [];
  const add = (code: BlockerCode, message: string, href: string) => blockers.push({ code, message, href });
  const phase = countingPhase(input);
  const words = PHASE_WORDS[phase];

  for (const s of input.steps) {
    const r = s[phase];
    if (!r)
      add(
        "step_not_measured",
        `Step ${s.position} "${s.title}" has no reading ${words}.`,
        `${job}/checklist`,
      );
    else if (!r.instrumentSerial && s.needsInstrument !== false)
      add(
        "reading_without_instrument",
        `Step ${s.position} "${s.title}": the reading ${words} names no instrument.`,
        `${job}/checklist`,
      );
  }
  for (const s of input.steps)
    if (s.photoRequired && !(s.photoCount && s.photoCount > 0))
      add(
        "photo_missing",
        `Step ${s.position} "${s.title}" needs a photo (the dial, the set-up or the shims); add it on the checklist.`,
        `${job}/checklist#step-${s.position}`,
      );
  for (const i of input.instruments)
    if (i.calibrationDueOn < i.lastUsedOn)
      add(
        "instrument_out_of_calibration",
        `Instrument ${i.serial} was used on ${i.lastUsedOn}, after its calibration fell due on ${i.calibrationDueOn}.`,
        `${job}/checklist`,
      );

  const probes = input.datasets.filter((d) => d.kind === "sphere_probe" && d.phase === phase);
  if (input.requiresFit && probes.length === 0)
    add(
      "dataset_missing",
      `The procedure asks for sphere-probe data ${words}; none is stored.`,
      `${job}/data`,
    );
  if (input.requiresFit && probes.length > 0 && !probes.some((d) => d.evaluated))
    add(
      "dataset_not_evaluated",
      `The sphere-probe data ${words} (${probes.map((d) => d.filename).join(", ")}) has not been fitted.`,
      `${job}/analysis`,
    );
  for (const d of input.datasets.filter((x) => x.kind === "test_part" && !x.evaluated))
    add(
      "dataset_not_evaluated",
      `The test part ${d.filename} could not be evaluated.`,
      `${job}/data/${d.id}`,
    );

  if (input.requiresFit || input.approvedFit) {
    if (!input.approvedFit || !input.approvedFit.datasetStored)
      add("fit_not_approved", "No fit of the head's parameters is approved.", `${job}/analysis`);
    else if (input.approvedFit.phase !== phase)
      add(
        "fit_wrong_phase",
        `The approved fit is from data ${PHASE_WORDS[input.approvedFit.phase]}; the report needs a fit of the data ${words}.`,
        `${job}/analysis`,
      );
  }

  if (input.tcpCheck?.required && !input.tcpCheck.latest)
    add(
      "tcp_check_missing",
      "The procedure asks for a tool-centre-point check after the new values are entered in the control; none is stored.",
      `${job}/control`,
    );

  for (const axis of input.rotaryPositioning?.required ?? [])
    if (!input.rotaryPositioning!.present.includes(axis))
      add(
        "rotary_positioning_missing",
        `The procedure sets ISO 230-2 positioning limits for the ${HEAD_AXIS_ROLE_WORDS[axis]}; no positioning test of it is stored.`,
        `${job}/data`,
      );

  for (const meaning of ["performed", "inspected"] as const) {
    const given = input.signatures.filter((s) => s.meaning === meaning);
    const label = meaning === "performed" ? "Work performed" : "Inspected";
    if (given.length === 0) add("signature_missing", `"${label}" is not signed yet.`, `${job}/report#sign`);
    else if (!given.some((s) => s.stateSha256 === input.currentStateSha256))
      add(
        "signature_stale",
        `"${label}" (${given.map((s) => s.signerName).join(", ")}) was signed before the record last changed; sign again.`,
        `${job}/report#sign`,
      );
  }

  const carried = new Set(input.deviationSubjects);
  for (const r of nonConformingResults(input))
    if (!carried.has(r.subject))
      add(
        "result_not_conforming",
        `${r.label} is ${r.decision === "fail" ? "FAIL" : "undecided"}: measure it again, or record a deviation with its justification.`,
        `${job}/report#deviations`,
      );

  const missing = input.issuerMissing ?? [];
  if (missing.length)
    add(
      "issuer_details_missing",
      `The issuer's ${missing.join(" and ")} ${missing.length === 1 ? "is" : "are"} missing: the administrator fills them in under Registers, Issuer details.`,
      "/registers/settings",
    );

  return { ready: blockers.length === 0, blockers };
}

/** Issue refused while blockers stand: 409, each blocker as an issue (field = its code). */
export class NotReadyError extends AppError {
  constructor(readonly blockers: readonly Blocker[]) {
    super(
      409,
      "not_ready",
      `The report cannot be issued yet: ${blockers.length} ${blockers.length === 1 ? "item is" : "items are"} open.`,
      blockers.map((b) => ({ field: b.code, message: b.message })),
    );
  }
}
