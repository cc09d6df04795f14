import Link from "next/link";
import type { JobListRow, JobSortKey } from "@/lib/domain/jobs";
import { StatusBadge } from "@/components/ui/status-badge";
import { Table } from "@/components/ui/table";
import { JOB_KIND_LABELS } from "@/lib/domain/jobs";
import { LocalTime } from "@/components/readings/local-time";

type Sort = { sort: JobSortKey; dir: "asc" | "desc" };

/** The jobs list, sorted by the server: each sortable header links to the same page in the other order. */
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
  const sortHref = (column: string, desc: boolean) => {
    const next = new URLSearchParams(params);
    next.delete("page");
    next.set("sort", column);
    next.set("dir", column === sort.sort && desc ? "desc" : "asc");
    return `?${next.toString()}`;
  };
  return (
    <Table
      caption="Jobs"
      empty="No jobs match. Clear the filter to see every job you may open."
      data={rows}
      sorting={[{ id: sort.sort, desc: sort.dir === "desc" }]}
      sortHref={sortHref}
      tableClassName="min-w-[48rem] max-[900px]:min-w-0"
      rowProps={() => ({ className: "hover:bg-accent-50/40" })}
      columns={(column) => [
        column(
          "Reference",
          (r) => (
            <Link
              href={`/jobs/${r.id}`}
              className="num font-medium text-accent-700 underline-offset-2 hover:underline"
            >
              {r.reference}
            </Link>
          ),
          { id: "reference", sortBy: (r) => r.reference, nowrap: true },
        ),
        column(
          "Job",
          (r) => (
            <>
              <p className="font-medium text-graphite-900">{r.title}</p>
              <p className="text-graphite-500">
                {JOB_KIND_LABELS[r.kind]}
                {r.installerName ? ` · ${r.installerName}` : " · not assigned"}
              </p>
            </>
          ),
          { id: "title", sortBy: (r) => r.title },
        ),
        ...(showCustomer
          ? [
              column(
                "Customer",
                (r) => (
                  <>
                    <p>{r.customerName}</p>
                    <p className="text-graphite-500">{r.siteName}</p>
                  </>
                ),
                { id: "customer", sortBy: (r) => r.customerName },
              ),
            ]
          : []),
        column("Machine", (r) => r.machineName, { id: "machine", sortBy: (r) => r.machineName }),
        column(
          "Head",
          (r) => (
            <>
              <span className="num whitespace-nowrap">{r.headSerial}</span>{" "}
              <span className="text-graphite-500">({r.headAxes})</span>
            </>
          ),
          { id: "head" },
        ),
        column("Status", (r) => <StatusBadge status={r.status} />, { id: "status", sortBy: (r) => r.status }),
        column(
          "Scheduled",
          (r) =>
            r.scheduledFor ? (
              <span title={r.timeZone ? `Given in ${r.timeZone}` : undefined}>
                <LocalTime at={r.scheduledFor} />
              </span>
            ) : (
              <span className="text-graphite-500">Not scheduled</span>
            ),
          { id: "scheduled", numeric: true },
        ),
        column("Updated", (r) => <LocalTime at={r.updatedAt} />, {
          id: "updated",
          sortBy: (r) => r.updatedAt.toISOString(),
          numeric: true,
          className: "text-graphite-600",
        }),
      ]}
    />
  );
}
