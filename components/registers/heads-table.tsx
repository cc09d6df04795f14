import Link from "next/link";
import { Table } from "@/components/ui/table";
import type { HeadListRow } from "@/lib/domain/heads";

export function HeadsTable({ rows }: { rows: readonly HeadListRow[] }) {
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
        column("Mounted on", (h) => h.machineName ?? "Not mounted"),
      ]}
    />
  );
}
