"use client";

import { useFormContext, useWatch } from "react-hook-form";
import { FieldError, inputClass } from "@/components/ui/field";
import {
  axisLettersFor,
  type BuilderHeadJudging,
  type BuilderPositioningLimit,
  type HeadModelAxes,
} from "@/components/procedures/builder-values";
import {
  HEAD_AXIS_ROLES,
  POSITIONING_QUANTITY_WORDS,
  type HeadAxisRole,
  type PositioningQuantity,
} from "@/lib/domain/positioning";
import { LimitsTable, SourceCells } from "@/components/procedures/limit-cells";

const POSITIONING_COLUMNS: readonly [string, string][] = [
  ["Quantity", ""],
  ["Upper limit (″)", "w-28"],
  ["Source", "w-48"],
  ["Note on the source", ""],
];

const AXIS_HEADINGS: Record<HeadAxisRole, string> = {
  primary: "Primary (rotary) axis",
  secondary: "Secondary (tilt) axis",
};

/**
 * The ISO 230-2 positioning limits: one table per rotary axis of the head, one row per quantity.
 * A procedure with any limit for an axis asks for that axis's positioning test before issue.
 */
export function PositioningLimitsFields({ headAxes }: { headAxes: readonly HeadModelAxes[] }) {
  const form = useFormContext<BuilderHeadJudging>();
  const rows = (useWatch({ name: "positioningLimits" }) as BuilderPositioningLimit[] | undefined) ?? [];
  const headModel = useWatch({ name: "headModel" }) as string | undefined;
  const letters = axisLettersFor(headAxes, headModel);
  return (
    <fieldset className="rounded-card border border-graphite-200 p-4">
      <legend className="px-1 font-medium">Positioning of the rotary axes (ISO 230-2)</legend>
      <p className="text-xs text-graphite-600">
        Upper limits in arc seconds for the bidirectional figures of the standard. Leave a limit empty for a
        figure that is recorded, not judged. Any limit for an axis makes its positioning test part of the job
        before the report is issued.
        {letters ? ` The axis letters are those of the register's heads of model ${headModel!.trim()}.` : ""}
      </p>
      <div className="mt-2 grid gap-4">
        {HEAD_AXIS_ROLES.map((axis) => (
          <div key={axis}>
            <h3 className="text-sm font-semibold">
              {AXIS_HEADINGS[axis]}
              {letters ? ` ${letters[axis]}` : ""}
            </h3>
            <LimitsTable
              caption={`Positioning limits, ${AXIS_HEADINGS[axis].toLowerCase()}`}
              columns={POSITIONING_COLUMNS}
            >
              {rows.map((r, i) => {
                if (r.axis !== axis) return null;
                const q = r.quantity as PositioningQuantity;
                const words = `${AXIS_HEADINGS[axis]}, ${q}`;
                const at = (f: keyof BuilderPositioningLimit) => `positioningLimits.${i}.${f}` as const;
                return (
                  <tr key={`${axis}-${q}`} className="border-t border-graphite-100 align-top">
                    <th scope="row" className="py-2 pr-2 text-left font-normal">
                      {POSITIONING_QUANTITY_WORDS[q]} ({q})
                      {(["upper", "quantity", "limitSource", "limitSourceNote"] as const).map((f) => (
                        <FieldError key={f} name={at(f)} className="text-xs" />
                      ))}
                    </th>
                    <td className="px-1 py-1">
                      <input
                        aria-label={`${words}: upper limit in arc seconds`}
                        className={`${inputClass} num text-right text-sm`}
                        inputMode="decimal"
                        autoComplete="off"
                        {...form.register(at("upper"))}
                      />
                    </td>
                    <SourceCells words={words} source={at("limitSource")} note={at("limitSourceNote")} />
                  </tr>
                );
              })}
            </LimitsTable>
          </div>
        ))}
      </div>
    </fieldset>
  );
}
