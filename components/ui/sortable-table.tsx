"use client";

import { useState } from "react";
import { Table, type SortingState, type TableProps } from "./table";

/** A Table sorted in the browser; pass `initialSorting` for the order it opens in. */
export function SortableTable<T>({
  initialSorting = [],
  ...props
}: Omit<TableProps<T>, "sorting" | "onSortingChange" | "sortHref"> & { initialSorting?: SortingState }) {
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  return <Table {...props} sorting={sorting} onSortingChange={setSorting} />;
}
