"use client";

import { ScrollRegion } from "@/components/ui/scroll-region";
import { createTemplateVersionAction } from "@/app/(app)/registers/actions";
import { FieldError, inputClass } from "@/components/ui/field";
import { Form } from "@/components/ui/form";

export interface EditableStep {
  position: number;
  title: string;
  kind: "length" | "angle";
  lower: string;
  upper: string;
  decisionRule: "simple" | "guarded";
  limitSource: string;
  limitSourceNote: string;
}

export interface EditableParameterLimit {
  key: string;
  words: string;
  unit: "µm" | "″";
  lower: string;
  upper: string;
  decisionRule: "simple" | "guarded";
  limitSource: string;
  limitSourceNote: string;
}

const SOURCES = [
  ["standard", "Standard"],
  ["maker_manual", "Maker's manual (as entered)"],
  ["common_practice", "Common practice"],
  ["customer_spec", "Customer specification"],
] as const;

const CELL = "min-h-touch w-full rounded-md border border-graphite-300 bg-white px-2 text-sm";

function LimitsHead({ first }: { first: string }) {
  return (
    <thead className="text-left text-graphite-600">
      <tr>
        <th className="py-2 pr-2 font-medium">{first}</th>
        <th className="py-2 pr-2 font-medium">Lower</th>
        <th className="py-2 pr-2 font-medium">Upper</th>
        <th className="py-2 pr-2 font-medium">Rule</th>
        <th className="py-2 pr-2 font-medium">Source of the limit</th>
        <th className="py-2 font-medium">Note on the source</th>
      </tr>
    </thead>
  );
}

/** The five editable cells of one limit: fields `${name}.lowerLimit` … `${name}.limitSourceNote`, labelled "`label` lower limit" etc. */
function LimitCells({
  name,
  label,
  lower,
  upper,
  decisionRule,
  limitSource,
  limitSourceNote,
}: {
  name: string;
  label: string;
  lower: string;
  upper: string;
  decisionRule: string;
  limitSource: string;
  limitSourceNote: string;
}) {
  return (
    <>
      <td className="w-28 py-2 pr-2">
        <input
          aria-label={`${label} lower limit`}
          name={`${name}.lowerLimit`}
          defaultValue={lower}
          inputMode="decimal"
          className={`${CELL} num text-right`}
        />
        <FieldError name={`${name}.lowerLimit`} className="text-xs" />
      </td>
      <td className="w-28 py-2 pr-2">
        <input
          aria-label={`${label} upper limit`}
          name={`${name}.upperLimit`}
          defaultValue={upper}
          inputMode="decimal"
          className={`${CELL} num text-right`}
        />
        <FieldError name={`${name}.upperLimit`} className="text-xs" />
      </td>
      <td className="w-32 py-2 pr-2">
        <select
          aria-label={`${label} decision rule`}
          name={`${name}.decisionRule`}
          defaultValue={decisionRule}
          className={CELL}
        >
          <option value="simple">Simple</option>
          <option value="guarded">Guarded</option>
        </select>
      </td>
      <td className="w-52 py-2 pr-2">
        <select
          aria-label={`${label} limit source`}
          name={`${name}.limitSource`}
          defaultValue={limitSource}
          className={CELL}
        >
          {SOURCES.map(([v, l]) => (
            <option key={v} value={v}>
              {l}
            </option>
          ))}
        </select>
      </td>
      <td className="py-2">
        <input
          aria-label={`${label} note on the source`}
          name={`${name}.limitSourceNote`}
          defaultValue={limitSourceNote}
          className={`${inputClass} text-sm`}
        />
      </td>
    </>
  );
}

/** Edit the limits of a procedure; saving makes a new version, and running jobs keep theirs. */
export function TemplateVersionForm({
  templateId,
  unit,
  steps,
  parameters = [],
}: {
  templateId: string;
  unit: "mm" | "in";
  steps: EditableStep[];
  parameters?: EditableParameterLimit[];
}) {
  return (
    <Form
      action={createTemplateVersionAction}
      submitLabel="Save as a new version"
      resetOnSuccess={false}
      successMessage="New version saved; jobs already started keep the version they began with."
    >
      <input type="hidden" name="templateId" value={templateId} />
      <input type="hidden" name="unit" value={unit} />
      <ScrollRegion label="Step limits, table">
        <table className="w-full text-sm">
          <LimitsHead first="Step" />
          <tbody className="divide-y divide-graphite-100">
            {steps.map((s) => (
              <tr key={s.position}>
                <td className="py-2 pr-2">
                  <span className="num text-graphite-500">{s.position}</span> {s.title}
                  <input type="hidden" name={`step.${s.position}.kind`} value={s.kind} />
                  <span className="block text-xs text-graphite-500">
                    in {s.kind === "angle" ? "arc seconds" : unit}
                  </span>
                </td>
                <LimitCells
                  name={`step.${s.position}`}
                  label={`Step ${s.position}`}
                  lower={s.lower}
                  upper={s.upper}
                  decisionRule={s.decisionRule}
                  limitSource={s.limitSource}
                  limitSourceNote={s.limitSourceNote}
                />
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollRegion>
      {parameters.length ? (
        <ScrollRegion label="Limits for the fitted head parameters, table" className="mt-4">
          <h4 className="text-sm font-semibold">Limits for the fitted head parameters</h4>
          <p className="text-xs text-graphite-600">
            Lengths in µm, angles in arc seconds. Leave both limits empty for a parameter that is recorded,
            not judged.
          </p>
          <table className="mt-2 w-full text-sm">
            <LimitsHead first="Parameter" />
            <tbody className="divide-y divide-graphite-100">
              {parameters.map((p) => (
                <tr key={p.key}>
                  <td className="py-2 pr-2">
                    {p.words}
                    <span className="block text-xs text-graphite-500">
                      in {p.unit === "µm" ? "µm" : "arc seconds"}
                    </span>
                  </td>
                  <LimitCells
                    name={`param.${p.key}`}
                    label={`${p.words}:`}
                    lower={p.lower}
                    upper={p.upper}
                    decisionRule={p.decisionRule}
                    limitSource={p.limitSource}
                    limitSourceNote={p.limitSourceNote}
                  />
                </tr>
              ))}
            </tbody>
          </table>
        </ScrollRegion>
      ) : null}
    </Form>
  );
}
