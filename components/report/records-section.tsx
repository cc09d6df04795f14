/** The record details and traceability on the report page: the same content as the PDF's section 2a. */
import { ReportTable, Rows } from "@/components/report/report-parts";
import { TRACEABILITY_HEAD, traceabilityRows, type ReportRecords } from "@/lib/report/sections/records";

export function RecordsSection({ r }: { r: ReportRecords }) {
  return (
    <section className="space-y-3" aria-labelledby="record-details">
      <h3 id="record-details" className="border-b border-graphite-200 pb-1 text-base font-semibold">
        2a Record details and traceability
      </h3>
      <Rows
        rows={[
          ["Issuer", `${r.issuer.name}, ${r.issuer.address}`],
          ["Issuer contact", r.issuer.contact],
          ["Accreditation", r.issuer.accreditation],
          ["Customer contact", r.customerContact],
          ["Order reference", r.orderReference],
          ["Item", r.item],
          ["Condition as found", r.conditionAsFound],
          ["Deviations from the method", r.methodDeviations],
          ["Dates of the work", r.workDates],
          ["Date of issue", r.issueDate],
          ["Environment", r.environment.join("; ")],
          ["Units", r.units],
          ["Next re-check", r.nextRecheck],
          ["Software", r.software],
        ]}
      />
      <h4 className="text-sm font-semibold">Method and standards</h4>
      <ul className="list-disc space-y-1 pl-5 text-sm">
        {r.methods.map((m) => (
          <li key={m}>{m}</li>
        ))}
      </ul>
      <h4 className="text-sm font-semibold">Calibration traceability of the instruments</h4>
      {r.traceability.length ? (
        <ReportTable head={TRACEABILITY_HEAD} rows={traceabilityRows(r)} />
      ) : (
        <p className="text-sm text-graphite-600">No instrument is recorded with the readings.</p>
      )}
      <h4 className="text-sm font-semibold">Data behind each fit</h4>
      {r.fits.length ? (
        <ReportTable
          head={["Data file", "SHA-256", "Phase", "Computation"]}
          rows={r.fits.map((f) => [
            f.file,
            <span key="h" className="num break-all text-xs">
              {f.sha256}
            </span>,
            f.phase,
            f.computation,
          ])}
        />
      ) : (
        <p className="text-sm text-graphite-600">No fit is part of this report.</p>
      )}
    </section>
  );
}

/** The closing statements: the results relate only to the item tested; reproduction only in full. */
export function ClosingStatements({ r }: { r: ReportRecords }) {
  return (
    <div className="space-y-1 text-sm">
      <p className="font-semibold">{r.relatesOnly}</p>
      <p>{r.issuer.reproduction}</p>
    </div>
  );
}
