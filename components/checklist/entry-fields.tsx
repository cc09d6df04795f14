/** The look of the checklist's entry fields, and the number-with-its-unit field they share. */

export const inputCls =
  "min-h-touch w-full rounded-md border border-graphite-300 bg-white px-3 text-base focus:border-accent-500 focus:outline-none focus:ring-2 focus:ring-accent-500/40";
export const labelCls = "mb-1 block text-sm font-medium text-graphite-700";

/**
 * A reading typed on the tablet: its label, a large right-aligned decimal input and the unit
 * beside it; `children` (the problem line) go under it. `input` carries the form registration.
 */
export function ValueWithUnit({
  id,
  label,
  unit,
  wideUnit = false,
  input,
  children,
}: {
  id: string;
  label: React.ReactNode;
  unit: string;
  /** A unit written out in words (a recorded value's own unit) may be wider than a symbol. */
  wideUnit?: boolean;
  input: React.ComponentProps<"input">;
  children?: React.ReactNode;
}) {
  return (
    <div>
      <label htmlFor={id} className={labelCls}>
        {label}
      </label>
      <div className="flex items-center gap-2">
        <input
          id={id}
          inputMode="decimal"
          autoComplete="off"
          className={`${inputCls} num text-right text-lg`}
          {...input}
        />
        <span className={`num text-graphite-600 ${wideUnit ? "min-w-10 whitespace-nowrap" : "w-10"}`}>
          {unit}
        </span>
      </div>
      {children}
    </div>
  );
}

/** The instrument a reading is taken with, from the register; one past its calibration date cannot be chosen. */
export function InstrumentSelect({
  id,
  instruments,
  today,
  input,
}: {
  id: string;
  instruments: ReadonlyArray<{ id: string; serial: string; kind: string; calibrationDueOn: string }>;
  today: string;
  input: React.ComponentProps<"select">;
}) {
  return (
    <div>
      <label htmlFor={id} className={labelCls}>
        Instrument
      </label>
      <select id={id} className={inputCls} {...input}>
        <option value="">Choose from the register…</option>
        {instruments.map((i) => {
          const pastDue = i.calibrationDueOn < today;
          return (
            <option key={i.id} value={i.id} disabled={pastDue}>
              {i.serial} · {i.kind} ·{" "}
              {pastDue ? `calibration past due since ${i.calibrationDueOn}` : `due ${i.calibrationDueOn}`}
            </option>
          );
        })}
      </select>
    </div>
  );
}
