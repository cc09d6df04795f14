import { ScrollRegion } from "./scroll-region";
/** A plain, readable table for register lists. Columns right-align when marked numeric. */
export interface Column<T> {
  header: string;
  cell: (row: T) => React.ReactNode;
  numeric?: boolean;
}

export function SimpleTable<T extends { id: string }>({
  rows,
  columns,
  caption,
}: {
  rows: readonly T[];
  columns: readonly Column<T>[];
  caption: string;
}) {
  return (
    <ScrollRegion
      label={`${caption}, table`}
      className="rounded-card border border-graphite-200 bg-white shadow-sm"
    >
      <table className="w-full text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="border-b border-graphite-200 bg-graphite-50 text-graphite-600">
          <tr>
            {columns.map((c) => (
              <th
                key={c.header}
                scope="col"
                className={`px-4 py-3 font-medium ${c.numeric ? "text-right" : "text-left"}`}
              >
                {c.header}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-graphite-100">
          {rows.map((r) => (
            <tr key={r.id}>
              {columns.map((c) => (
                <td key={c.header} className={`px-4 py-3 ${c.numeric ? "num text-right" : ""}`}>
                  {c.cell(r)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollRegion>
  );
}
