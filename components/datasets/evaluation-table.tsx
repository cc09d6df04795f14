import { DecisionBadge } from "@/components/readings/decision-badge";
import { Table } from "@/components/ui/table";
import type { TestPartResult } from "@/geometry";

const UNIT_SHOWN: Record<string, string> = { um: "µm", "um/m": "µm/m", deg: "°", arcsec: "″" };
const DIGITS: Record<string, number> = { mm: 4, in: 5, um: 1, deg: 4, arcsec: 1, "um/m": 1 };

const ROW_TINT: Record<string, string> = { fail: "bg-fail-50/60", undecided: "bg-undecided-50/60" };

function fmt(v: number | null, unit: string, signed = false): string {
  if (v === null) return "—";
  const s = v.toFixed(DIGITS[unit] ?? 4);
  return signed && v >= 0 ? `+${s}` : s.replace("-", "−");
}

/** Each feature's nominal, measured, limits, deviation, U and decision, with the totals. */
export function EvaluationTable({ result }: { result: TestPartResult }) {
  const { totals } = result;
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap gap-3" aria-label="Totals">
        {(["pass", "fail", "undecided"] as const).map((k) => (
          <div
            key={k}
            className="flex items-center gap-2 rounded-card border border-graphite-200 bg-white px-4 py-2 shadow-sm"
          >
            <DecisionBadge decision={k} />
            <span className="num text-lg font-semibold" data-testid={`total-${k}`}>
              {totals[k]}
            </span>
          </div>
        ))}
        <div className="flex items-center gap-2 rounded-card border border-graphite-200 bg-white px-4 py-2 text-sm text-graphite-700 shadow-sm">
          Features checked <span className="num text-lg font-semibold text-graphite-900">{totals.total}</span>
        </div>
      </div>
      <Table
        caption="Test-part evaluation"
        empty="The file named no features to evaluate."
        data={result.rows}
        rowProps={(r) => ({ className: ROW_TINT[r.decision] ?? "" })}
        columns={(column) => [
          column("Feature", (r) => r.feature, { className: "font-medium" }),
          column("Characteristic", (r) => r.characteristic),
          column("Nominal", (r) => fmt(r.nominal, r.unit), { numeric: true }),
          column("Measured", (r) => fmt(r.measured, r.unit), { numeric: true, className: "font-semibold" }),
          column("Deviation", (r) => fmt(r.deviation, r.unit, true), { numeric: true }),
          column(
            "Limits",
            (r) =>
              r.lower_limit === null
                ? `≤ ${fmt(r.upper_limit, r.unit)}`
                : `${fmt(r.lower_limit, r.unit)} … ${fmt(r.upper_limit, r.unit)}`,
            { numeric: true },
          ),
          column("± U (k = 2)", (r) => fmt(r.U, r.unit), { numeric: true }),
          column("Unit", (r) => UNIT_SHOWN[r.unit] ?? r.unit),
          column("Decision", (r) => <DecisionBadge decision={r.decision} />),
        ]}
      />
    </div>
  );
}
