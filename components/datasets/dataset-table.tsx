import Link from "next/link";
import type { DatasetListRow } from "@/lib/domain/datasets";
import { Table } from "@/components/ui/table";
import { formatDateTimeUtc } from "@/lib/format";
import { KIND_LABELS, PHASE_LABELS } from "./kinds";

/** The datasets of a job: what, when, by whom, and whether it still counts. */
export function DatasetTable({ jobId, rows }: { jobId: string; rows: readonly DatasetListRow[] }) {
  return (
    <Table
      caption="Datasets of this job"
      empty="No measurement data has been added to this job yet."
      data={rows}
      rowProps={(d) => ({ className: d.status === "deleted" ? "text-graphite-500" : "" })}
      columns={(column) => [
        column("Data", (d) => (
          <Link
            href={`/jobs/${jobId}/data/${d.id}`}
            className="font-medium text-graphite-900 underline decoration-graphite-300 underline-offset-2 hover:decoration-accent-600"
          >
            {KIND_LABELS[d.kind]}
          </Link>
        )),
        column("Phase", (d) => PHASE_LABELS[d.phase]),
        column("Rows", (d) => d.rows.toLocaleString("en-GB"), { numeric: true }),
        column(
          "File",
          (d) => (
            <>
              <a
                href={`/api/datasets/${d.id}/file`}
                title={d.originalFilename}
                className="underline decoration-graphite-300 underline-offset-2 hover:decoration-accent-600"
              >
                {d.originalFilename}
              </a>
              <div className="num text-xs text-graphite-500" title={`SHA-256 ${d.sha256}`}>
                SHA-256 {d.sha256.slice(0, 12)}…
              </div>
            </>
          ),
          { className: "max-w-56 truncate" },
        ),
        column("Uploaded by", (d) => d.uploaderName ?? "—"),
        column("When", (d) => formatDateTimeUtc(d.uploadedAt), { nowrap: true, className: "num" }),
        column("Status", (d) => <DatasetStatus deleted={d.status === "deleted"} />),
      ]}
    />
  );
}

function DatasetStatus({ deleted }: { deleted: boolean }) {
  return deleted ? (
    <span className="inline-flex items-center gap-1 text-graphite-600">
      <svg viewBox="0 0 12 12" className="h-3 w-3" aria-hidden="true">
        <path d="M2 6h8" stroke="currentColor" strokeWidth="1.8" />
      </svg>
      Deleted
    </span>
  ) : (
    <span className="inline-flex items-center gap-1 text-pass-700">
      <svg viewBox="0 0 12 12" className="h-3 w-3" aria-hidden="true">
        <path d="M2 6.2 4.8 9 10 3" fill="none" stroke="currentColor" strokeWidth="2" />
      </svg>
      Stored
    </span>
  );
}
