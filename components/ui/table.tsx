/**
 * The app's one table, built on TanStack Table: column definitions, sorting (in the browser, or by
 * links for a list the server sorts), an empty state, and below 900 px a card per row with each
 * value under its column's label. Wide tables that must stay tables (`layout="scroll"`) scroll
 * sideways inside a ScrollRegion instead. No hooks here, so server pages can render it directly;
 * a client component that sorts in the browser keeps `sorting` in its own state.
 */
import { flexRender, type Header } from "@tanstack/react-table";
import Link from "next/link";
import { ScrollRegion } from "./scroll-region";
import { buildTable, type TableProps } from "./table-model";

export { buildTable, column, defineTable } from "./table-model";
export type { ColumnDef, ColumnFactory, SortingState, TableDefinition, TableProps } from "./table-model";

// Below 900 px a "cards" table turns each row into a card (Tailwind needs the class names written out).
const CARDS = {
  frame:
    "max-[900px]:overflow-visible max-[900px]:border-0 max-[900px]:bg-transparent max-[900px]:shadow-none",
  table: "max-[900px]:block",
  head: "max-[900px]:sr-only",
  body: "max-[900px]:block max-[900px]:space-y-3 max-[900px]:divide-y-0",
  row: "max-[900px]:grid max-[900px]:gap-x-8 min-[560px]:max-[900px]:grid-cols-2 max-[900px]:rounded-card max-[900px]:border max-[900px]:border-graphite-200 max-[900px]:bg-white max-[900px]:px-4 max-[900px]:py-2 max-[900px]:shadow-sm",
  cell: "max-[900px]:grid max-[900px]:grid-cols-[minmax(6rem,40%)_minmax(0,1fr)] max-[900px]:items-baseline max-[900px]:gap-3 max-[900px]:px-0 max-[900px]:py-1.5 max-[900px]:text-left max-[900px]:before:font-sans max-[900px]:before:whitespace-normal max-[900px]:before:text-graphite-600 max-[900px]:before:content-[attr(data-label)]",
};
const NO_CARDS = { frame: "", table: "", head: "", body: "", row: "", cell: "" };

function SortMark({ dir }: { dir: false | "asc" | "desc" }) {
  return (
    <span aria-hidden="true" className={dir ? "text-accent-600" : "text-graphite-300"}>
      {dir === "asc" ? "▲" : dir === "desc" ? "▼" : "↕"}
    </span>
  );
}

function SortControl<T>({
  header,
  sortHref,
}: {
  header: Header<T, unknown>;
  sortHref?: TableProps<T>["sortHref"];
}) {
  const label = flexRender(header.column.columnDef.header, header.getContext());
  const dir = header.column.getIsSorted();
  const cls = "inline-flex min-h-touch items-center gap-1 hover:text-graphite-900";
  if (sortHref) {
    return (
      <Link href={sortHref(header.column.id, dir === "asc")} className={cls}>
        {label}
        <SortMark dir={dir} />
      </Link>
    );
  }
  return (
    <button type="button" onClick={header.column.getToggleSortingHandler()} className={`${cls} font-medium`}>
      {label}
      <SortMark dir={dir} />
    </button>
  );
}

export function Table<T>(props: TableProps<T>) {
  const {
    caption,
    empty,
    layout = "cards",
    rowProps,
    className = "",
    tableClassName = "",
    bare = false,
  } = props;
  if (props.data.length === 0) {
    return (
      <p className="rounded-card border border-dashed border-graphite-300 bg-white p-6 text-center text-sm text-graphite-600">
        {empty}
      </p>
    );
  }
  const table = buildTable(props);
  const cards = layout === "cards";
  const k = cards ? CARDS : NO_CARDS;
  const headers = table.getHeaderGroups()[0]?.headers ?? [];
  const sortable = headers.filter((h) => h.column.getCanSort());
  return (
    <div className={className}>
      {cards && sortable.length ? (
        <div className="mb-3 hidden flex-wrap items-center gap-x-4 text-sm text-graphite-600 max-[900px]:flex">
          <span>Sort by</span>
          {sortable.map((h) => (
            <SortControl key={h.id} header={h} sortHref={props.sortHref} />
          ))}
        </div>
      ) : null}
      <ScrollRegion
        label={`${caption}, table`}
        className={`${bare ? "" : "rounded-card border border-graphite-200 bg-white shadow-sm"} ${k.frame}`}
      >
        <table {...props.tableProps} className={`w-full text-sm ${tableClassName} ${k.table}`}>
          <caption className="sr-only">{caption}</caption>
          <thead
            className={`border-b border-graphite-200 text-graphite-600 ${bare ? "" : "bg-graphite-50"} ${k.head}`}
          >
            {table.getHeaderGroups().map((g) => (
              <tr key={g.id}>
                {g.headers.map((h) => {
                  const meta = h.column.columnDef.meta;
                  const dir = h.column.getIsSorted();
                  return (
                    <th
                      key={h.id}
                      scope="col"
                      {...meta?.headerProps}
                      aria-sort={
                        h.column.getCanSort()
                          ? dir === "asc"
                            ? "ascending"
                            : dir === "desc"
                              ? "descending"
                              : "none"
                          : undefined
                      }
                      className={`${bare ? "py-2 pr-3" : "px-4 py-3"} font-medium ${meta?.numeric ? "text-right" : "text-left"} ${meta?.headerClassName ?? ""}`}
                    >
                      {h.isPlaceholder ? null : h.column.getCanSort() ? (
                        <SortControl header={h} sortHref={props.sortHref} />
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className={`divide-y divide-graphite-100 ${k.body}`}>
            {table.getRowModel().rows.map((row) => (
              <tr
                key={row.id}
                {...rowProps?.(row.original)}
                className={`${rowProps?.(row.original).className ?? ""} ${k.row}`}
              >
                {row.getVisibleCells().map((cell) => {
                  const meta = cell.column.columnDef.meta;
                  const h = cell.column.columnDef.header;
                  const label = meta?.label ?? (typeof h === "string" ? h : cell.column.id);
                  const Cell = meta?.rowHeader ? "th" : "td";
                  return (
                    <Cell
                      key={cell.id}
                      scope={meta?.rowHeader ? "row" : undefined}
                      data-label={label}
                      {...meta?.cellProps?.(row.original)}
                      className={`${bare ? "py-2 pr-3" : "px-4 py-3"} ${meta?.rowHeader ? "text-left font-normal" : ""} ${meta?.numeric ? "num text-right" : ""} ${(meta?.nowrap ?? meta?.numeric) ? "whitespace-nowrap" : ""} ${meta?.className ?? ""} ${k.cell} ${cards && meta?.wide ? "min-[560px]:max-[900px]:col-span-2" : ""}`}
                    >
                      <div className={cards ? "contents max-[900px]:block max-[900px]:min-w-0" : "contents"}>
                        {flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </div>
                    </Cell>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollRegion>
    </div>
  );
}
