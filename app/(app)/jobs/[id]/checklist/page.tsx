import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { StatusButtons, UnitToggle } from "@/components/checklist/job-actions";
import { EnvironmentPanel } from "@/components/checklist/environment-form";
import { StepCaution } from "@/components/checklist/step-caution";
import { StepPanel } from "@/components/checklist/step-panel";
import { StepAccordion, StepJumpList, StepShell, type StepLine } from "@/components/checklist/step-shell";
import { SubmitForReview } from "@/components/checklist/submit-review";
import { LIMIT_SOURCE_LABELS } from "@/lib/domain/procedures";
import { KeepJobOffline } from "@/components/readings/keep-offline";
import { ReadingQueueProvider } from "@/components/readings/queue-provider";
import { QueueStatus } from "@/components/readings/queue-status";
import { listEnvironment } from "@/db/queries/environment";
import { listPhotos } from "@/db/queries/photos";
import { getChecklist } from "@/db/queries/readings";
import { getUnitSystem } from "@/db/queries/user-prefs";
import { STATUS_LABELS, type JobStatus } from "@/lib/domain/jobs";
import { allowedTransitions } from "@/lib/policy/jobs";
import { requirePageUser } from "@/lib/auth/session";
import { cautionOf, expandedUncertainty, judge } from "@/lib/checklist";
import { shownValue } from "@/lib/step-kinds";
import { formatLimits } from "@/lib/units";

export const metadata: Metadata = { title: "Checklist" };

type Props = { params: Promise<{ id: string }> };

const MOVE_LABELS: Partial<Record<JobStatus, string>> = {
  measuring: "Start measuring",
};

export default async function ChecklistPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser(`/jobs/${id}/checklist`);
  const [c, unitSystem, photos, environment] = await Promise.all([
    getChecklist(user, id),
    getUnitSystem(user),
    listPhotos(user, id),
    listEnvironment(user, id),
  ]);
  if (!c) notFound();
  const { detail, template, steps, readings, instruments, refusal } = c;
  const canWrite = refusal === null;
  const today = new Date().toISOString().slice(0, 10);
  const allowed = allowedTransitions(user, detail.job);
  const mayMove = (to: JobStatus) => allowed.includes(to);
  // Submitting for review goes through its own summary (SubmitForReview), never a bare button.
  const moves = (["measuring"] as const).filter(mayMove).map((to) => ({ to, label: MOVE_LABELS[to]! }));
  const rows = steps.map((s) => {
    const mine = readings.filter((r) => r.stepId === s.id);
    const current = [...mine].reverse();
    const latest = (p: "pre" | "post") => current.find((r) => r.phase === p && !r.supersededById);
    const final = latest("post") ?? latest("pre");
    const line: StepLine = {
      position: s.position,
      stepId: s.id,
      title: s.title,
      decision: final ? judge(s, final.value, expandedUncertainty(s, final.instrumentStdU)) : "not_measured",
      value: final ? shownValue(s, final, unitSystem) : null,
      by: final?.recordedByName ?? null,
      at: final ? final.takenAt.toISOString() : null,
    };
    return { s, mine, line };
  });
  const lines = rows.map((r) => r.line);
  const nextToMeasure =
    lines.find((l) => l.decision === "not_measured")?.position ?? lines[0]?.position ?? null;

  return (
    <ReadingQueueProvider jobId={id} userId={user.id}>
      <StepAccordion first={canWrite ? nextToMeasure : null}>
        <div className="space-y-4">
          <div className="flex flex-wrap items-end justify-between gap-4">
            <div className="min-w-0">
              <h2 className="text-xl font-semibold">Procedure checklist</h2>
              <p className="text-sm text-graphite-600">
                {template ? (
                  <>
                    {template.name}, version <span className="num">{template.version}</span> · shown in{" "}
                    {unitSystem === "inch" ? "inch (to 0.0001 in)" : "millimetres (to 0.001 mm)"}
                  </>
                ) : (
                  "This job has no procedure yet."
                )}
              </p>
            </div>
            <div className="flex flex-wrap items-center gap-3">
              <UnitToggle current={unitSystem} path={`/jobs/${id}/checklist`} />
              <Link
                href={`/jobs/${id}/compare`}
                className="flex min-h-touch items-center whitespace-nowrap rounded-md border border-graphite-300 bg-white px-4 text-sm font-medium hover:bg-graphite-100"
              >
                Compare before and after
              </Link>
              <StatusButtons jobId={id} moves={moves} />
              {mayMove("in_review") ? (
                <SubmitForReview
                  jobId={id}
                  unmeasured={lines.filter((l) => l.decision === "not_measured").map((l) => l.position)}
                  fails={lines.filter((l) => l.decision === "fail").map((l) => l.position)}
                  missingPhotos={steps
                    .filter((s) => s.photoRequired && !photos.some((p) => p.stepId === s.id))
                    .map((s) => s.position)}
                />
              ) : null}
            </div>
          </div>
          {canWrite ? <QueueStatus /> : null}
          <KeepJobOffline jobId={id} photoThumbs={photos.map((p) => p.thumbUrl)} />
          {!canWrite ? (
            <p
              className="rounded-md border border-graphite-200 bg-white px-4 py-3 text-sm text-graphite-700"
              data-testid="readings-locked"
            >
              {refusal} Job status: {STATUS_LABELS[detail.job.status]}.
            </p>
          ) : null}
          <EnvironmentPanel jobId={id} records={environment ?? []} canWrite={canWrite} />
          <StepJumpList lines={lines} />
          <ol className="space-y-3">
            {rows.map(({ s, mine, line }) => (
              <StepShell key={s.id} line={line}>
                <div className="space-y-4 p-4">
                  <div className="flex flex-wrap items-start justify-between gap-3">
                    <div className="min-w-0 flex-1 basis-72">
                      {s.instructions ? <p className="text-sm text-graphite-700">{s.instructions}</p> : null}
                    </div>
                    <div className="space-y-1 text-right">
                      <p className="text-sm text-graphite-600">{s.quantity}</p>
                      <p className="num text-base font-semibold" data-testid={`limits-${s.position}`}>
                        {s.derivation === "check"
                          ? "Expected: yes"
                          : s.derivation === "record"
                            ? `For the record${s.recordUnit ? ` (${s.recordUnit})` : ""}`
                            : s.derivation === "note"
                              ? "Not judged"
                              : formatLimits(s.lowerLimit, s.upperLimit, s.quantityKind, unitSystem)}
                      </p>
                      <p className="text-xs text-graphite-500" title={s.limitSourceNote ?? undefined}>
                        Limit: {LIMIT_SOURCE_LABELS[s.limitSource]} ·{" "}
                        {s.decisionRule === "guarded"
                          ? "guarded acceptance (ISO 14253-1)"
                          : "simple acceptance"}
                      </p>
                    </div>
                  </div>
                  {s.safetyNote ? (
                    <StepCaution id={s.id} text={s.safetyNote} {...cautionOf(s.safetyNote)} />
                  ) : null}
                  {s.limitSourceNote ? (
                    <p className="text-xs text-graphite-500">{s.limitSourceNote}</p>
                  ) : null}
                  <StepPanel
                    jobId={id}
                    step={{
                      id: s.id,
                      position: s.position,
                      title: s.title,
                      quantity: s.quantity,
                      quantityKind: s.quantityKind,
                      derivation: s.derivation,
                      distanceMm: s.distanceMm,
                      lowerLimit: s.lowerLimit,
                      upperLimit: s.upperLimit,
                      decisionRule: s.decisionRule,
                      points: s.points,
                      pointResult: s.pointResult,
                      recordUnit: s.recordUnit,
                      photoRequired: s.photoRequired,
                    }}
                    readings={mine.map((r) => ({
                      id: r.id,
                      phase: r.phase,
                      value: r.value,
                      enteredValue: r.enteredValue,
                      enteredUnit: r.enteredUnit,
                      inputs: r.inputs,
                      textValue: r.textValue,
                      decision: judge(s, r.value, expandedUncertainty(s, r.instrumentStdU)),
                      instrumentId: r.instrumentId,
                      instrumentSerial: r.instrumentSerial,
                      takenAt: r.takenAt.toISOString(),
                      note: r.note,
                      recordedByName: r.recordedByName,
                      supersededById: r.supersededById,
                    }))}
                    photos={photos.filter((p) => p.stepId === s.id)}
                    unitSystem={unitSystem}
                    instruments={instruments.map((i) => ({
                      id: i.id,
                      kind: i.kind,
                      serial: i.serial,
                      quantityKind: i.quantityKind,
                      calibrationDueOn: i.calibrationDueOn,
                      standardUncertainty: i.standardUncertainty,
                      resolution: i.resolution,
                      rangeMin: i.rangeMin,
                      rangeMax: i.rangeMax,
                    }))}
                    canWrite={canWrite}
                    today={today}
                  />
                </div>
              </StepShell>
            ))}
          </ol>
        </div>
      </StepAccordion>
    </ReadingQueueProvider>
  );
}
