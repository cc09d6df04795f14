"use client";

/**
 * The part of the procedure builder that judges the head as a whole rather than one step: the
 * tool-centre-point check after compensation (asked for or not, its limits in µm and where they
 * come from), the limits of the fitted head parameters (µm or arc seconds as each says) and the
 * upper limits of the ISO 230-2 positioning quantities of each rotary axis (arc seconds).
 * Checked by the same schema as the API (lib/validations/procedures.ts).
 */
import { useFormContext, useWatch } from "react-hook-form";
import {
  closedSetOptions,
  Field,
  FieldError,
  inputClass,
  OptionList,
  TextField,
} from "@/components/ui/field";
import { DECISION_RULE_WORDS, DECISION_RULES } from "@/lib/domain/decisions";
import {
  type BuilderHeadJudging,
  type BuilderParameterLimit,
  type HeadModelAxes,
} from "@/components/procedures/builder-values";
import { headParameterUnit } from "@/geometry/head/config";
import { PARAMETER_WORDS } from "@/lib/fit-display";
import { LIMIT_COLUMNS, LimitsTable, SourceCells, SourceSelect } from "@/components/procedures/limit-cells";
import { PositioningLimitsFields } from "@/components/procedures/positioning-limit-fields";

/** The TCP check's two limits, in µm: field and label. */
const TCP_LIMITS = [
  ["tcpRangeLimitUm", "Range of the centre in X, Y and Z, each (µm)"],
  ["tcpDeviationLimitUm", "Largest distance from the mean centre (µm)"],
] as const;

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
        {TCP_LIMITS.map(([name, label]) => (
          <TextField key={name} name={name} label={label} hint="Empty: recorded, not judged." decimal />
        ))}
        <Field name="tcpLimitSource" label="Where the TCP limits come from">
          <SourceSelect />
        </Field>
        <TextField
          name="tcpLimitSourceNote"
          label="TCP source note"
          hint="The standard and clause, the maker's document, or why it is common practice."
          autoComplete="off"
        />
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
                    <OptionList options={closedSetOptions(DECISION_RULES, DECISION_RULE_WORDS)} />
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
