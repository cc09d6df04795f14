import { ScrollRegion } from "@/components/ui/scroll-region";
import { DecisionBadge } from "@/components/readings/decision-badge";
import type { TestPartResult } from "@/geometry";

const UNIT_SHOWN: Record<string, string> = { um: "µm", "um/m": "µm/m", deg: "°", arcsec: "″" };
const DIGITS: Record<string, number> = { mm: 4, in: 5, um: 1, deg: 4, arcsec: 1, "um/m": 1 };

function fmt(v: number | null, unit: string, signed = false): string {
  if (v === null) return "—";
  const s = v.toFixed(DIGITS[unit] ?? 4);
  return signed && v >= 0 ? `+${s}` : s.replace("-", "−");
}

export const RULE_TEXT = {
  simple:
    "Simple acceptance: a value inside its limits passes and outside fails; the expanded uncertainty U is shown, not subtracted.",
  guarded:
    "Per ISO 14253-1, a feature passes only inside its limits shrunk by U, fails only outside its limits grown by U, and is undecided between — there neither conformance nor non-conformance is proven.",
} as const;

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
      <ScrollRegion
        label="Test-part evaluation, table"
        className="rounded-card border border-graphite-200 bg-white shadow-sm"
      >
        <table className="w-full text-sm" aria-label="Test-part evaluation">
          <thead className="border-b border-graphite-200 bg-graphite-50 text-graphite-600">
            <tr>
              <th scope="col" className="px-2 py-3 lg:px-4 text-left font-medium">
                Feature
              </th>
              <th scope="col" className="px-2 py-3 lg:px-4 text-left font-medium">
                Characteristic
              </th>
              <th scope="col" className="px-2 py-3 lg:px-4 text-right font-medium">
                Nominal
              </th>
              <th scope="col" className="px-2 py-3 lg:px-4 text-right font-medium">
                Measured
              </th>
              <th scope="col" className="px-2 py-3 lg:px-4 text-right font-medium">
                Deviation
              </th>
              <th scope="col" className="px-2 py-3 lg:px-4 text-right font-medium">
                Limits
              </th>
              <th scope="col" className="px-2 py-3 lg:px-4 text-right font-medium">
                ± U (k = 2)
              </th>
              <th scope="col" className="px-2 py-3 lg:px-4 text-left font-medium">
                Unit
              </th>
              <th scope="col" className="px-2 py-3 lg:px-4 text-left font-medium">
                Decision
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-graphite-100">
            {result.rows.map((r, i) => (
              <tr
                key={i}
                className={
                  r.decision === "fail"
                    ? "bg-fail-50/60"
                    : r.decision === "undecided"
                      ? "bg-undecided-50/60"
                      : ""
                }
              >
                <td className="px-2 py-2.5 lg:px-4 font-medium">{r.feature}</td>
                <td className="px-2 py-2.5 lg:px-4">{r.characteristic}</td>
                <td className="num px-2 py-2.5 lg:px-4 text-right">{fmt(r.nominal, r.unit)}</td>
                <td className="num px-2 py-2.5 lg:px-4 text-right font-semibold">
                  {fmt(r.measured, r.unit)}
                </td>
                <td className="num px-2 py-2.5 lg:px-4 text-right">{fmt(r.deviation, r.unit, true)}</td>
                <td className="num px-2 py-2.5 lg:px-4 text-right whitespace-nowrap">
                  {r.lower_limit === null
                    ? `≤ ${fmt(r.upper_limit, r.unit)}`
                    : `${fmt(r.lower_limit, r.unit)} … ${fmt(r.upper_limit, r.unit)}`}
                </td>
                <td className="num px-2 py-2.5 lg:px-4 text-right">{fmt(r.U, r.unit)}</td>
                <td className="px-2 py-2.5 lg:px-4">{UNIT_SHOWN[r.unit] ?? r.unit}</td>
                <td className="px-2 py-2.5 lg:px-4">
                  <DecisionBadge decision={r.decision} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollRegion>
    </div>
  );
}
