import { ScrollRegion } from "@/components/ui/scroll-region";
import { DecisionBadge } from "@/components/readings/decision-badge";
import type { ParameterRow } from "@/lib/fit-display";

/**
 * The fitted parameters: ISO 230-1 symbol, words, value, expanded uncertainty, the job's limit and
 * its result by the decision rule, and whether this data could separate the parameter at all.
 */
export function ParameterTable({
  rows,
  warnings,
}: {
  rows: readonly ParameterRow[];
  warnings: readonly string[];
}) {
  const anyLimit = rows.some((r) => r.toleranceText);
  // Where the limits come from, said once below the table rather than on every row.
  const sources = [...new Set(rows.flatMap((r) => (r.limitSourceText ? [r.limitSourceText] : [])))];
  return (
    <>
      <ScrollRegion label="Fitted parameters table">
        <table className="w-full text-sm" aria-label="Fitted parameters">
          <thead>
            <tr className="border-b border-graphite-200 text-left text-graphite-600">
              <th className="py-2 pr-3 font-medium">Symbol</th>
              <th className="py-2 pr-3 font-medium">Parameter</th>
              <th className="py-2 pr-3 text-right font-medium">Value</th>
              <th className="py-2 pr-3 text-right font-medium">U (k = 2)</th>
              <th className="py-2 pr-3 text-right font-medium">Limit</th>
              <th className="py-2 pr-3 font-medium">Result</th>
              <th className="py-2 font-medium">Identifiable from this data</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((p) => (
              <tr
                key={p.key}
                data-key={p.key}
                data-decision={p.decision}
                className="border-b border-graphite-100 align-top"
              >
                <td className="num py-2 pr-3 font-semibold">{p.iso}</td>
                <td className="py-2 pr-3">
                  {p.words}
                  <span className="block text-xs text-graphite-500">{p.key}</span>
                </td>
                <td className="num whitespace-nowrap py-2 pr-3 text-right" data-value={p.value}>
                  {p.valueText}
                </td>
                <td className="num whitespace-nowrap py-2 pr-3 text-right">{p.UText}</td>
                <td
                  className="num whitespace-nowrap py-2 pr-3 text-right"
                  title={p.limitSourceText ?? undefined}
                >
                  {p.toleranceText ?? "—"}
                  {p.limitSourceText ? (
                    <span className="block font-sans text-xs text-graphite-500">
                      {p.limitSourceText.split(":")[0]}
                      {p.decisionRule === "guarded" ? " · guarded" : ""}
                    </span>
                  ) : null}
                </td>
                <td className="py-2 pr-3">
                  <DecisionBadge decision={p.decision} label={p.decisionText} />
                </td>
                <td className="py-2">
                  <span
                    className={
                      p.identifiable === "yes"
                        ? "text-pass-700"
                        : p.identifiable === "weak"
                          ? "text-accent-700"
                          : "text-fail-700"
                    }
                  >
                    {p.identifiable === "yes" ? "● " : p.identifiable === "weak" ? "◐ " : "○ "}
                    {p.identifiableText}
                  </span>
                  {p.heldAtZero ? <span className="text-graphite-600"> — held at 0</span> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollRegion>
      <p className="mt-3 text-xs text-graphite-600">
        {anyLimit
          ? "Limits come from the job's procedure version. Simple acceptance: pass inside the limits, U shown but not subtracted. Guarded acceptance (ISO 14253-1): pass only inside the limits narrowed by U, fail only outside them widened by U, undecided between."
          : "The job's procedure sets no limits for the head parameters: the values are recorded, not judged."}
        {sources.length ? ` Source of the limits: ${sources.join("; ")}.` : ""}
      </p>
      {warnings.length ? (
        <div className="mt-4 space-y-2" aria-label="Warnings">
          <h3 className="text-sm font-semibold">What the data cannot tell apart, and other warnings</h3>
          <ul className="list-disc space-y-1 pl-5 text-sm text-graphite-800">
            {warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </div>
      ) : null}
    </>
  );
}
