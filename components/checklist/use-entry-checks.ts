"use client";

import { useMemo } from "react";
import { useWatch, type UseFormReturn } from "react-hook-form";
import type { PanelInstrument } from "@/components/checklist/entry-form";
import { entryProblem, expandedUncertainty, judge, resolutionDecimals } from "@/lib/checklist";
import { parseLocal, type EntryValues } from "@/lib/reading-entry";
import { rangeProblem, stepEntry, type KindStep } from "@/lib/step-kinds";
import { fromCanonical, type EntryUnit } from "@/lib/units";

/**
 * The checks an entry gets as it is typed, the same per-kind checks the server makes, so what the
 * tablet accepts the server stores: not a number, finer than the instrument reads, outside its
 * range, no instrument or time; and the live decision once the value is whole.
 */
export function useEntryChecks({
  form,
  step,
  instruments,
  withInstrument,
  entryUnit,
  travelUnit,
}: {
  form: UseFormReturn<EntryValues>;
  step: KindStep;
  instruments: readonly PanelInstrument[];
  withInstrument: boolean;
  entryUnit: EntryUnit;
  travelUnit: "in" | "mm";
}) {
  const kind = step.derivation;
  const isAngleFromReading = kind === "angle_over_distance";
  const pointNames = useMemo(() => step.points ?? [], [step.points]);
  const [value, travel, instrumentId, takenAtText, answer, pointValues, text] = useWatch({
    control: form.control,
    name: ["value", "travel", "instrumentId", "takenAt", "answer", "pointValues", "text"],
  });
  const takenAt = parseLocal(takenAtText);
  const instrument = withInstrument ? instruments.find((i) => i.id === instrumentId) : undefined;
  const pointsTyped = useMemo(
    () => Object.fromEntries(pointNames.map((p, i) => [p, String(pointValues?.[i] ?? "")])),
    [pointNames, pointValues],
  );

  // What is wrong as it is typed: not a number, or finer than the instrument reads.
  const decimals = instrument
    ? resolutionDecimals(fromCanonical(instrument.resolution, entryUnit))
    : Infinity;
  const pointProblems = useMemo(() => {
    const out: Record<string, string> = {};
    if (kind !== "multi_point") return out;
    for (const p of pointNames) {
      const m = entryProblem(pointsTyped[p] ?? "", decimals, instrument?.serial);
      if (m) out[p] = m;
    }
    return out;
  }, [kind, pointNames, pointsTyped, decimals, instrument]);
  const problem = useMemo(() => {
    if (kind === "check" || kind === "note") return null;
    if (kind === "multi_point") {
      const first = pointNames.find((p) => pointProblems[p]);
      return first ? `At ${first}: ${pointProblems[first]}` : null;
    }
    return entryProblem(String(value), kind === "record" ? Infinity : decimals, instrument?.serial);
  }, [kind, pointNames, pointProblems, value, decimals, instrument]);

  const outcome = useMemo(() => {
    const t = Number(String(travel).trim().replace(",", "."));
    const travelMm =
      isAngleFromReading && Number.isFinite(t) && t > 0 ? (travelUnit === "in" ? t * 25.4 : t) : null;
    return stepEntry(step, { value, unit: entryUnit, travelMm, answer, points: pointsTyped, text });
  }, [step, value, entryUnit, travel, isAngleFromReading, travelUnit, answer, pointsTyped, text]);

  const outside =
    outcome.ok && instrument
      ? rangeProblem(
          instrument,
          outcome.stored.instrumentReadings,
          kind === "multi_point" ? pointNames : null,
        )
      : null;
  const live = useMemo(() => {
    if (problem || !outcome.ok) return null;
    const U = expandedUncertainty(step, instrument?.standardUncertainty);
    const v = outcome.stored.value;
    return { value: v, decision: judge(step, v, U), error: null as string | null };
  }, [problem, outcome, step, instrument]);

  const blocked =
    withInstrument && !instrument
      ? "Choose the instrument used."
      : !takenAt
        ? "Write the time taken as YYYY-MM-DD HH:MM (24-hour)."
        : (problem ?? outside?.message ?? (outcome.ok ? null : outcome.problems[0]!.message));

  return { instrument, pointsTyped, pointProblems, problem, outcome, live, blocked };
}

/** Everything `useEntryChecks` works out for the form and its submit. */
export type EntryChecks = ReturnType<typeof useEntryChecks>;
