import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { StatusButtons, UnitToggle } from "@/components/checklist/job-actions";
import { StepPanel } from "@/components/checklist/step-panel";
import { DecisionBadge, LIMIT_SOURCE_LABELS } from "@/components/readings/decision-badge";
import { SafetyNote } from "@/components/ui/safety-note";
import { getChecklist } from "@/db/queries/readings";
import { getUnitSystem } from "@/db/queries/user-prefs";
import { STATUS_LABELS, type JobStatus } from "@/lib/domain/jobs";
import { allowedTransitions } from "@/lib/policy/jobs";
import { requirePageUser } from "@/lib/auth/session";
import { expandedUncertainty, judge } from "@/lib/checklist";
import { formatLimits } from "@/lib/units";

export const metadata: Metadata = { title: "Checklist" };

type Props = { params: Promise<{ id: string }> };

const MOVE_LABELS: Partial<Record<JobStatus, string>> = {
  measuring: "Start measuring",
  in_review: "Submit for review",
};

/** A short title for a step's caution, from what the note is about. */
function safetyTitle(note: string): string {
  const n = note.toLowerCase();
  if (n.includes("lift")) return "Lifting the head and pinch points";
  if (n.includes("lock out")) return "Lock out before working on the spindle";
  if (n.includes("spindle rotates")) return "Cutting with the spindle running";
  if (n.includes("axes move")) return "Axes move while you indicate";
  return "Caution";
}

export default async function ChecklistPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser(`/jobs/${id}/checklist`);
  const [c, unitSystem] = await Promise.all([getChecklist(user, id), getUnitSystem(user)]);
  if (!c) notFound();
  const { detail, template, steps, readings, instruments, refusal } = c;
  const canWrite = refusal === null;
  const today = new Date().toISOString().slice(0, 10);
  const moves = allowedTransitions(user, detail.job)
    .filter((to) => MOVE_LABELS[to])
    .map((to) => ({ to, label: MOVE_LABELS[to]! }));

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h2 className="text-xl font-semibold">Procedure checklist</h2>
          <p className="text-sm text-graphite-600">
            {template ? (
              <>
                {template.name}, version <span className="num">{template.version}</span> · values stored in mm
                and arc seconds, shown in{" "}
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
            className="flex min-h-touch items-center rounded-md border border-graphite-300 bg-white px-4 text-sm font-medium hover:bg-graphite-100"
          >
            Compare before and after
          </Link>
          <StatusButtons jobId={id} moves={moves} />
        </div>
      </div>
      {!canWrite ? (
        <p
          className="rounded-md border border-graphite-200 bg-white px-4 py-3 text-sm text-graphite-700"
          data-testid="readings-locked"
        >
          {refusal} Job status: {STATUS_LABELS[detail.job.status]}.
        </p>
      ) : null}
      <ol className="space-y-6">
        {steps.map((s) => {
          const mine = readings.filter((r) => r.stepId === s.id);
          const current = [...mine].reverse();
          const latest = (p: "pre" | "post") => current.find((r) => r.phase === p && !r.supersededById);
          const final = latest("post") ?? latest("pre");
          const finalDecision = final
            ? judge(s, final.value, expandedUncertainty(s, final.instrumentStdU))
            : "not_measured";
          return (
            <li
              key={s.id}
              id={`step-${s.position}`}
              className="rounded-card border border-graphite-200 bg-white shadow-sm"
              data-testid={`step-${s.position}`}
            >
              <header className="flex flex-wrap items-start justify-between gap-3 border-b border-graphite-100 px-5 py-4">
                <div className="min-w-0 flex-1">
                  <p className="text-sm text-graphite-500">
                    Step <span className="num">{s.position}</span>
                  </p>
                  <h3 className="text-lg font-semibold">{s.title}</h3>
                  {s.instructions ? (
                    <p className="mt-1 max-w-3xl text-sm text-graphite-700">{s.instructions}</p>
                  ) : null}
                </div>
                <div className="space-y-1 text-right">
                  <p className="text-sm text-graphite-600">{s.quantity}</p>
                  <p className="num text-base font-semibold" data-testid={`limits-${s.position}`}>
                    {formatLimits(s.lowerLimit, s.upperLimit, s.quantityKind, unitSystem)}
                  </p>
                  <p className="text-xs text-graphite-500" title={s.limitSourceNote ?? undefined}>
                    Limit: {LIMIT_SOURCE_LABELS[s.limitSource]} ·{" "}
                    {s.decisionRule === "guarded" ? "guarded acceptance (ISO 14253-1)" : "simple acceptance"}
                  </p>
                  <DecisionBadge decision={finalDecision} />
                </div>
              </header>
              <div className="space-y-4 p-5">
                {s.safetyNote ? (
                  <SafetyNote title={safetyTitle(s.safetyNote)}>
                    <p>{s.safetyNote}</p>
                  </SafetyNote>
                ) : null}
                {s.limitSourceNote ? <p className="text-xs text-graphite-500">{s.limitSourceNote}</p> : null}
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
                  }}
                  readings={mine.map((r) => ({
                    id: r.id,
                    phase: r.phase,
                    value: r.value,
                    enteredValue: r.enteredValue,
                    enteredUnit: r.enteredUnit,
                    decision: judge(s, r.value, expandedUncertainty(s, r.instrumentStdU)),
                    instrumentSerial: r.instrumentSerial,
                    takenAt: r.takenAt.toISOString(),
                    note: r.note,
                    recordedByName: r.recordedByName,
                    supersededById: r.supersededById,
                  }))}
                  unitSystem={unitSystem}
                  instruments={instruments.map((i) => ({
                    id: i.id,
                    kind: i.kind,
                    serial: i.serial,
                    quantityKind: i.quantityKind,
                    calibrationDueOn: i.calibrationDueOn,
                    standardUncertainty: i.standardUncertainty,
                  }))}
                  canWrite={canWrite}
                  today={today}
                />
              </div>
            </li>
          );
        })}
      </ol>
    </div>
  );
}
