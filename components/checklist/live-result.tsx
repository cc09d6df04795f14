"use client";

import { DecisionBadge } from "@/components/readings/decision-badge";
import type { StepDecision } from "@/lib/checklist";
import { MULTI_POINT_SHORT, type KindStep } from "@/lib/step-kinds";
import { arcsecToUmPerM, formatValue, type UnitSystem } from "@/lib/units";

/** What the entry gives as it is typed: the decision and derived value, or what still stops the save. */
export function LiveResult({
  id,
  step,
  live,
  blocked,
  typed,
  unitSystem,
}: {
  id: string;
  step: KindStep & { position: number };
  live: { value: number; decision: StepDecision; error: string | null } | null;
  blocked: string | null;
  /** Whether a single value has been typed yet (a hint rather than a complaint before). */
  typed: boolean;
  unitSystem: UnitSystem;
}) {
  const kind = step.derivation;
  return (
    <div
      id={id}
      aria-live="polite"
      className="flex min-h-touch flex-1 flex-wrap items-center gap-3"
      data-testid={`live-${step.position}`}
    >
      {live?.error ? (
        <span className="text-sm text-fail-700">{live.error}</span>
      ) : live ? (
        <>
          <DecisionBadge decision={live.decision} size="lg" />
          {kind === "multi_point" ? (
            <span className="num text-graphite-700">
              {MULTI_POINT_SHORT[step.pointResult ?? "tir"]} ={" "}
              {formatValue(live.value, step.quantityKind, unitSystem)}
            </span>
          ) : null}
          {kind === "angle_over_distance" ? (
            <span className="num text-graphite-700">
              = {formatValue(live.value, "angle", unitSystem)} ({arcsecToUmPerM(live.value).toFixed(1)} µm/m)
            </span>
          ) : null}
          {blocked ? <span className="text-sm text-graphite-600">{blocked}</span> : null}
        </>
      ) : (
        <span className="text-sm text-graphite-500">
          {blocked && (typed || kind === "multi_point")
            ? blocked
            : kind === "check"
              ? "Answer yes or no."
              : kind === "note"
                ? "Write the note."
                : kind === "record"
                  ? "Kept for the record; not judged."
                  : "Enter a value to see pass or fail against the limits."}
        </span>
      )}
    </div>
  );
}
