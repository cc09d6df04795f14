/**
 * What the analysis page shows of a job's head fits, decided from the rows the queries return:
 * which fit is shown, which one of the other phase is drawn beside it, which poses the 3D view
 * draws, and why the shown fit may or may not be approved. Pure, so it is unit-tested
 * (tests/unit/fit-view.test.ts); the page only renders the result.
 */
import type { HeadErrors, HeadParameterKey, HeadPose, HeadVec3 } from "@/geometry";
import { STATUS_LABELS, type JobStatus } from "@/lib/domain/jobs";
import { phaseText, type Phase } from "@/lib/domain/datasets";
import type { Actor } from "@/lib/domain/roles";
import { fitApprovalRefusal, fitApproverRefusal } from "@/lib/policy/analyses";

/** The 3D view draws at most this many poses, so the page stays light for very large datasets. */
export const VIEW_POSES = 10_000;

interface FitRef {
  readonly analysis: { readonly id: string; readonly datasetId: string };
}

/** The fit asked for in the address, else the approved one, else the newest (lists are newest first). */
export function chooseShownFit<F extends FitRef>(
  fits: readonly F[],
  wantedId: string | undefined,
  approvedId: string | undefined,
): F | undefined {
  return (
    (wantedId ? fits.find((f) => f.analysis.id === wantedId) : undefined) ??
    (approvedId ? fits.find((f) => f.analysis.id === approvedId) : undefined) ??
    fits[0]
  );
}

/** The newest fit of a dataset of the other phase than the shown one (the before/after overlay). */
export function otherPhaseFit<F extends FitRef>(
  fits: readonly F[],
  shown: F | undefined,
  phaseOf: ReadonlyMap<string, Phase>,
): F | undefined {
  const shownPhase = shown ? phaseOf.get(shown.analysis.datasetId) : undefined;
  if (!shown || !shownPhase) return undefined;
  return fits.find((f) => {
    const phase = phaseOf.get(f.analysis.datasetId);
    return f.analysis.id !== shown.analysis.id && phase !== undefined && phase !== shownPhase;
  });
}

/** Every step-th pose index, with step chosen so at most `max` poses are drawn. */
export function thinPoses(count: number, max = VIEW_POSES): { step: number; indices: number[] } {
  const step = Math.max(1, Math.ceil(count / max));
  const indices: number[] = [];
  for (let i = 0; i < count; i += step) indices.push(i);
  return { step, indices };
}

/**
 * Why the shown fit cannot be approved by this actor now, or null when it can: the approver rule
 * and the job's status (lib/policy/analyses), and that only one parameter set is approved per job.
 */
export function approvalNote(
  actor: Actor,
  job: { status: JobStatus },
  approvedId: string | undefined,
): string | null {
  const who = fitApproverRefusal(actor);
  if (who) return who;
  if (approvedId)
    return "This job's parameters are already approved from another fit; that fit is the one shown by default.";
  if (fitApprovalRefusal(actor, job) === null) return null;
  const status = STATUS_LABELS[job.status].toLowerCase();
  return job.status === "draft" || job.status === "measuring"
    ? `The job is ${status}: parameters are approved once the installer has submitted the job for review.`
    : `The job is ${status} without a parameter set approved here, so none is recorded for it; a correction needs the job sent back for review.`;
}

interface FittedParameter {
  readonly key: HeadParameterKey;
  readonly value: number;
  /** Expanded uncertainty; null when the data could not separate the parameter. */
  readonly U: number | null;
}

/** A fit as listed for the page: its dataset's file name and the fitted parameters. */
interface ListedFit {
  readonly analysis: {
    readonly id: string;
    readonly datasetId: string;
    readonly result: { readonly fit: { readonly parameters: readonly FittedParameter[] } };
  };
  readonly datasetFilename: string;
}

/** The shown fit, with the per-pose arrays the 3D view draws. */
interface ShownFit extends ListedFit {
  readonly analysis: ListedFit["analysis"] & {
    readonly result: ListedFit["analysis"]["result"] & {
      readonly poses: {
        readonly row: readonly number[];
        readonly primary_deg: readonly number[];
        readonly secondary_deg: readonly number[];
        readonly tool_mm: readonly number[];
        readonly residual_um: readonly HeadVec3[];
      };
    };
  };
}

/** The errors a fit found: each parameter the data separated; the others stay out (drawn as 0). */
export function fittedErrors(parameters: readonly FittedParameter[]): HeadErrors {
  return Object.fromEntries(parameters.filter((p) => p.U !== null).map((p) => [p.key, p.value]));
}

/** How the legend names a fit: its phase in words and its dataset. */
function fitLabel(f: ListedFit, phaseOf: ReadonlyMap<string, Phase>) {
  return {
    analysisId: f.analysis.id,
    phaseText: phaseText(phaseOf.get(f.analysis.datasetId) ?? "pre"),
    dataset: f.datasetFilename,
  };
}

/**
 * What the 3D view draws of the shown fit: its errors, every step-th pose with its residual, its
 * label, and the other phase's fit (errors and label) drawn over the same poses, if there is one.
 */
export function headViewInput(
  shown: ShownFit,
  other: ListedFit | undefined,
  phaseOf: ReadonlyMap<string, Phase>,
) {
  const p = shown.analysis.result.poses;
  const { step, indices } = thinPoses(p.row.length);
  const poses: HeadPose[] = indices.map((i) => ({
    primaryDeg: p.primary_deg[i]!,
    secondaryDeg: p.secondary_deg[i]!,
    toolMm: p.tool_mm[i]!,
  }));
  return {
    /** Every step-th pose is drawn, of `total`. */
    step,
    total: p.row.length,
    viewer: {
      errors: fittedErrors(shown.analysis.result.fit.parameters),
      poses,
      residualsUm: indices.map((i) => p.residual_um[i]!),
      shown: fitLabel(shown, phaseOf),
      overlay: other
        ? { ...fitLabel(other, phaseOf), errors: fittedErrors(other.analysis.result.fit.parameters) }
        : null,
    },
  };
}
