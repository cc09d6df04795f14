"use client";

/**
 * A multi-point step's points, in the order they are read (clock positions or equal points, with
 * buttons that fill the usual sets), and which value is judged from them.
 */
import { useState } from "react";
import { useFormContext } from "react-hook-form";
import type { BuilderValues } from "@/components/procedures/builder-values";
import { Button } from "@/components/ui/button";
import { closedSetOptions, Field, inputClass, OptionList } from "@/components/ui/field";
import {
  CLOCK_POINTS_4,
  CLOCK_POINTS_8,
  MULTI_POINT_RESULT_LABELS,
  MULTI_POINT_RESULTS,
} from "@/lib/domain/procedures";
import { equalPoints } from "@/lib/validations/procedures";

const POINT_RESULT_OPTIONS = closedSetOptions(MULTI_POINT_RESULTS, MULTI_POINT_RESULT_LABELS);

export function PointsFields({ index: i }: { index: number }) {
  const form = useFormContext<BuilderValues>();
  const [n, setN] = useState("6");
  const set = (pts: readonly string[]) =>
    form.setValue(`steps.${i}.points`, pts.join(", "), { shouldDirty: true, shouldValidate: true });
  return (
    <>
      <div className="space-y-2 md:col-span-2">
        <Field
          name={`steps.${i}.points`}
          label="Points, in the order they are read"
          hint="Clock positions seen from the front of the machine, or equal points P1 … PN."
        >
          <input className={inputClass} autoComplete="off" />
        </Field>
        <div className="flex flex-wrap items-end gap-2">
          <Button type="button" variant="secondary" onClick={() => set(CLOCK_POINTS_4)}>
            12 · 3 · 6 · 9
          </Button>
          <Button type="button" variant="secondary" onClick={() => set(CLOCK_POINTS_8)}>
            Eight clock positions
          </Button>
          <label className="text-sm">
            <span className="block text-graphite-700">Equal points</span>
            <input
              className={`${inputClass} num w-24`}
              inputMode="numeric"
              value={n}
              onChange={(e) => setN(e.target.value)}
              aria-label={`Number of equal points for step ${i + 1}`}
            />
          </label>
          <Button
            type="button"
            variant="secondary"
            onClick={() => {
              const k = Math.round(Number(n));
              if (k >= 2 && k <= 24) set(equalPoints(k));
            }}
          >
            Use equal points
          </Button>
        </div>
      </div>
      <Field name={`steps.${i}.pointResult`} label="Value judged from the points">
        <select className={inputClass}>
          <OptionList options={POINT_RESULT_OPTIONS} />
        </select>
      </Field>
    </>
  );
}
