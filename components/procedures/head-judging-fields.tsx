"use client";

/**
 * The part of the procedure builder that judges the head as a whole rather than one step: the
 * tool-centre-point check after compensation (asked for or not, its limits in µm and where they
 * come from), the limits of the fitted head parameters (µm or arc seconds as each says) and the
 * upper limits of the ISO 230-2 positioning quantities of each rotary axis (arc seconds).
 * Checked by the same schema as the API (lib/validations/procedures.ts).
 */
import { useFormContext, useWatch } from "react-hook-form";
import { Field, FieldError, inputClass } from "@/components/ui/field";
import {
  axisLettersFor,
  type BuilderHeadJudging,
  type BuilderParameterLimit,
  type BuilderPositioningLimit,
  type HeadModelAxes,
} from "@/components/procedures/builder-values";
import { headParameterUnit } from "@/geometry/head/config";
import { PARAMETER_WORDS } from "@/lib/fit-display";
import {
  HEAD_AXIS_ROLES,
  POSITIONING_QUANTITY_WORDS,
  type HeadAxisRole,
  type PositioningQuantity,
} from "@/lib/domain/positioning";
import { LIMIT_SOURCE_LABELS, LIMIT_SOURCES } from "@/lib/validations/procedures";

function SourceSelect({
  label,
  ...props
}: React.SelectHTMLAttributes<HTMLSelectElement> & { label?: string }) {
  return (
    <select aria-label={label} className={`${inputClass} text-sm`} {...props}>
      <option value="">Choose…</option>
      {LIMIT_SOURCES.map((s) => (
        <option key={s} value={s}>
          {LIMIT_SOURCE_LABELS[s]}
        </option>
      ))}
    </select>
  );
}

/** The head-parameter limits table's columns: heading and width. */
const LIMIT_COLUMNS: readonly [string, string][] = [
  ["Parameter", ""],
  ["Lower", "w-24"],
  ["Upper", "w-24"],
  ["Rule", "w-28"],
  ["Source", "w-48"],
  ["Note on the source", ""],
];

/** A compact limits table: its caption for screen readers, its column headings, and its rows. */
function LimitsTable({
  caption,
  columns,
  children,
}: {
  caption: string;
  columns: readonly (readonly [string, string])[];
  children: React.ReactNode;
}) {
  return (
    <div className="mt-2 overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="text-left text-graphite-600">
          <tr>
            {columns.map(([label, width], i) => (
              <th
                key={label}
                scope="col"
                className={[i ? "px-1" : "py-1 pr-2", width, "font-medium"].filter(Boolean).join(" ")}
              >
                {label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}

/** One source cell and one note cell of a limits row, with the row's words in their labels. */
function SourceCells({ words, source, note }: { words: string; source: string; note: string }) {
  const form = useFormContext();
  return (
    <>
      <td className="px-1 py-1">
        <SourceSelect label={`${words}: limit source`} {...form.register(source)} />
      </td>
      <td className="px-1 py-1">
        <input
          aria-label={`${words}: note on the source`}
          className={`${inputClass} text-sm`}
          autoComplete="off"
          {...form.register(note)}
        />
      </td>
    </>
  );
}

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
function PositioningLimitsFields({ headAxes }: { headAxes: readonly HeadModelAxes[] }) {
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

export function HeadJudgingFields({ headAxes = [] }: { headAxes?: readonly HeadModelAxes[] }) {
  const form = useFormContext<BuilderHeadJudging>();
  const rows = (useWatch({ name: "parameterLimits" }) as BuilderParameterLimit[] | undefined) ?? [];
  return (
    <section aria-labelledby="head-judging" className="space-y-4 border-t border-graphite-200 pt-4">
      <div>
        <h2 id="head-judging" className="text-lg font-semibold">
          Judging the head as a whole
        </h2>
        <p className="text-sm text-graphite-600">
          Beyond the steps: the check of the tool centre point after the values are entered in the control,
          the limits of the fitted head parameters and the positioning limits of the rotary axes. Every limit
          says where it comes from.
        </p>
      </div>
      <fieldset className="grid gap-4 rounded-card border border-graphite-200 p-4 md:grid-cols-2">
        <legend className="px-1 font-medium">Tool-centre-point check</legend>
        <label className="flex min-h-touch items-center gap-2 text-sm md:col-span-2">
          <input type="checkbox" className="size-5" {...form.register("tcpCheckRequired")} />
          Ask for a TCP check after compensation before the report is issued
        </label>
        <Field
          name="tcpRangeLimitUm"
          label="Range of the centre in X, Y and Z, each (µm)"
          hint="Empty: recorded, not judged."
        >
          <input className={`${inputClass} num`} inputMode="decimal" autoComplete="off" />
        </Field>
        <Field
          name="tcpDeviationLimitUm"
          label="Largest distance from the mean centre (µm)"
          hint="Empty: recorded, not judged."
        >
          <input className={`${inputClass} num`} inputMode="decimal" autoComplete="off" />
        </Field>
        <Field name="tcpLimitSource" label="Where the TCP limits come from">
          <SourceSelect />
        </Field>
        <Field
          name="tcpLimitSourceNote"
          label="TCP source note"
          hint="The standard and clause, the maker's document, or why it is common practice."
        >
          <input className={inputClass} autoComplete="off" />
        </Field>
      </fieldset>
      <fieldset className="rounded-card border border-graphite-200 p-4">
        <legend className="px-1 font-medium">Limits for the fitted head parameters</legend>
        <p className="text-xs text-graphite-600">
          Lengths in µm, angles in arc seconds. Leave both limits empty for a parameter that is recorded, not
          judged.
        </p>
        <LimitsTable caption="Limits for the fitted head parameters" columns={LIMIT_COLUMNS}>
          {rows.map((r, i) => {
            const words = PARAMETER_WORDS[r.parameter];
            const at = (f: keyof BuilderParameterLimit) => `parameterLimits.${i}.${f}` as const;
            const errors = ["lower", "upper", "limitSource", "limitSourceNote"] as const;
            return (
              <tr key={r.parameter} className="border-t border-graphite-100 align-top">
                <th scope="row" className="py-2 pr-2 text-left font-normal">
                  {words}
                  <span className="block text-xs text-graphite-500">
                    in {headParameterUnit(r.parameter) === "um" ? "µm" : "arc seconds"}
                  </span>
                  {errors.map((f) => (
                    <FieldError key={f} name={at(f)} className="text-xs" />
                  ))}
                </th>
                {(["lower", "upper"] as const).map((w) => (
                  <td key={w} className="px-1 py-1">
                    <input
                      aria-label={`${words}: ${w} limit`}
                      className={`${inputClass} num text-right text-sm`}
                      inputMode="decimal"
                      autoComplete="off"
                      {...form.register(at(w))}
                    />
                  </td>
                ))}
                <td className="px-1 py-1">
                  <select
                    aria-label={`${words}: decision rule`}
                    className={`${inputClass} text-sm`}
                    {...form.register(at("decisionRule"))}
                  >
                    <option value="simple">Simple</option>
                    <option value="guarded">Guarded</option>
                  </select>
                </td>
                <SourceCells words={words} source={at("limitSource")} note={at("limitSourceNote")} />
              </tr>
            );
          })}
        </LimitsTable>
      </fieldset>
      <PositioningLimitsFields headAxes={headAxes} />
    </section>
  );
}
