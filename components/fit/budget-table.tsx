import type { BudgetTableRow } from "@/lib/budget-display";

/** The uncertainty budget (JCGM 100): per parameter its components, u_c and U (k = 2). */
export function BudgetTable({ rows }: { rows: readonly BudgetTableRow[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label="Uncertainty budget">
        <thead className="bg-graphite-50 text-graphite-600">
          <tr>
            <th scope="col" className="px-3 py-2 text-left font-medium">
              Parameter / component
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              u
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              Sensitivity c
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              Contribution |c|·u
            </th>
          </tr>
        </thead>
        {rows.map((r) => (
          <tbody key={r.parameter} className="border-t border-graphite-200">
            <tr>
              <th scope="rowgroup" colSpan={4} className="px-3 pt-2 text-left font-semibold">
                {r.parameter}
              </th>
            </tr>
            {r.components.map((c) => (
              <tr key={c.name}>
                <td className="px-3 py-1 pl-6 text-graphite-700">{c.name}</td>
                <td className="num px-3 py-1 text-right">{c.u}</td>
                <td className="num px-3 py-1 text-right">{c.sensitivity}</td>
                <td className="num px-3 py-1 text-right">
                  {c.contribution} {r.unit}
                </td>
              </tr>
            ))}
            <tr className="font-semibold">
              <td className="px-3 py-1 pl-6">Combined u_c; expanded U (k = 2)</td>
              <td colSpan={3} className="num px-3 py-1 text-right">
                u_c {r.uc} {r.unit}; U {r.U} {r.unit}
              </td>
            </tr>
          </tbody>
        ))}
      </table>
    </div>
  );
}
