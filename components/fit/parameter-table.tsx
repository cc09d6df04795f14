import { Table } from "@/components/ui/table";
import { DecisionBadge } from "@/components/readings/decision-badge";
import type { ParameterRow } from "@/lib/fit-display";
import { DECISION_RULE_MEANINGS } from "@/lib/domain/decisions";

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
      <Table
        caption="Fitted parameters"
        empty="The fit gave no parameters."
        bare
        data={rows}
        rowProps={(p) => ({ "data-key": p.key, "data-decision": p.decision, className: "align-top" })}
        columns={(column) => [
          column("Symbol", (p) => p.iso, { className: "num font-semibold" }),
          column("Parameter", (p) => (
            <>
              {p.words}
              <span className="block text-xs text-graphite-500">{p.key}</span>
            </>
          )),
          column("Value", (p) => p.valueText, {
            numeric: true,
            cellProps: (p) => ({ "data-value": p.value }),
          }),
          column("U (k = 2)", (p) => p.UText, { numeric: true }),
          column("Limit", (p) => <LimitCell row={p} />, {
            numeric: true,
            cellProps: (p) => ({ title: p.limitSourceText ?? undefined }),
          }),
          column("Result", (p) => <DecisionBadge decision={p.decision} label={p.decisionText} />),
          column("Identifiable from this data", (p) => <Identifiable row={p} />),
        ]}
      />
      <p className="mt-3 text-xs text-graphite-600">
        {anyLimit
          ? `Limits come from the job's procedure version. ${DECISION_RULE_MEANINGS.simple} ${DECISION_RULE_MEANINGS.guarded}`
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

function LimitCell({ row: p }: { row: ParameterRow }) {
  return (
    <>
      {p.toleranceText ?? "—"}
      {p.limitSourceText ? (
        <span className="block font-sans text-xs text-graphite-500">
          {p.limitSourceText.split(":")[0]}
          {p.decisionRule === "guarded" ? " · guarded" : ""}
        </span>
      ) : null}
    </>
  );
}

const IDENTIFIABLE = {
  yes: ["text-pass-700", "● "],
  weak: ["text-accent-700", "◐ "],
  no: ["text-fail-700", "○ "],
} as const;

function Identifiable({ row: p }: { row: ParameterRow }) {
  const [cls, mark] = IDENTIFIABLE[p.identifiable as keyof typeof IDENTIFIABLE] ?? IDENTIFIABLE.no;
  return (
    <>
      <span className={cls}>
        {mark}
        {p.identifiableText}
      </span>
      {p.heldAtZero ? <span className="text-graphite-600"> — held at 0</span> : null}
    </>
  );
}
