"use client";

import { column, Table, type ColumnDef } from "@/components/ui/table";
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

/** One editable limit: fields `${name}.lowerLimit` … `${name}.limitSourceNote`, labelled "`label` lower limit" etc. */
type LimitRow = {
  name: string;
  label: string;
  first: React.ReactNode;
  lower: string;
  upper: string;
  decisionRule: string;
  limitSource: string;
  limitSourceNote: string;
};

function limitColumns(first: string): ColumnDef<LimitRow, unknown>[] {
  const limit = (which: "lower" | "upper") =>
    column<LimitRow>(
      which === "lower" ? "Lower" : "Upper",
      (r) => (
        <>
          <input
            aria-label={`${r.label} ${which} limit`}
            name={`${r.name}.${which}Limit`}
            defaultValue={r[which]}
            inputMode="decimal"
            className={`${CELL} num text-right`}
          />
          <FieldError name={`${r.name}.${which}Limit`} className="text-xs" />
        </>
      ),
      { className: "w-28" },
    );
  return [
    column<LimitRow>(first, (r) => r.first),
    limit("lower"),
    limit("upper"),
    column<LimitRow>(
      "Rule",
      (r) => (
        <select
          aria-label={`${r.label} decision rule`}
          name={`${r.name}.decisionRule`}
          defaultValue={r.decisionRule}
          className={CELL}
        >
          <option value="simple">Simple</option>
          <option value="guarded">Guarded</option>
        </select>
      ),
      { className: "w-32" },
    ),
    column<LimitRow>(
      "Source of the limit",
      (r) => (
        <select
          aria-label={`${r.label} limit source`}
          name={`${r.name}.limitSource`}
          defaultValue={r.limitSource}
          className={CELL}
        >
          {SOURCES.map(([v, l]) => (
            <option key={v} value={v}>
              {l}
            </option>
          ))}
        </select>
      ),
      { className: "w-52" },
    ),
    column<LimitRow>("Note on the source", (r) => (
      <input
        aria-label={`${r.label} note on the source`}
        name={`${r.name}.limitSourceNote`}
        defaultValue={r.limitSourceNote}
        className={`${inputClass} text-sm`}
      />
    )),
  ];
}

const STEP_COLUMNS = limitColumns("Step");
const PARAMETER_COLUMNS = limitColumns("Parameter");

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
      <Table
        caption="Step limits"
        empty="This version has no steps."
        bare
        data={steps.map((s): LimitRow => ({
          name: `step.${s.position}`,
          label: `Step ${s.position}`,
          first: (
            <>
              <span className="num text-graphite-500">{s.position}</span> {s.title}
              <input type="hidden" name={`step.${s.position}.kind`} value={s.kind} />
              <span className="block text-xs text-graphite-500">
                in {s.kind === "angle" ? "arc seconds" : unit}
              </span>
            </>
          ),
          ...s,
        }))}
        getRowId={(r) => r.name}
        columns={STEP_COLUMNS}
      />
      {parameters.length ? (
        <div className="mt-4">
          <h4 className="text-sm font-semibold">Limits for the fitted head parameters</h4>
          <p className="text-xs text-graphite-600">
            Lengths in µm, angles in arc seconds. Leave both limits empty for a parameter that is recorded,
            not judged.
          </p>
          <Table
            caption="Limits for the fitted head parameters"
            empty={null}
            bare
            className="mt-2"
            data={parameters.map((p): LimitRow => ({
              name: `param.${p.key}`,
              label: `${p.words}:`,
              first: (
                <>
                  {p.words}
                  <span className="block text-xs text-graphite-500">
                    in {p.unit === "µm" ? "µm" : "arc seconds"}
                  </span>
                </>
              ),
              ...p,
            }))}
            getRowId={(r) => r.name}
            columns={PARAMETER_COLUMNS}
          />
        </div>
      ) : null}
    </Form>
  );
}
