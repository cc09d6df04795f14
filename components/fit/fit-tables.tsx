import { defineTable, Table } from "@/components/ui/table";
import type { ControlValue } from "@/lib/fit-display";
import { signed } from "@/lib/numbers";

type Outlier = { row: number; residual_um: readonly number[] };
type Poses = {
  row: readonly number[];
  primary_deg: readonly number[];
  secondary_deg: readonly number[];
  tool_mm: readonly number[];
};

/** The poses the fit flagged as outliers: where the head was and how far off the probe was. */
/** The listed outliers (the fit keeps the worst 50, worst first) out of `total` counted. */
export function OutlierTable({
  outliers,
  total,
  poses,
}: {
  outliers: readonly Outlier[];
  total: number;
  poses: Poses;
}) {
  const at = (o: Outlier) => poses.row.indexOf(o.row);
  return (
    <Table
      caption={total > outliers.length ? `Outliers: the worst ${outliers.length} of ${total}` : "Outliers"}
      empty="No outliers."
      bare
      className="mt-4 max-w-2xl"
      data={outliers}
      getRowId={(o) => String(o.row)}
      columns={(column) => [
        column("Row", (o) => o.row, { className: "num" }),
        column("Primary", (o) => (at(o) >= 0 ? `${poses.primary_deg[at(o)]}°` : "—"), { numeric: true }),
        column("Secondary", (o) => (at(o) >= 0 ? `${poses.secondary_deg[at(o)]}°` : "—"), { numeric: true }),
        column("Tool", (o) => (at(o) >= 0 ? `${poses.tool_mm[at(o)]} mm` : "—"), { numeric: true }),
        column("Residual x, y, z", (o) => `${o.residual_um.map((v) => signed(v, 2)).join(", ")} µm`, {
          numeric: true,
        }),
      ]}
    />
  );
}

const VALUES_TABLE = defineTable<ControlValue>({
  caption: "Values for the control",
  empty: "The fit determined no value the control takes.",
  getRowId: (c) => c.label,
  columns: (column) => [
    column("Setting", (c) => c.label, { rowHeader: true, className: "font-medium" }),
    column("Value", (c) => c.text, { numeric: true, className: "text-base font-semibold" }),
    column("Note", (c) => c.note, { className: "text-graphite-600" }),
  ],
});

/** The approved values to enter in the control, each with what it means. */
export function ControlValuesTable({ values }: { values: readonly ControlValue[] }) {
  return <Table {...VALUES_TABLE} bare data={values} />;
}
