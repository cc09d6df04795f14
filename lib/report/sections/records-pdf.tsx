/**
 * The record details and traceability in the PDF (lib/report/sections/records.ts builds them):
 * "2a Record details and traceability" after the method, and the closing statements before the
 * end of the report. Styled like lib/report/document.tsx's own sections.
 */
import { StyleSheet, Text, View } from "@react-pdf/renderer";
import { pdfColours, pdfSectionStyles } from "../pdf-styles";
import { PdfHeadRow } from "./pdf-head-row";
import { TRACEABILITY_HEAD, traceabilityRows, type ReportRecords } from "./records";

const s = {
  ...pdfSectionStyles,
  ...StyleSheet.create({
    row: { flexDirection: "row", marginBottom: 2 },
    label: { width: 110, color: pdfColours.muted },
    value: { flex: 1 },
  }),
};

function Fact({ k, v }: { k: string; v: string }) {
  return (
    <View style={s.row} wrap={false}>
      <Text style={s.label}>{k}</Text>
      <Text style={s.value}>{v}</Text>
    </View>
  );
}

function Grid({ head, widths, rows }: { head: string[]; widths: string[]; rows: string[][] }) {
  return (
    <View style={s.table}>
      <PdfHeadRow cols={head.map((h, i) => [h, widths[i]!] as const)} />
      {rows.map((r, i) => (
        <View key={i} style={s.tr} wrap={false}>
          {r.map((c, j) => (
            <Text key={j} style={[s.td, { width: widths[j] }]}>
              {c}
            </Text>
          ))}
        </View>
      ))}
    </View>
  );
}

/** Section 2a: who issued, for whom, what item, how, when, where, with what traceable equipment and software. */
export function RecordDetailsPdf({ r }: { r: ReportRecords }) {
  return (
    <View>
      <Text style={s.h2} minPresenceAhead={60}>
        2a Record details and traceability
      </Text>
      <Fact k="Issuer" v={`${r.issuer.name}, ${r.issuer.address}`} />
      <Fact k="Issuer contact" v={r.issuer.contact} />
      <Fact k="Accreditation" v={r.issuer.accreditation} />
      <Fact k="Customer contact" v={r.customerContact} />
      <Fact k="Order reference" v={r.orderReference} />
      <Fact k="Item" v={r.item} />
      <Fact k="Condition as found" v={r.conditionAsFound} />
      <Fact k="Deviations from the method" v={r.methodDeviations} />
      <Fact k="Dates of the work" v={r.workDates} />
      <Fact k="Date of issue" v={r.issueDate} />
      {r.environment.map((e, i) => (
        <Fact key={i} k={i === 0 ? "Environment" : ""} v={e} />
      ))}
      <Fact k="Units" v={r.units} />
      <Fact k="Next re-check" v={r.nextRecheck} />
      <Fact k="Software" v={r.software} />

      <Text style={s.h3} minPresenceAhead={30}>
        Method and standards
      </Text>
      {r.methods.map((m, i) => (
        <Text key={i} style={{ marginBottom: 1.5 }}>
          • {m}
        </Text>
      ))}

      <Text style={s.h3} minPresenceAhead={30}>
        Calibration traceability of the instruments
      </Text>
      {r.traceability.length ? (
        <Grid
          head={TRACEABILITY_HEAD}
          widths={["22%", "13%", "18%", "13%", "21%", "13%"]}
          rows={traceabilityRows(r)}
        />
      ) : (
        <Text style={{ color: pdfColours.muted }}>No instrument is recorded with the readings.</Text>
      )}

      <Text style={s.h3} minPresenceAhead={30}>
        Data behind each fit
      </Text>
      {r.fits.length ? (
        r.fits.map((f, i) => (
          <View key={i} wrap={false} style={{ marginBottom: 3 }}>
            <Fact k="Data file" v={f.file} />
            <View style={s.row}>
              <Text style={s.label}>SHA-256</Text>
              <Text style={[s.value, s.mono, { fontSize: 7 }]}>{f.sha256}</Text>
            </View>
            <Fact k="Phase" v={f.phase} />
            <Fact k="Computation version" v={f.computation} />
          </View>
        ))
      ) : (
        <Text style={{ color: pdfColours.muted }}>No fit is part of this report.</Text>
      )}
    </View>
  );
}

/** The closing statements: the results relate only to the item tested (§7.8.2.1 k); reproduction only in full. */
export function ClosingStatementsPdf({ r }: { r: ReportRecords }) {
  return (
    <View wrap={false} style={{ marginTop: 10 }}>
      <Text style={{ fontWeight: 700 }}>{r.relatesOnly}</Text>
      <Text>{r.issuer.reproduction}</Text>
    </View>
  );
}
