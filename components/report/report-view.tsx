import { DecisionText, ReportTable, Rows, Section } from "@/components/report/report-parts";
import { ConformityStatement } from "@/components/report/conformity-statement";
import { BudgetReportSection } from "@/components/report/budget-section";
import { ControlValuesReportSection } from "@/components/report/control-values-section";
import { PhotoAppendixSection } from "@/components/report/photo-appendix";
import { PositioningReportSection } from "@/components/report/positioning-section";
import { ReportFigures } from "@/components/report/report-charts";
import { reportFacts } from "@/lib/report/build";
import { ClosingStatements, RecordsSection } from "@/components/report/records-section";
import type { Decision, ReportData } from "@/lib/report/types";

/** A value as recorded over the mm beside it: "0.0003 in (0.008 mm)" as two lines, as in the PDF. */
function UnitLines({ v }: { v: string | undefined }) {
  if (!v) return <>—</>;
  const at = v.indexOf(" (");
  if (at < 0) return <>{v}</>;
  return (
    <>
      {v.slice(0, at)}
      <span className="block text-xs text-graphite-600">{v.slice(at + 1)}</span>
    </>
  );
}

/** The report read online: the same content, in the same order, as the signed PDF. */
export function ReportView({ data }: { data: ReportData }) {
  const dec = (d: Decision, basis?: string) => <DecisionText d={d} basis={basis} />;
  const facts = reportFacts(data);
  return (
    <article
      className="space-y-6 rounded-card border border-graphite-200 bg-white p-6 shadow-sm"
      aria-label="Acceptance report"
    >
      <header className="flex flex-wrap items-start justify-between gap-4 border-b-2 border-graphite-900 pb-3">
        <div>
          <h2 className="text-xl font-semibold">Acceptance report — two-axis head</h2>
          <p className="text-sm text-graphite-600">
            {[data.issuer.name, data.issuer.address, data.issuer.contact].filter(Boolean).join(" · ")}
          </p>
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
          <Rows rows={facts.machine} />
          <Rows rows={facts.head} />
        </div>
      </Section>
      <Section n={2} title="Work, method and decision rule">
        <Rows rows={facts.work} />
      </Section>
      {data.records ? <RecordsSection r={data.records} /> : null}
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
            head={["Step", "Limits", "Before", "After", "Change", "U (k = 2)", "Result"]}
            numeric={[2, 3, 4, 5]}
            rows={data.readings.map((r) => [
              r.step,
              <UnitLines key="l" v={r.limits} />,
              <UnitLines key="b" v={r.pre} />,
              <UnitLines key="a" v={r.post} />,
              <UnitLines key="c" v={r.change} />,
              <UnitLines key="u" v={r.expanded} />,
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
        <PositioningReportSection tests={data.rotaryPositioning} />
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
      <PhotoAppendixSection rows={data.photos} />
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
      {data.records ? <ClosingStatements r={data.records} /> : null}
      <p className="border-t-2 border-graphite-900 pt-2 text-center text-sm font-semibold">END OF REPORT</p>
    </article>
  );
}
