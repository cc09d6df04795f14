import { PositioningChart } from "@/components/charts/positioning-chart";
import { DECISION_CLASS, ReportTable } from "@/components/report/report-parts";
import { RECORDED_DECISION_TEXT } from "@/lib/domain/decisions";
import type { ReportPositioningTest } from "@/lib/report/sections/positioning";

/**
 * One rotary axis's ISO 230-2 positioning test: the quantities bidirectional and per direction,
 * the limits with their source and results, and the chart of the means ± 2s. The dataset page and
 * the report page (5.4) both show it, with the same words as the PDF.
 */
export function PositioningTestBlock({ test }: { test: ReportPositioningTest }) {
  return (
    <div className="space-y-2" data-testid="positioning-test">
      <p className="text-sm text-graphite-600">
        {test.file}: {test.basis} Result:{" "}
        <span className={`font-semibold ${DECISION_CLASS[test.decision]}`} data-positioning-decision>
          {RECORDED_DECISION_TEXT[test.decision]}
        </span>
      </p>
      <ReportTable
        head={[
          "Quantity",
          "Symbol",
          "Both directions",
          "Positive ↑",
          "Negative ↓",
          "Limit",
          "Source",
          "Result",
        ]}
        numeric={[2, 3, 4, 5]}
        rows={test.rows.map((r) => [
          r.quantity,
          r.symbol,
          r.both,
          r.pos,
          r.neg,
          r.limit,
          r.source,
          <span key="d" className={DECISION_CLASS[r.decision]}>
            {RECORDED_DECISION_TEXT[r.decision]}
            {r.reason ? ` — ${r.reason}` : ""}
          </span>,
        ])}
      />
      {test.warnings.length ? <p className="text-sm text-accent-800">{test.warnings.join(" ")}</p> : null}
      <PositioningChart chart={test.chart} title={`Positioning of the ${test.axis}: mean ± 2s per target`} />
    </div>
  );
}

/** The report page's 5.4: each rotary axis's positioning test. */
export function PositioningReportSection({ tests }: { tests: ReportPositioningTest[] | undefined }) {
  if (!tests?.length) return null;
  return (
    <div className="space-y-3" aria-label="Positioning of the rotary axes">
      <h4 className="pt-2 text-sm font-semibold">5.4 Positioning of the rotary axes (ISO 230-2)</h4>
      {tests.map((t) => (
        <div key={t.axis + t.file} className="space-y-1">
          <h5 className="text-sm font-semibold">{t.axis[0]!.toUpperCase() + t.axis.slice(1)}</h5>
          <PositioningTestBlock test={t} />
        </div>
      ))}
    </div>
  );
}
