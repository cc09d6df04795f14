import { BudgetTable } from "@/components/fit/budget-table";
import type { ReportBudget } from "@/lib/report/sections/budget";

/** The report page's 5.3: the same budget and words as the PDF. */
export function BudgetReportSection({ budget }: { budget: ReportBudget | undefined }) {
  if (!budget) return null;
  return (
    <div className="space-y-2">
      <h4 className="pt-2 text-sm font-semibold">5.3 Uncertainty budget of the head parameters (JCGM 100)</h4>
      <p className="text-sm text-graphite-600">{budget.inputs}</p>
      <BudgetTable rows={budget.rows} />
      {budget.notes.map((n) => (
        <p key={n} className="text-sm text-graphite-600">
          Note: {n}.
        </p>
      ))}
    </div>
  );
}
