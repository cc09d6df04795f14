import Link from "next/link";
import { Table } from "@/components/ui/table";
import type { HeadListRow } from "@/lib/domain/heads";
import { retireColumn } from "@/components/registers/retire-column";

/** `mayRetire`: the administrator sees a retire / bring back control on each row. */
export function HeadsTable({
  rows,
  mayRetire = false,
}: {
  rows: readonly HeadListRow[];
  mayRetire?: boolean;
}) {
  return (
    <Table
      caption="Heads"
      empty="No heads in the register yet."
      data={rows}
      columns={(column) => [
        column("Serial", (h) => (
          <Link
            href={`/registers/heads/${h.id}`}
            className="num font-medium text-graphite-900 underline decoration-graphite-300 underline-offset-2 hover:decoration-accent-500"
          >
            {h.serial}
          </Link>
        )),
        column("Maker and model", (h) => [h.maker, h.model].filter(Boolean).join(" ") || "—"),
        column("Axes (primary/secondary)", (h) => `${h.primaryAxis}/${h.secondaryAxis}`),
        column("Nominal pivot length", (h) => `${h.nominalPivotLengthMm.toFixed(3)} mm`, { numeric: true }),
        column("Mass", (h) => (h.massKg ? `${h.massKg} kg` : "—"), { numeric: true }),
        column("Mounted on", (h) => (h.retiredAt ? "Retired" : (h.machineName ?? "Not mounted"))),
        ...retireColumn(column, mayRetire, "heads", (h) => ({
          id: h.id,
          retired: Boolean(h.retiredAt),
          label: `head ${h.serial}`,
        })),
      ]}
    />
  );
}
