import { ScrollRegion } from "@/components/ui/scroll-region";
import Link from "next/link";
import type { JobListRow, JobSortKey } from "@/lib/domain/jobs";
import { StatusBadge } from "@/components/ui/status-badge";
import { JOB_KIND_LABELS } from "@/lib/domain/jobs";
import { formatDate } from "@/lib/format";

type Sort = { sort: JobSortKey; dir: "asc" | "desc" };

function SortHeader({
  label,
  column,
  current,
  params,
  className = "",
}: {
  label: string;
  column: JobSortKey;
  current: Sort;
  params: URLSearchParams;
  className?: string;
}) {
  const active = current.sort === column;
  const next = new URLSearchParams(params);
  next.set("sort", column);
  next.set("dir", active && current.dir === "asc" ? "desc" : "asc");
  return (
    <th
      scope="col"
      aria-sort={active ? (current.dir === "asc" ? "ascending" : "descending") : "none"}
      className={`px-4 py-3 text-left font-medium ${className}`}
    >
      <Link
        href={`?${next.toString()}`}
        className="inline-flex min-h-touch items-center gap-1 hover:text-graphite-900"
      >
        {label}
        <span aria-hidden="true" className={active ? "text-accent-600" : "text-graphite-300"}>
          {active ? (current.dir === "asc" ? "▲" : "▼") : "↕"}
        </span>
      </Link>
    </th>
  );
}

export function JobsTable({
  rows,
  sort,
  params,
  showCustomer,
}: {
  rows: JobListRow[];
  sort: Sort;
  params: URLSearchParams;
  showCustomer: boolean;
}) {
  if (rows.length === 0) {
    return (
      <p className="rounded-card border border-dashed border-graphite-300 bg-white p-8 text-center text-graphite-600">
        No jobs match. Clear the filter to see every job you may open.
      </p>
    );
  }
  return (
    <ScrollRegion label="Jobs, table" className="rounded-card border border-graphite-200 bg-white shadow-sm">
      <table className="w-full min-w-[48rem] text-sm">
        <thead className="border-b border-graphite-200 bg-graphite-50 text-graphite-600">
          <tr>
            <SortHeader label="Reference" column="reference" current={sort} params={params} />
            <SortHeader label="Job" column="title" current={sort} params={params} />
            {showCustomer ? (
              <SortHeader label="Customer" column="customer" current={sort} params={params} />
            ) : null}
            <SortHeader label="Machine" column="machine" current={sort} params={params} />
            <th scope="col" className="px-4 py-3 text-left font-medium">
              Head
            </th>
            <SortHeader label="Status" column="status" current={sort} params={params} />
            <SortHeader
              label="Updated"
              column="updated"
              current={sort}
              params={params}
              className="text-right"
            />
          </tr>
        </thead>
        <tbody className="divide-y divide-graphite-100">
          {rows.map((r) => (
            <tr key={r.id} className="hover:bg-accent-50/40">
              <td className="px-4 py-3">
                <Link
                  href={`/jobs/${r.id}`}
                  className="num font-medium text-accent-700 underline-offset-2 hover:underline"
                >
                  {r.reference}
                </Link>
              </td>
              <td className="px-4 py-3">
                <p className="font-medium text-graphite-900">{r.title}</p>
                <p className="text-graphite-500">
                  {JOB_KIND_LABELS[r.kind]}
                  {r.installerName ? ` · ${r.installerName}` : " · not assigned"}
                </p>
              </td>
              {showCustomer ? (
                <td className="px-4 py-3">
                  <p>{r.customerName}</p>
                  <p className="text-graphite-500">{r.siteName}</p>
                </td>
              ) : null}
              <td className="px-4 py-3">{r.machineName}</td>
              <td className="px-4 py-3">
                <span className="num">{r.headSerial}</span>{" "}
                <span className="text-graphite-500">({r.headAxes})</span>
              </td>
              <td className="px-4 py-3">
                <StatusBadge status={r.status} />
              </td>
              <td className="num px-4 py-3 text-right text-graphite-600">{formatDate(r.updatedAt)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollRegion>
  );
}
