"use client";

import { cloneElement, isValidElement, useId } from "react";
import { useFormContext, get, type FieldErrors } from "react-hook-form";

export const inputClass =
  "block min-h-touch w-full rounded-md border border-graphite-300 bg-white px-3 text-base focus:border-accent-500 focus:outline-none focus:ring-2 focus:ring-accent-500/40 aria-[invalid=true]:border-fail-600";

/** The message for one field, from the surrounding form; `undefined` outside a form or when valid. */
export function useFieldError(name: string): string | undefined {
  const form = useFormContext();
  const err = (form ? get(form.formState.errors as FieldErrors, name) : undefined) as
    { message?: unknown } | undefined;
  return typeof err?.message === "string" && err.message ? err.message : undefined;
}

/** A field's inline error, kept in the page (empty when valid) so its id can always be referenced. */
export function FieldError({
  name,
  id,
  className = "text-sm",
}: {
  name: string;
  id?: string;
  className?: string;
}) {
  const message = useFieldError(name);
  return (
    <span id={id} data-error-for={name} className={`block text-fail-700 ${className}`}>
      {message ?? ""}
    </span>
  );
}

type ControlProps = {
  id?: string;
  name?: string;
  "aria-describedby"?: string;
  "aria-invalid"?: boolean;
};

/**
 * A labelled form control with an optional hint and its inline error. The single child (an input,
 * select or textarea) gets the id, the name, `aria-describedby` (hint and error) and
 * `aria-invalid`; inside a `Form` it is registered with react-hook-form.
 */
export function Field({
  name,
  label,
  hint,
  children,
  className = "",
}: {
  name: string;
  label: string;
  hint?: string;
  children: React.ReactElement<ControlProps>;
  className?: string;
}) {
  const generated = `${useId()}-${name}`;
  // A control that names its own id keeps it (the builder moves focus to a step's title by id).
  const id = (isValidElement(children) ? children.props.id : undefined) ?? generated;
  const form = useFormContext();
  const error = useFieldError(name);
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = `${id}-error`;
  const control = isValidElement(children)
    ? cloneElement(children, {
        id,
        ...(form ? form.register(name) : { name }),
        "aria-describedby": [hintId, errorId].filter(Boolean).join(" "),
        "aria-invalid": error ? true : undefined,
      })
    : children;
  return (
    <div className={`space-y-1 ${className}`}>
      <label htmlFor={id} className="block text-sm font-medium text-graphite-700">
        {label}
      </label>
      {control}
      {hint ? (
        <span id={hintId} className="block text-xs text-graphite-500">
          {hint}
        </span>
      ) : null}
      <FieldError name={name} id={errorId} />
    </div>
  );
}

/**
 * A labelled text input; `numeric` for serials and numbers (tabular figures); `decimal` for a
 * decimal number (also the numeric keypad on a tablet, and no autofill).
 */
export function TextField({
  name,
  label,
  hint,
  numeric = false,
  decimal = false,
  className = "",
  ...input
}: {
  name: string;
  label: string;
  hint?: string;
  numeric?: boolean;
  decimal?: boolean;
} & Omit<React.InputHTMLAttributes<HTMLInputElement>, "name">) {
  const number = decimal ? ({ inputMode: "decimal", autoComplete: "off" } as const) : {};
  return (
    <Field name={name} label={label} hint={hint}>
      <input
        className={`${inputClass} ${numeric || decimal ? "num" : ""} ${className}`}
        {...number}
        {...input}
      />
    </Field>
  );
}

export type Option = { value: string; label: string };

/** A labelled select; `placeholder` adds a first, empty choice ("Choose…", "Not assigned yet"). */
export function SelectField({
  name,
  label,
  hint,
  options,
  placeholder,
  defaultValue = "",
}: {
  name: string;
  label: string;
  hint?: string;
  options: readonly Option[];
  placeholder?: string;
  defaultValue?: string;
}) {
  return (
    <Field name={name} label={label} hint={hint}>
      <select className={inputClass} defaultValue={defaultValue}>
        {placeholder !== undefined ? <option value="">{placeholder}</option> : null}
        <OptionList options={options} />
      </select>
    </Field>
  );
}

/** Options from `{ id, label }` rows, as the register lists give them. */
export const optionsOf = (rows: ReadonlyArray<{ id: string; label: string }>): Option[] =>
  rows.map((r) => ({ value: r.id, label: r.label }));

/** A closed set's values as options, each with its label from the set's labels map (lib/domain). */
export const closedSetOptions = <K extends string>(
  values: readonly K[],
  labels: Record<K, string>,
): Array<{ value: K; label: string }> => values.map((v) => ({ value: v, label: labels[v] }));

/** The <option> elements of a select, in the order given. */
export function OptionList({ options }: { options: readonly Option[] }) {
  return options.map((o) => (
    <option key={o.value} value={o.value}>
      {o.label}
    </option>
  ));
}
