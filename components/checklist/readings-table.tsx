"use client";

import { ScrollRegion } from "@/components/ui/scroll-region";
import { DecisionBadge } from "@/components/readings/decision-badge";
import { LocalTime } from "@/components/readings/local-time";
import type { StepDecision } from "@/lib/checklist";
import { shownPoints, shownValue, type KindStep } from "@/lib/step-kinds";
import type { QueuedReading } from "@/lib/readings-queue";
import type { UnitSystem } from "@/lib/units";
import { PHASE_LABELS } from "@/lib/domain/datasets";

export interface PanelReading {
  id: string;
  phase: "pre" | "post";
  value: number;
  enteredValue: number;
  enteredUnit: string;
  inputs: unknown;
  textValue: string | null;
  decision: StepDecision;
  instrumentId: string | null;
  instrumentSerial: string | null;
  takenAt: string;
  note: string | null;
  recordedByName: string | null;
  supersededById: string | null;
}

/** What a correction replaces: a stored reading (by id) or one still waiting on this tablet (by clientId). */
export type CorrectionTarget =
  | { kind: "stored"; id: string; phase: "pre" | "post"; shown: string }
  | { kind: "queued"; clientId: string; phase: "pre" | "post"; shown: string };

const btn =
  "min-h-touch rounded-md border border-graphite-300 bg-white px-3 font-medium text-graphite-800 hover:bg-graphite-100";
const th = "py-2 pr-3 font-medium";
/** The table's columns before the actions, with the value right-aligned. */
const COLUMNS = [
  ["Phase", ""],
  ["Value", "text-right"],
  ["Result", ""],
  ["Instrument", ""],
  ["Taken", ""],
  ["By", ""],
  ["Note", ""],
] as const;

/** The step's readings: those stored on the server, then those still on this tablet. */
export function ReadingsTable({
  readings,
  queued,
  step,
  position,
  unitSystem,
  canWrite,
  onCorrect,
  onEdit,
  onDiscard,
}: {
  readings: PanelReading[];
  queued: QueuedReading[];
  step: KindStep;
  position: number;
  unitSystem: UnitSystem;
  canWrite: boolean;
  onCorrect: (t: CorrectionTarget) => void;
  onEdit: (q: QueuedReading) => void;
  onDiscard: (q: QueuedReading) => void;
}) {
  // A note's text wraps like prose; numbers stay on one line, right-aligned.
  const valueCls =
    step.derivation === "note" ? "min-w-48 whitespace-normal text-left" : "num whitespace-nowrap text-right";
  if (readings.length === 0 && queued.length === 0)
    return <p className="text-sm text-graphite-500">No readings yet.</p>;
  return (
    <ScrollRegion label={`Readings of step ${position}, table`}>
      <table className="w-full text-sm">
        <caption className="sr-only">Readings of step {position}</caption>
        <thead className="text-left text-graphite-600">
          <tr className="border-b border-graphite-200">
            {COLUMNS.map(([label, align]) => (
              <th key={label} scope="col" className={align ? `${th} ${align}` : th}>
                {label}
              </th>
            ))}
            {canWrite ? (
              <th scope="col" className="py-2 font-medium">
                <span className="sr-only">Actions</span>
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody className="divide-y divide-graphite-100">
          {readings.map((r) => {
            const old = Boolean(r.supersededById);
            const shown = shownValue(step, r, unitSystem);
            const points = shownPoints(r, step.points);
            return (
              <tr
                key={r.id}
                className={old ? "text-graphite-500" : ""}
                data-superseded={old ? "true" : undefined}
              >
                <td className="py-2 pr-3">{PHASE_LABELS[r.phase]}</td>
                <td className={`py-2 pr-3 ${valueCls} ${old ? "line-through" : "font-semibold"}`}>
                  {shown}
                  {step.derivation === "angle_over_distance" ? (
                    <span className="block text-xs font-normal text-graphite-500">
                      from {r.enteredValue} {r.enteredUnit}
                    </span>
                  ) : null}
                  {points ? (
                    <span
                      className="block max-w-56 whitespace-normal text-xs font-normal text-graphite-500"
                      data-testid="points"
                    >
                      {points}
                    </span>
                  ) : null}
                  {step.derivation === "record" && r.textValue ? (
                    <span className="block whitespace-normal text-xs font-normal text-graphite-600">
                      {r.textValue}
                    </span>
                  ) : null}
                </td>
                <td className="py-2 pr-3">
                  {old ? (
                    <span className="text-xs font-medium uppercase tracking-wide">Replaced</span>
                  ) : (
                    <DecisionBadge decision={r.decision} />
                  )}
                </td>
                <td className="num py-2 pr-3">{r.instrumentSerial ?? "—"}</td>
                <td className="py-2 pr-3">
                  <LocalTime at={r.takenAt} />
                </td>
                <td className="py-2 pr-3">{r.recordedByName ?? "—"}</td>
                <td className="py-2 pr-3">{r.note ?? ""}</td>
                {canWrite ? (
                  <td className="py-1 text-right">
                    {!old ? (
                      <button
                        type="button"
                        className={btn}
                        onClick={() => onCorrect({ kind: "stored", id: r.id, phase: r.phase, shown })}
                      >
                        Correct
                      </button>
                    ) : null}
                  </td>
                ) : null}
              </tr>
            );
          })}
          {queued.map((q) => (
            <tr key={q.clientId} data-queued={q.state} className="bg-accent-50/60">
              <td className="py-2 pr-3">{PHASE_LABELS[q.body.phase]}</td>
              <td className={`py-2 pr-3 font-semibold ${valueCls}`}>{q.shown.value}</td>
              <td className="py-2 pr-3">
                <span
                  className={`inline-flex whitespace-nowrap rounded px-2 py-0.5 text-xs font-semibold ring-1 ${q.state === "refused" ? "bg-fail-50 text-fail-700 ring-fail-600/40" : "bg-white text-graphite-800 ring-graphite-300"}`}
                >
                  {q.state === "refused" ? "Refused" : "Waiting to send"}
                </span>
              </td>
              <td className="num py-2 pr-3">{q.shown.instrument}</td>
              <td className="py-2 pr-3">
                <LocalTime at={q.shown.takenAt} />
              </td>
              <td className="py-2 pr-3">This tablet</td>
              <td className="py-2 pr-3">
                {q.shown.correcting ? "Correction. " : ""}
                {q.shown.note ?? ""}
                {q.reason ? (
                  <span
                    className={`block text-xs ${q.state === "refused" ? "text-fail-700" : "text-graphite-600"}`}
                    role={q.state === "refused" ? "alert" : undefined}
                  >
                    {q.reason}
                  </span>
                ) : null}
              </td>
              {canWrite ? (
                <td className="space-x-1 whitespace-nowrap py-1 text-right">
                  {q.photo ? null : q.state === "refused" ? (
                    <button type="button" className={btn} onClick={() => onEdit(q)}>
                      Edit
                    </button>
                  ) : (
                    <button
                      type="button"
                      className={btn}
                      onClick={() =>
                        onCorrect({
                          kind: "queued",
                          clientId: q.clientId,
                          phase: q.body.phase,
                          shown: q.shown.value,
                        })
                      }
                    >
                      Correct
                    </button>
                  )}
                  <button type="button" className={btn} onClick={() => onDiscard(q)}>
                    Discard
                  </button>
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollRegion>
  );
}
