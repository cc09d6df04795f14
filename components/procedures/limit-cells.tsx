"use client";

/** The cells the builder's limits tables share: a source choice, a compact table, source and note. */
import { useFormContext } from "react-hook-form";
import { closedSetOptions, inputClass, OptionList } from "@/components/ui/field";
import { LIMIT_SOURCE_LABELS, LIMIT_SOURCES } from "@/lib/domain/procedures";

const SOURCE_OPTIONS = closedSetOptions(LIMIT_SOURCES, LIMIT_SOURCE_LABELS);

/** A choice among the limit sources; `className` replaces the compact default. */
export function SourceSelect({
  label,
  ...props
}: React.SelectHTMLAttributes<HTMLSelectElement> & { label?: string }) {
  return (
    <select aria-label={label} className={`${inputClass} text-sm`} {...props}>
      <option value="">Choose…</option>
      <OptionList options={SOURCE_OPTIONS} />
    </select>
  );
}

/** The head-parameter limits table's columns: heading and width. */
export const LIMIT_COLUMNS: readonly [string, string][] = [
  ["Parameter", ""],
  ["Lower", "w-24"],
  ["Upper", "w-24"],
  ["Rule", "w-28"],
  ["Source", "w-48"],
  ["Note on the source", ""],
];

/** A compact limits table: its caption for screen readers, its column headings, and its rows. */
export function LimitsTable({
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
export function SourceCells({ words, source, note }: { words: string; source: string; note: string }) {
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
