/**
 * The Table's model: the column helper, the props, and the TanStack table built without React
 * state (so server pages can render tables too). The markup is in table.tsx.
 */
import {
  createTable,
  getCoreRowModel,
  getSortedRowModel,
  type ColumnDef,
  type ColumnMeta,
  type RowData,
  type SortingState,
  type Table as TanTable,
} from "@tanstack/react-table";

declare module "@tanstack/react-table" {
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData extends RowData, TValue> {
    /** Right-aligned tabular figures (measured values, counts). */
    numeric?: boolean;
    /** Never wrapped: references, dates, serials such as "TR-2026-0041" (numeric columns too, unless false). */
    nowrap?: boolean;
    /** This column names the row: its cells are row headers (<th scope="row">). */
    rowHeader?: boolean;
    /** Attributes and extra classes for the column's header cell. */
    headerProps?: Record<string, string | undefined>;
    headerClassName?: string;
    /** In card layout this cell takes the card's whole width (controls, long text). */
    wide?: boolean;
    /** The label in card layout when the header is not plain text. */
    label?: string;
    /** Extra classes for this column's cells. */
    className?: string;
    /** Attributes for each cell (for example data-value for tests and tools). */
    cellProps?: (row: TData) => Record<string, string | number | undefined>;
  }
}

export type { ColumnDef, SortingState };

export type ColumnFactory<T> = (
  header: string,
  cell: (row: T) => React.ReactNode,
  opts?: ColumnOptions<T>,
) => ColumnDef<T, unknown>;

type ColumnOptions<T> = ColumnMeta<T, unknown> & { id?: string; sortBy?: (row: T) => string | number | null };

/**
 * A column from a header and a cell renderer: the short form most tables need. Give `sortBy` to
 * make it sortable (the value rows are ordered by) and `id` when the header is not unique.
 */
export function column<T>(
  header: string,
  cell: (row: T) => React.ReactNode,
  opts: ColumnOptions<T> = {},
): ColumnDef<T, unknown> {
  const { id = header, sortBy, ...meta } = opts;
  return {
    id,
    header,
    ...(sortBy
      ? { accessorFn: (r: T) => sortBy(r) ?? undefined, enableSorting: true, sortUndefined: "last" as const }
      : { enableSorting: false }),
    cell: ({ row }) => cell(row.original),
    meta,
  };
}

export interface TableProps<T> {
  data: readonly T[];
  /** Column definitions, or a function given the `column` helper already typed for these rows. */
  columns: ColumnDef<T, unknown>[] | ((col: ColumnFactory<T>) => ColumnDef<T, unknown>[]);
  /** The table's accessible name (a caption read by screen readers). */
  caption: string;
  /** Said instead of the table when there are no rows. */
  empty: React.ReactNode;
  /** "cards" (default): one card per row below 900 px. "scroll": stays a table and scrolls sideways. */
  layout?: "cards" | "scroll";
  /** A row's React key and TanStack id; by default its `id`, else its `key`, else its index. */
  getRowId?: (row: T) => string;
  rowProps?: (
    row: T,
  ) => React.HTMLAttributes<HTMLTableRowElement> & Record<`data-${string}`, string | undefined>;
  sorting?: SortingState;
  /** Browser-side sorting: called with the new order when a header is pressed. */
  onSortingChange?: (next: SortingState) => void;
  /** Server-side sorting: the link a header goes to for the given column and direction. */
  sortHref?: (columnId: string, desc: boolean) => string;
  className?: string;
  /** Classes for the <table> itself (a minimum width for a wide table, for instance). */
  tableClassName?: string;
  /** Attributes for the <table> element (a test id, for instance). */
  tableProps?: Record<`data-${string}`, string>;
  /** Inside a Card: no border or shadow of its own. */
  bare?: boolean;
}

/**
 * What a table is, declared once beside its row type: its caption, what it says when empty, its
 * columns (and how rows are told apart, when not by `id` or `key`). Pages and components render it
 * with `<Table {...definition} data={rows} />`, adding only how this place shows it (`bare`, a class).
 */
export type TableDefinition<T> = Pick<TableProps<T>, "caption" | "empty" | "columns" | "getRowId">;

export function defineTable<T>(definition: TableDefinition<T>): TableDefinition<T> {
  return definition;
}

/** A row's own identity when it carries one (`id`, else `key`), so the rows keep their keys when sorted. */
export function defaultRowId(row: unknown, index: number): string {
  const r = row as { id?: unknown; key?: unknown };
  if (typeof r.id === "string" || typeof r.id === "number") return String(r.id);
  if (typeof r.key === "string" || typeof r.key === "number") return String(r.key);
  return String(index);
}

/** Builds the TanStack table without React state, so it works in server and client components alike. */
export function buildTable<T>(
  props: Pick<TableProps<T>, "data" | "columns" | "getRowId" | "sorting" | "onSortingChange" | "sortHref">,
): TanTable<T> {
  const sorting = props.sorting ?? [];
  const table = createTable<T>({
    data: props.data as T[],
    columns: typeof props.columns === "function" ? props.columns(column) : props.columns,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    manualSorting: Boolean(props.sortHref),
    enableSorting: Boolean(props.sortHref || props.onSortingChange),
    enableSortingRemoval: false,
    getRowId: props.getRowId ? (row: T) => props.getRowId!(row) : defaultRowId,
    state: {},
    onStateChange: () => {},
    onSortingChange: (updater) =>
      props.onSortingChange?.(typeof updater === "function" ? updater(sorting) : updater),
    renderFallbackValue: null,
  });
  table.setOptions((prev) => ({ ...prev, state: { ...table.initialState, sorting } }));
  return table;
}
