import Link from "next/link";
import { SimpleTable } from "@/components/ui/simple-table";
import type { HeadListRow } from "@/lib/domain/heads";

export function HeadsTable({ rows }: { rows: readonly HeadListRow[] }) {
  return (
    <SimpleTable
      caption="Heads"
      rows={rows}
      columns={[
        {
          header: "Serial",
          cell: (h) => (
            <Link
              href={`/registers/heads/${h.id}`}
              className="num font-medium text-graphite-900 underline decoration-graphite-300 underline-offset-2 hover:decoration-accent-500"
            >
              {h.serial}
            </Link>
          ),
        },
        { header: "Maker and model", cell: (h) => [h.maker, h.model].filter(Boolean).join(" ") || "—" },
        { header: "Axes (primary/secondary)", cell: (h) => `${h.primaryAxis}/${h.secondaryAxis}` },
        {
          header: "Nominal pivot length",
          cell: (h) => `${h.nominalPivotLengthMm.toFixed(3)} mm`,
          numeric: true,
        },
        { header: "Mass", cell: (h) => (h.massKg ? `${h.massKg} kg` : "—"), numeric: true },
        { header: "Mounted on", cell: (h) => h.machineName ?? "Not mounted" },
      ]}
    />
  );
}
