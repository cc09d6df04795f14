"use client";

import { Table, type ColumnDef } from "@/components/ui/table";
import type { CsvScan } from "./csv-scan";
import { COLUMNS, type DatasetKindKey } from "./kinds";

type PreviewRow = { line: number; cells: readonly string[] };

/** The first rows of the file as read in the browser, each column headed by what it is matched to. */
function Preview({
  scan,
  kind,
  mapping,
}: {
  scan: CsvScan;
  kind: DatasetKindKey;
  mapping: Record<string, number>;
}) {
  const columns: ColumnDef<PreviewRow, unknown>[] = [
    {
      id: "line",
      header: "Row",
      cell: ({ row }) => row.original.line,
      meta: { numeric: true, className: "text-graphite-500" },
    },
    ...scan.headers.map((h, i): ColumnDef<PreviewRow, unknown> => ({
      id: `c${i}`,
      header: () => (
        <>
          <div>{h || <em className="text-graphite-500">no name</em>}</div>
          <div className="text-xs font-normal text-graphite-600">
            {COLUMNS[kind].find((c) => mapping[c.name] === i)?.label ?? "not used"}
          </div>
        </>
      ),
      cell: ({ row }) => row.original.cells[i] ?? "",
      meta: { className: "num", label: h || `column ${i + 1}` },
    })),
  ];
  return (
    <Table
      caption="Preview of the first rows"
      empty="The file has no data rows."
      layout="scroll"
      data={scan.preview.map((cells, k) => ({ line: k + 2, cells }))}
      columns={columns}
    />
  );
}

/** The preview and, below it, which file column feeds each of the kind's columns. */
export function ColumnMapping({
  scan,
  kind,
  mapping,
  header,
  open,
  onToggle,
  onMap,
}: {
  scan: CsvScan;
  kind: DatasetKindKey;
  mapping: Record<string, number>;
  header: string | undefined;
  open: boolean;
  onToggle: (open: boolean) => void;
  onMap: (column: string, index: number) => void;
}) {
  return (
    <div className="space-y-3">
      <h3 className="text-sm font-semibold">
        Preview{" "}
        <span className="font-normal text-graphite-600">
          — <span className="num">{scan.rows.toLocaleString("en-GB")}</span> data rows, separated by “
          {scan.delimiter}”
        </span>
      </h3>
      <Preview scan={scan} kind={kind} mapping={mapping} />
      <details
        className="rounded-lg border border-graphite-200 p-3"
        open={open}
        onToggle={(e) => onToggle(e.currentTarget.open)}
      >
        <summary className="cursor-pointer text-sm font-medium">
          Columns: matched from the header names — change a match here
        </summary>
        <div className="mt-3 grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          {COLUMNS[kind].map((c) => (
            <label key={c.name} className="block space-y-1">
              <span className="text-sm">
                {c.label} <span className="num text-xs text-graphite-600">{c.name}</span>
                {c.required ? <span className="text-xs text-graphite-600"> · required</span> : null}
              </span>
              <select
                aria-label={`File column for ${c.name}`}
                value={mapping[c.name] ?? -1}
                onChange={(e) => onMap(c.name, Number(e.target.value))}
                className="block min-h-touch w-full rounded-lg border border-graphite-300 bg-white px-2 text-sm"
              >
                <option value={-1}>— not in the file —</option>
                {scan.headers.map((h, i) => (
                  <option key={i} value={i}>
                    {h || `column ${i + 1}`}
                  </option>
                ))}
              </select>
            </label>
          ))}
        </div>
        {header ? (
          <p className="mt-2 text-xs text-graphite-600">
            The server reads the file with the header line <code className="num">{header}</code>; the stored
            original keeps yours.
          </p>
        ) : null}
      </details>
    </div>
  );
}
