import { Table, type TableProps } from "@/components/ui/table";

/**
 * A chart's values as a table behind a disclosure under the figure: the exact figures for whoever
 * reads them off, and the chart's content for a screen reader. The table scrolls sideways, never
 * turning into cards, so the columns stay comparable on a tablet.
 */
export function ChartedValues<T>({
  className = "",
  ...table
}: Omit<TableProps<T>, "className" | "bare" | "layout"> & {
  /** Classes of the disclosure (its spacing under the figure). */
  className?: string;
}) {
  return (
    <details className={`text-sm ${className}`.trim()}>
      <summary className="min-h-touch cursor-pointer py-2 font-medium text-graphite-800">
        The charted values as a table
      </summary>
      <Table {...table} bare layout="scroll" />
    </details>
  );
}
