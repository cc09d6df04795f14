"use client";

import { Field, inputClass, optionsOf, SelectField, TextField, type Option } from "./field";
import { Form, type FormProps } from "./form";

/**
 * One field of a form, described rather than written out: a text input (optionally numeric, a
 * decimal number, an e-mail or a date), a select (`options`) or a multi-line text (`rows`).
 * `FormFields` lays a list of them out in a grid; every field is still a `Field` with its label,
 * hint and inline error, registered with the surrounding `Form`.
 */
export type FieldSpec = {
  name: string;
  label: string;
  hint?: string;
  defaultValue?: string;
} & (
  | { options: readonly Option[]; placeholder?: string }
  | { rows: number }
  | {
      type?: "text" | "email" | "date" | "time";
      /** A decimal number: the numeric keypad on a tablet and tabular figures. */
      decimal?: boolean;
      /** Tabular figures (serials, references, phone numbers). */
      numeric?: boolean;
      placeholder?: string;
    }
);

/** A select of register rows (`{ id, label }`) with nothing chosen at first: the row a new one belongs to. */
export function pickField(
  name: string,
  label: string,
  rows: ReadonlyArray<{ id: string; label: string }>,
): FieldSpec {
  return { name, label, placeholder: "Choose…", options: optionsOf(rows) };
}

/** Grid layouts by column count at full width (one column on a phone). */
const GRID = {
  2: "grid gap-4 sm:grid-cols-2",
  3: "grid gap-4 sm:grid-cols-3",
  4: "grid gap-4 sm:grid-cols-2 lg:grid-cols-4",
  5: "grid gap-4 sm:grid-cols-2 lg:grid-cols-5",
} as const;

type GridColumns = keyof typeof GRID;

/** A fields-only form, declared once as one object: what it sends, how it words it, its fields. */
export type FieldsFormDefinition<T> = FormProps<T> & {
  fields: readonly FieldSpec[];
  columns?: GridColumns;
  /** The stored record's values by field name, shown in the fields it edits (a field's own defaultValue wins). */
  values?: Readonly<Record<string, string | undefined>>;
};

/** A form that is only a grid of described fields: the kit's Form around FormFields. */
export function FieldsForm<T>({ fields, columns, values, ...form }: FieldsFormDefinition<T>) {
  return (
    <Form {...form}>
      <FormFields fields={fields} columns={columns} values={values} />
    </Form>
  );
}

/**
 * Up to five fields stand in one row at full width (at least two columns); a longer list wraps
 * in four columns. Give `columns` for any other layout.
 */
function defaultColumns(count: number): GridColumns {
  return count > 5 ? 4 : (Math.max(count, 2) as GridColumns);
}

export function FormFields({
  fields,
  columns,
  values,
}: {
  fields: readonly FieldSpec[];
  columns?: GridColumns;
  values?: Readonly<Record<string, string | undefined>>;
}) {
  return (
    <div className={GRID[columns ?? defaultColumns(fields.length)]}>
      {fields.map((f) => (
        <FormField key={f.name} spec={{ ...f, defaultValue: f.defaultValue ?? values?.[f.name] }} />
      ))}
    </div>
  );
}

function FormField({ spec }: { spec: FieldSpec }) {
  const { name, label, hint, defaultValue } = spec;
  if ("options" in spec)
    return (
      <SelectField
        {...{ name, label, hint, defaultValue }}
        options={spec.options}
        placeholder={spec.placeholder}
      />
    );
  if ("rows" in spec)
    return (
      <Field {...{ name, label, hint }}>
        <textarea className={inputClass} rows={spec.rows} defaultValue={defaultValue} />
      </Field>
    );
  const { type, placeholder, numeric, decimal } = spec;
  return <TextField {...{ name, label, hint, defaultValue, type, placeholder, numeric, decimal }} />;
}

/** The fixed values a form sends with its fields (the record it acts on, the action it asks for). */
export function HiddenFields({ values }: { values: Record<string, string> }) {
  return (
    <>
      {Object.entries(values).map(([name, value]) => (
        <input key={name} type="hidden" name={name} value={value} />
      ))}
    </>
  );
}
