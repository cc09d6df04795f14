/** The report's building blocks on the page: numbered sections, label/value rows, tables, decision text. */
import { ScrollRegion } from "@/components/ui/scroll-region";
import { RECORDED_DECISION_TEXT } from "@/lib/domain/decisions";
import type { Decision } from "@/lib/report/types";

/** The colour of an outcome on the online report; its words are RECORDED_DECISION_TEXT. */
export const DECISION_CLASS: Record<Decision, string> = {
  pass: "text-pass-700",
  fail: "text-fail-700",
  undecided: "text-undecided-700",
  not_measured: "text-unmeasured-600",
  recorded: "text-unmeasured-600",
};

/** A decision, and under it the rule and limit source it was judged by (ISO/IEC 17025:2017 §7.8.6.1). */
export function DecisionText({
  d,
  basis,
  bold = true,
}: {
  d: Decision;
  basis?: string | undefined;
  bold?: boolean;
}) {
  return (
    <>
      <span className={`${bold ? "font-semibold " : ""}${DECISION_CLASS[d]}`}>
        {RECORDED_DECISION_TEXT[d]}
      </span>
      {basis ? <span className="block text-xs font-normal text-graphite-600">{basis}</span> : null}
    </>
  );
}

export function Section({ n, title, children }: { n: number; title: string; children: React.ReactNode }) {
  return (
    <section className="space-y-2">
      <h3 className="border-b border-graphite-200 pb-1 text-base font-semibold">
        {n} {title}
      </h3>
      {children}
    </section>
  );
}

export function Rows({ rows }: { rows: Array<[string, string | undefined]> }) {
  return (
    <dl className="grid grid-cols-[minmax(7rem,auto)_minmax(0,1fr)] gap-x-6 gap-y-1 text-sm">
      {rows
        .filter((r): r is [string, string] => Boolean(r[1]))
        .map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="text-graphite-600">{k}</dt>
            <dd className="break-words">{v}</dd>
          </div>
        ))}
    </dl>
  );
}

export function ReportTable({
  head,
  rows,
  numeric = [],
}: {
  head: string[];
  rows: React.ReactNode[][];
  numeric?: number[];
}) {
  return (
    <ScrollRegion label={`Table: ${head.slice(0, 3).join(", ")}`}>
      <table className="w-full text-sm">
        <thead className="bg-graphite-50 text-graphite-600">
          <tr>
            {head.map((h, i) => (
              <th
                key={h}
                scope="col"
                className={`px-3 py-2 font-medium ${numeric.includes(i) ? "text-right" : "text-left"}`}
              >
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-graphite-100">
          {rows.map((r, i) => (
            <tr key={i}>
              {r.map((c, j) => (
                <td
                  key={j}
                  className={`px-3 py-2 ${numeric.includes(j) ? "num whitespace-nowrap text-right" : ""}`}
                >
                  {c}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </ScrollRegion>
  );
}
