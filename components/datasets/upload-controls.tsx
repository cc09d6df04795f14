"use client";

import { closedSetOptions } from "@/components/ui/field";
import { useRef, useState } from "react";
import { buttonClass } from "@/components/ui/button";
import { HEAD_AXIS_ROLE_WORDS, HEAD_AXIS_ROLES } from "@/lib/domain/positioning";
import { UNCERTAINTY_WORDS, type DatasetKindKey } from "./kinds";
import type { Units, UploadState } from "./upload-state";
import { UploadIcon } from "@/components/ui/icons";

export function Choice<T extends string>({
  legend,
  name,
  value,
  options,
  onChange,
}: {
  legend: string;
  name: string;
  value: T;
  options: ReadonlyArray<{ value: T; label: string }>;
  onChange: (v: T) => void;
}) {
  return (
    <fieldset>
      <legend className="mb-1 text-sm font-medium text-graphite-800">{legend}</legend>
      <div className="inline-flex flex-wrap gap-1 rounded-lg border border-graphite-300 bg-graphite-50 p-1">
        {options.map((o) => (
          <label
            key={o.value}
            className={`flex min-h-touch cursor-pointer items-center rounded-md px-3 text-sm ${value === o.value ? "bg-white font-semibold text-graphite-900 shadow-sm ring-1 ring-graphite-300" : "text-graphite-600 hover:text-graphite-900"}`}
          >
            <input
              type="radio"
              className="sr-only"
              name={name}
              value={o.value}
              checked={value === o.value}
              onChange={() => onChange(o.value)}
            />
            {o.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

export function Bar({ label, fraction }: { label: string; fraction: number }) {
  const pct = Math.round(fraction * 100);
  return (
    <div className="space-y-1">
      <div className="flex justify-between text-sm text-graphite-700">
        <span>{label}</span>
        <span className="num">{pct} %</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct}
        className="h-2.5 overflow-hidden rounded-full bg-graphite-200"
      >
        <div className="h-full rounded-full bg-accent-500 transition-[width]" style={{ width: `${pct}%` }} />
      </div>
    </div>
  );
}

const LENGTH = [
  { value: "mm", label: "mm" },
  { value: "in", label: "inch" },
] as const;

/** Which unit each kind of file asks for, and the form field the upload route reads it from. */
const UNIT_CHOICES: ReadonlyArray<{
  kinds: readonly DatasetKindKey[];
  legend: string;
  name: string;
  field: keyof Units;
  options: ReadonlyArray<{ value: string; label: string }>;
}> = [
  {
    kinds: ["sphere_probe", "tcp_check"],
    legend: "Unit of x, y, z",
    name: "units",
    field: "units",
    options: LENGTH,
  },
  { kinds: ["tram"], legend: "Unit of the travel", name: "travel_units", field: "travel", options: LENGTH },
  {
    kinds: ["tram", "sweep"],
    legend: "Unit of the readings",
    name: "reading_units",
    field: "reading",
    options: [{ value: "um", label: "µm" }, ...LENGTH],
  },
];

/** The settings that depend on the kind of data: units, the sweep radius, U, the decimal separator. */
export function KindOptions({
  state,
  set,
}: {
  state: UploadState;
  set: (patch: Partial<Pick<UploadState, "units" | "radius" | "uncertainty" | "axis" | "comma">>) => void;
}) {
  const { kind, units, radius, uncertainty, scan, comma, axis } = state;
  return (
    <div className="flex flex-wrap gap-4">
      {UNIT_CHOICES.filter((c) => c.kinds.includes(kind)).map((c) => (
        <Choice
          key={c.name}
          legend={c.legend}
          name={c.name}
          value={units[c.field]}
          options={c.options}
          onChange={(v) => set({ units: { ...units, [c.field]: v } })}
        />
      ))}
      {kind === "sweep" ? (
        <label className="block space-y-1">
          <span className="text-sm font-medium text-graphite-800">Sweep radius (mm)</span>
          <input
            inputMode="decimal"
            value={radius}
            onChange={(e) => set({ radius: e.target.value })}
            className="num block min-h-touch w-40 rounded-lg border border-graphite-300 px-3 text-right"
          />
        </label>
      ) : null}
      {kind === "rotary_positioning" ? (
        <Choice
          legend="Axis of the head tested"
          name="axis"
          value={axis}
          options={closedSetOptions(HEAD_AXIS_ROLES, HEAD_AXIS_ROLE_WORDS)}
          onChange={(v) => set({ axis: v })}
        />
      ) : null}
      {UNCERTAINTY_WORDS[kind] ? (
        <UncertaintyInput
          {...UNCERTAINTY_WORDS[kind]}
          value={uncertainty}
          onChange={(v) => set({ uncertainty: v })}
        />
      ) : null}
      {scan?.delimiter === ";" ? (
        <Choice
          legend="Decimal separator"
          name="decimal"
          value={comma ? "comma" : "point"}
          options={[
            { value: "point", label: "point 1.5" },
            { value: "comma", label: "comma 1,5" },
          ]}
          onChange={(v) => set({ comma: v === "comma" })}
        />
      ) : null}
    </div>
  );
}

/** Drop a CSV here or choose one; shows the chosen file's name and size. */
export function DropZone({ file, onPick }: { file: File | null; onPick: (f: File | null) => void }) {
  const inputRef = useRef<HTMLInputElement>(null);
  const [dragging, setDragging] = useState(false);
  return (
    <div
      onDragOver={(e) => {
        e.preventDefault();
        setDragging(true);
      }}
      onDragLeave={() => setDragging(false)}
      onDrop={(e) => {
        e.preventDefault();
        setDragging(false);
        onPick(e.dataTransfer.files[0] ?? null);
      }}
      className={`flex flex-col items-center gap-2 rounded-card border-2 border-dashed p-6 text-center ${dragging ? "border-accent-500 bg-accent-50" : "border-graphite-300 bg-graphite-50"}`}
    >
      <UploadIcon className="h-8 w-8 text-graphite-500" />
      <p className="text-sm text-graphite-700">Drop a CSV file here, or</p>
      <button type="button" onClick={() => inputRef.current?.click()} className={buttonClass("secondary")}>
        Choose a file
      </button>
      <input
        ref={inputRef}
        type="file"
        accept=".csv,text/csv,text/plain"
        aria-label="CSV file"
        className="sr-only"
        onChange={(e) => {
          onPick(e.target.files?.[0] ?? null);
          e.target.value = "";
        }}
      />
      {file ? (
        <p className="text-sm" data-testid="chosen-file">
          <span className="font-medium">{file.name}</span> ·{" "}
          <span className="num">{(file.size / 1024).toFixed(1)} KiB</span>
        </p>
      ) : null}
    </div>
  );
}

/** The expanded uncertainty U (k = 2) a file's measurements carry, typed beside the upload. */
function UncertaintyInput({
  label,
  value,
  placeholder,
  onChange,
  hint,
}: {
  label: string;
  value: string;
  placeholder: string;
  onChange: (value: string) => void;
  hint: string;
}) {
  return (
    <label className="block max-w-md space-y-1">
      <span className="text-sm font-medium text-graphite-800">{label}</span>
      <input
        inputMode="decimal"
        value={value}
        placeholder={placeholder}
        onChange={(e) => onChange(e.target.value)}
        className="num block min-h-touch w-40 rounded-lg border border-graphite-300 px-3 text-right"
      />
      <span className="block text-xs text-graphite-600">{hint}</span>
    </label>
  );
}
