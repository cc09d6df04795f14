import { Table } from "@/components/ui/table";
import { MAX_LISTED } from "./csv-scan";
import type { Issue } from "./upload-checks";

/** The problems that stop a file from being sent (the browser's), or that the server refused it for. */
export function IssueList({ issues, fromServer }: { issues: readonly Issue[]; fromServer: boolean }) {
  if (issues.length === 0) return null;
  const n = issues.length;
  return (
    <div className="rounded-lg border-2 border-fail-600/50 bg-fail-50 p-4" data-testid="row-errors">
      <p className="mb-2 flex items-center gap-2 text-sm font-semibold text-fail-700">
        <svg viewBox="0 0 12 12" className="h-3.5 w-3.5" aria-hidden="true">
          <path d="M2.5 2.5l7 7M9.5 2.5l-7 7" stroke="currentColor" strokeWidth="2" />
        </svg>
        {fromServer
          ? "The server found problems; nothing was stored:"
          : `${n}${n >= MAX_LISTED ? "+" : ""} problem${n === 1 ? "" : "s"} to fix before this file can be sent:`}
      </p>
      <Table
        caption="Problems in the file"
        empty={null}
        bare
        layout="scroll"
        data={issues}
        columns={(column) => [
          column("Row", (i) => i.row ?? "—", { numeric: true, className: "w-16" }),
          column("Column", (i) => i.column ?? i.field ?? "—", { className: "num w-40" }),
          column("Problem", (i) => i.message),
        ]}
      />
    </div>
  );
}
