import { ScrollRegion } from "@/components/ui/scroll-region";
import Link from "next/link";
import type { DatasetListRow } from "@/lib/domain/datasets";
import { formatDateTimeUtc } from "@/lib/format";
import { KIND_LABELS, PHASE_LABELS } from "./kinds";

/** The datasets of a job: what, when, by whom, and whether it still counts. */
export function DatasetTable({ jobId, rows }: { jobId: string; rows: readonly DatasetListRow[] }) {
  if (rows.length === 0) {
    return (
      <p className="rounded-card border border-dashed border-graphite-300 bg-white p-6 text-center text-sm text-graphite-600">
        No measurement data has been added to this job yet.
      </p>
    );
  }
  return (
    <ScrollRegion
      label="Datasets, table"
      className="rounded-card border border-graphite-200 bg-white shadow-sm"
    >
      <table className="w-full text-sm">
        <caption className="sr-only">Datasets of this job</caption>
        <thead className="border-b border-graphite-200 bg-graphite-50 text-left text-graphite-600">
          <tr>
            <th scope="col" className="px-4 py-3 font-medium">
              Data
            </th>
            <th scope="col" className="px-4 py-3 font-medium">
              Phase
            </th>
            <th scope="col" className="px-4 py-3 text-right font-medium">
              Rows
            </th>
            <th scope="col" className="px-4 py-3 font-medium">
              File
            </th>
            <th scope="col" className="px-4 py-3 font-medium">
              Uploaded by
            </th>
            <th scope="col" className="px-4 py-3 font-medium">
              When
            </th>
            <th scope="col" className="px-4 py-3 font-medium">
              Status
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-graphite-100">
          {rows.map((d) => (
            <tr key={d.id} className={d.status === "deleted" ? "text-graphite-500" : ""}>
              <td className="px-4 py-3">
                <Link
                  href={`/jobs/${jobId}/data/${d.id}`}
                  className="font-medium text-graphite-900 underline decoration-graphite-300 underline-offset-2 hover:decoration-accent-600"
                >
                  {KIND_LABELS[d.kind]}
                </Link>
              </td>
              <td className="px-4 py-3">{PHASE_LABELS[d.phase]}</td>
              <td className="num px-4 py-3 text-right">{d.rows.toLocaleString("en-GB")}</td>
              <td className="max-w-56 truncate px-4 py-3" title={d.originalFilename}>
                <a
                  href={`/api/datasets/${d.id}/file`}
                  className="underline decoration-graphite-300 underline-offset-2 hover:decoration-accent-600"
                >
                  {d.originalFilename}
                </a>
                <div className="num text-xs text-graphite-500" title={`SHA-256 ${d.sha256}`}>
                  SHA-256 {d.sha256.slice(0, 12)}…
                </div>
              </td>
              <td className="px-4 py-3">{d.uploaderName ?? "—"}</td>
              <td className="num px-4 py-3 whitespace-nowrap">{formatDateTimeUtc(d.uploadedAt)}</td>
              <td className="px-4 py-3">
                {d.status === "deleted" ? (
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
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollRegion>
  );
}
