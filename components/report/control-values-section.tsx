import { DecisionText, ReportTable } from "@/components/report/report-parts";
import type { ReportControlValues } from "@/lib/report/sections/control";

/** The report page's control-values part of section 5: the same rows and words as the PDF's 5.1. */
export function ControlValuesReportSection({ section }: { section: ReportControlValues | undefined }) {
  if (!section) return null;
  return (
    <div className="space-y-2" aria-label="Values for the control">
      <h4 className="pt-2 text-sm font-semibold">5.1 Values for the control: as found, to enter, as left</h4>
      <p className="text-sm text-graphite-600">{section.basis}</p>
      {section.rows.length === 0 ? (
        <p className="text-sm text-graphite-600">No control values were recorded.</p>
      ) : null}
      <ReportTable
        head={["Setting", "As found", "Correction", "Value to enter", "As left", "Check"]}
        numeric={[1, 2, 3, 4]}
        rows={section.rows.map((r) => [
          r.setting,
          r.asFound,
          r.correction,
          <strong key="e">{r.toEnter}</strong>,
          r.asLeft,
          r.check && r.check !== "As computed" ? (
            <span key="c" className="font-semibold text-fail-700">
              {r.check}
            </span>
          ) : (
            r.check || "—"
          ),
        ])}
      />
      {section.recorded.map((t) => (
        <p key={t} className="text-sm text-graphite-600">
          {t}
        </p>
      ))}
      <p className="text-sm text-graphite-700">
        <span className="font-semibold">Sign convention:</span> {section.signConvention}
      </p>
      <p className="rounded-card border-2 border-accent-500 bg-accent-50 p-3 text-sm">⚠ {section.caution}</p>
      {section.tcpCheck ? (
        <div className="space-y-2" aria-label="Tool-centre-point check">
          <h4 className="pt-2 text-sm font-semibold">5.2 Tool-centre-point check after compensation</h4>
          <p className="text-sm text-graphite-600">
            {section.tcpCheck.file}: {section.tcpCheck.basis}
          </p>
          <ReportTable
            head={["Figure", "Value", "Limit", "Result"]}
            numeric={[1, 2]}
            rows={section.tcpCheck.rows.map((r) => [
              r.quantity,
              r.value,
              r.limit,
              <DecisionText key="d" d={r.decision} basis={r.basis} bold={false} />,
            ])}
          />
        </div>
      ) : null}
    </div>
  );
}
