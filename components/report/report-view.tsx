import { DECISION, ReportTable, Rows, Section } from "@/components/report/report-parts";
import { ConformityStatement } from "@/components/report/conformity-statement";
import { BudgetReportSection } from "@/components/report/budget-section";
import { ControlValuesReportSection } from "@/components/report/control-values-section";
import { ReportFigures } from "@/components/report/report-charts";
import type { Decision, ReportData } from "@/lib/report/types";

/** The report read online: the same content, in the same order, as the signed PDF. */
export function ReportView({ data }: { data: ReportData }) {
  // The decision, and under it the rule and limit source it was judged by (ISO/IEC 17025:2017 §7.8.6.1).
  const dec = (d: Decision, basis?: string) => (
    <>
      <span className={`font-semibold ${DECISION[d].cls}`}>{DECISION[d].text}</span>
      {basis ? <span className="block text-xs font-normal text-graphite-600">{basis}</span> : null}
    </>
  );
  return (
    <article
      className="space-y-6 rounded-card border border-graphite-200 bg-white p-6 shadow-sm"
      aria-label="Acceptance report"
    >
      <header className="flex flex-wrap items-start justify-between gap-4 border-b-2 border-graphite-900 pb-3">
        <div>
          <h2 className="text-xl font-semibold">Acceptance report — two-axis head</h2>
          <p className="text-sm text-graphite-600">{data.issuer.name}</p>
        </div>
        <div className="text-right text-sm">
          <p className="num font-semibold">{data.reference}</p>
          <p className="text-graphite-600">
            revision {data.revision} · issued {data.issuedAtUtc ?? "—"}
          </p>
          <p className="num text-xs text-graphite-500">{data.reportId}</p>
        </div>
      </header>
      {data.amendment ? (
        <p className="rounded-card border-2 border-accent-500 bg-accent-50 p-3 text-sm">
          <strong>Amendment:</strong> supersedes revision {data.amendment.supersedesRevision}.{" "}
          {data.amendment.reason}
        </p>
      ) : null}
      {data.conformity ? <ConformityStatement conformity={data.conformity} /> : null}
      <Section n={1} title="Identification">
        <div className="grid gap-4 md:grid-cols-2">
          <Rows
            rows={[
              ["Customer", data.customer.name],
              ["Site", [data.customer.site, data.customer.address].filter(Boolean).join(", ")],
              ["Host machine", `${data.machine.name} (${data.machine.kind})`],
              ["Builder, model", data.machine.builderModel],
              ["Machine serial", data.machine.serial],
            ]}
          />
          <Rows
            rows={[
              ["Head serial", data.head.serial],
              ["Maker, model", data.head.makerModel],
              ["Axes", data.head.axes],
              ["Nominal pivot length", data.head.nominalPivotLength],
              ["Mass", data.head.mass],
            ]}
          />
        </div>
      </Section>
      <Section n={2} title="Work, method and decision rule">
        <Rows
          rows={[
            ["Job", `${data.work.title} (${data.work.kind})`],
            ["Dates of work", data.work.dates],
            ["Procedure", data.work.procedure],
            ["Method", data.work.method],
            ["Decision rule", data.work.decisionRule],
            ["Environment", data.work.airTemperature],
          ]}
        />
      </Section>
      <Section n={3} title="Instruments">
        {data.instruments.length ? (
          <ReportTable
            head={["Instrument", "Serial", "Resolution", "Std. uncertainty", "Calibration due", "Status"]}
            numeric={[2, 3]}
            rows={data.instruments.map((r) => [
              r.kind,
              r.serial,
              r.resolution,
              r.uncertainty,
              r.calibrationDue,
              r.status,
            ])}
          />
        ) : (
          <p className="text-sm text-graphite-600">No instruments were recorded.</p>
        )}
      </Section>
      <Section n={4} title="Readings before and after adjustment">
        {data.readings.length ? (
          <ReportTable
            head={["Step", "Limits", "Before", "After", "Change", "Result"]}
            numeric={[2, 3, 4]}
            rows={data.readings.map((r) => [
              r.step,
              r.limits,
              r.pre ?? "—",
              r.post ?? "—",
              r.change ?? "—",
              dec(r.decision, r.basis),
            ])}
          />
        ) : (
          <p className="text-sm text-graphite-600">No checklist readings.</p>
        )}
      </Section>
      <Section n={5} title="Kinematic parameters of the head">
        {data.parameters.length ? (
          <ReportTable
            head={["Parameter", "ISO 230-1", "Value", "U (k = 2)", "Tolerance", "Identifiable", "Result"]}
            numeric={[2, 3, 4]}
            rows={data.parameters.map((p) => [
              p.name,
              p.symbol,
              p.value,
              p.expanded === "—" ? "—" : `± ${p.expanded}`,
              p.tolerance ?? "—",
              p.identifiable,
              dec(p.decision, p.basis),
            ])}
          />
        ) : (
          <p className="text-sm text-graphite-600">No kinematic fit is part of this report.</p>
        )}
        <ControlValuesReportSection section={data.controlValues} />
        <BudgetReportSection budget={data.budget} />
      </Section>
      <Section n={6} title="Test part">
        {data.testPart.length ? (
          <ReportTable
            head={["Feature", "Characteristic", "Nominal", "Measured", "Deviation", "Limits", "U", "Result"]}
            numeric={[2, 3, 4, 5, 6]}
            rows={data.testPart.map((r) => [
              r.feature,
              r.characteristic,
              r.nominal,
              r.measured,
              r.deviation,
              r.limits,
              r.expanded,
              dec(r.decision, r.basis),
            ])}
          />
        ) : (
          <p className="text-sm text-graphite-600">No test part was measured for this report.</p>
        )}
      </Section>
      <Section n={7} title="Figures and charts">
        <ReportFigures data={data} />
      </Section>
      <Section n={8} title="Deviations and remarks">
        {data.remarks.length || data.deviations?.length ? (
          <ul className="list-disc pl-5 text-sm">
            {(data.deviations ?? []).map((x, i) => (
              <li key={`d${i}`}>
                <strong>Deviation:</strong> {x.result} ({x.decision}) is carried into this report.
                Justification: {x.justification} Approved by {x.approvedBy}, {x.recordedAtUtc}.
              </li>
            ))}
            {data.remarks.map((r, i) => (
              <li key={i}>{r}</li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-graphite-600">None.</p>
        )}
      </Section>
      <Section n={9} title="Safety">
        <ul className="space-y-1 rounded-card border-2 border-accent-500 bg-accent-50 p-3 text-sm">
          {data.safety.map((t, i) => (
            <li key={i}>⚠ {t}</li>
          ))}
        </ul>
      </Section>
      <Section n={10} title="Signatures">
        <ul className="grid gap-3 md:grid-cols-2">
          {data.signatures.map((g, i) => (
            <li key={i} className="rounded-card border border-graphite-200 p-3 text-sm">
              <p className="font-semibold">{g.meaning}</p>
              <p>
                {g.name} — {g.role}
              </p>
              <p className="num">{g.signedAtUtc}</p>
            </li>
          ))}
        </ul>
      </Section>
      <p className="border-t-2 border-graphite-900 pt-2 text-center text-sm font-semibold">END OF REPORT</p>
    </article>
  );
}
