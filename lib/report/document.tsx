/**
 * The acceptance report as a PDF document (@react-pdf/renderer). Contents follow ISO/IEC 17025
 * §7.8 as far as they apply to field verification of a machine: identification of the report,
 * the issuer, the customer and the item; dates; the method and the decision rule; instruments and
 * their calibration status; environment; results with limits and uncertainty; deviations and
 * remarks; signatures with name, meaning and time; a clear end of report.
 */
import { RECORDED_DECISION_TEXT } from "@/lib/domain/decisions";
import { palette } from "@/lib/domain/theme";
import {
  Circle,
  Document,
  Image,
  Line,
  Page,
  Path,
  Rect,
  StyleSheet,
  Svg,
  Text,
  View,
} from "@react-pdf/renderer";
import { reportFacts } from "./build";
import type { Decision, ReportData } from "./types";
import { BODY_FONT } from "./fonts";
import { pdfColours, pdfSectionStyles } from "./pdf-styles";
import { reportCharts } from "./chart-data";
import { LimitRowsChart, ResidualsChart } from "./charts";
import { PhotoAppendix } from "./sections/photos";
import { ClosingStatementsPdf, RecordDetailsPdf } from "./sections/records-pdf";
import { BudgetPdf } from "./sections/budget";
import { ControlValuesPdf } from "./sections/control-pdf";
import { PositioningPdf } from "./sections/positioning-pdf";

const C = {
  ...pdfColours,
  nominal: palette.nominal[500],
  pass: palette.pass[700],
  undecided: palette.undecided[700],
  none: palette.unmeasured[600],
};

const s = {
  ...pdfSectionStyles,
  ...StyleSheet.create({
    page: {
      fontFamily: BODY_FONT as unknown as string,
      fontSize: 8.5,
      color: C.ink,
      paddingTop: 44,
      paddingBottom: 56,
      paddingHorizontal: 40,
    },
    header: {
      flexDirection: "row",
      justifyContent: "space-between",
      alignItems: "flex-start",
      borderBottomWidth: 1.5,
      borderBottomColor: C.ink,
      paddingBottom: 8,
      marginBottom: 12,
    },
    title: { fontSize: 15, fontWeight: 700, lineHeight: 1.2 },
    subtitle: { fontSize: 9, color: C.muted, marginTop: 2 },
    idBox: { alignItems: "flex-end", flexShrink: 0, marginLeft: 12 },
    grid: { flexDirection: "row", gap: 16 },
    col: { flex: 1 },
    factRow: { flexDirection: "row", marginBottom: 2 },
    factLabel: { width: 92, color: C.muted },
    factValue: { flex: 1 },
    footerRule: {
      position: "absolute",
      bottom: 36,
      left: 40,
      right: 40,
      borderTopWidth: 0.5,
      borderTopColor: C.rule,
    },
    // Dynamic (render) text vanishes under a line height: none here, nor on the page.
    footerText: { position: "absolute", bottom: 24, fontSize: 7, color: C.muted, fontFamily: "PlexSans" },
    sigBox: { width: "48%", borderWidth: 0.75, borderColor: C.rule, padding: 7, marginBottom: 8 },
    end: {
      marginTop: 14,
      paddingTop: 6,
      borderTopWidth: 1.5,
      borderTopColor: C.ink,
      textAlign: "center",
      fontWeight: 700,
    },
  }),
};

const DECISION_COLOUR: Record<Decision, string> = {
  pass: C.pass,
  fail: C.fail,
  undecided: C.undecided,
  not_measured: C.none,
  recorded: C.none,
};

/** The decision, and under it the rule and limit source it was judged by (ISO/IEC 17025:2017 §7.8.6.1). */
function DecisionCell({ d, width, basis }: { d: Decision; width: string; basis?: string | undefined }) {
  return (
    <View style={[s.td, { width }]}>
      <Text style={{ color: DECISION_COLOUR[d], fontWeight: 700 }}>{RECORDED_DECISION_TEXT[d]}</Text>
      {basis ? <Text style={{ color: C.muted, fontSize: 6.5 }}>{basis}</Text> : null}
    </View>
  );
}

/** The mm beside an inch value on a line of its own: "0.0003 in (0.008 mm)" prints as "0.0003 in" over "(0.008 mm)". */
function unitCell(v: string | undefined): string {
  if (!v) return "—";
  return v.replace(/ \(/, "\n(");
}

function Facts({ rows }: { rows: Array<[string, string | undefined]> }) {
  return (
    <View>
      {rows
        .filter((r): r is [string, string] => Boolean(r[1]))
        .map(([k, v]) => (
          <View key={k} style={s.factRow}>
            <Text style={s.factLabel}>{k}</Text>
            <Text style={s.factValue}>{v}</Text>
          </View>
        ))}
    </View>
  );
}

type Col<T> = {
  header: string;
  width: string;
  cell: (r: T) => string;
  numeric?: boolean;
  /** Renders the cell itself (e.g. a decision with its basis) instead of the text of `cell`. */
  node?: (r: T, width: string) => React.ReactElement;
};

function Table<T>({ rows, cols, empty }: { rows: readonly T[]; cols: readonly Col<T>[]; empty: string }) {
  if (rows.length === 0) return <Text style={{ color: C.muted }}>{empty}</Text>;
  return (
    <View style={s.table}>
      <View style={[s.tr, s.th]} fixed>
        {cols.map((c) => (
          <Text key={c.header} style={[s.td, { width: c.width }, c.numeric ? { textAlign: "right" } : {}]}>
            {c.header}
          </Text>
        ))}
      </View>
      {rows.map((r, i) => (
        <View key={i} style={s.tr} wrap={false}>
          {cols.map((c) =>
            c.node ? (
              <View key={c.header} style={{ width: c.width }}>
                {c.node(r, "100%")}
              </View>
            ) : (
              <Text key={c.header} style={[s.td, { width: c.width }, c.numeric ? s.num : {}]}>
                {c.cell(r)}
              </Text>
            ),
          )}
        </View>
      ))}
    </View>
  );
}

function Mark() {
  return (
    <Svg width={22} height={22} viewBox="0 0 32 32">
      <Rect x={1} y={1} width={30} height={30} rx={7} fill={palette.graphite[800]} />
      <Line x1={8} y1={24} x2={24} y2={8} stroke={palette.nominal[300]} strokeWidth={2.2} />
      <Line x1={8} y1={8} x2={24} y2={24} stroke={palette.nominal[300]} strokeWidth={2.2} />
      <Path d="M9.5 19.5 A 9 9 0 0 1 19.5 9.5" stroke={palette.accent[500]} strokeWidth={2.6} fill="none" />
      <Circle cx={16} cy={16} r={2.2} fill={palette.accent[500]} />
    </Svg>
  );
}

function DecisionWithRowsOf<T extends { decision: Decision }>(rows: readonly T[]) {
  const count = (d: Decision) => rows.filter((r) => r.decision === d).length;
  return `${count("pass")} pass · ${count("fail")} fail · ${count("undecided")} undecided${count("not_measured") ? ` · ${count("not_measured")} not measured` : ""}`;
}

/** The picture at its own aspect ratio, as wide as the text (515 pt) and at most 260 pt high. */
function figureSize(w: number, h: number) {
  const height = Math.min(260, (515 * h) / Math.max(1, w));
  return { width: (height * w) / Math.max(1, h), height, alignSelf: "center" as const };
}

/**
 * Section 7: the saved pictures of the 3D view, then the charts drawn from the report's numbers.
 * Figures are numbered in order; a missing picture is said, not skipped silently.
 */
function FiguresAndCharts({ data, images }: { data: ReportData; images: ReadonlyMap<string, Buffer> }) {
  const chartList = reportCharts(data.charts);
  let n = 0;
  const caption = (text: string) => (
    <Text style={{ color: C.muted, marginTop: 3, marginBottom: 8 }}>
      Figure {++n}. {text}
    </Text>
  );
  const none = data.figures.length === 0 && chartList.length === 0;
  return (
    <View break={!none}>
      <Text style={s.h2}>7 Figures and charts</Text>
      {none ? (
        <Text style={{ color: C.muted }}>No figures: nothing measured on this job gives a chart.</Text>
      ) : null}
      {data.figures.map((f) => {
        const png = images.get(f.sha256);
        return (
          <View key={f.sha256} wrap={false}>
            {png ? (
              <Image src={png} style={figureSize(f.widthPx, f.heightPx)} />
            ) : (
              <Text style={{ color: C.fail }}>
                The picture with SHA-256 {f.sha256} was not available when this report was rendered.
              </Text>
            )}
            {caption(`${f.caption} (${f.widthPx} × ${f.heightPx} px, SHA-256 ${f.sha256.slice(0, 16)}…)`)}
          </View>
        );
      })}
      {data.figures.length === 0 && data.parameters.length > 0 ? (
        <Text style={{ color: C.muted, marginBottom: 6 }}>
          No picture of the 3D view was saved for this report.
        </Text>
      ) : null}
      {chartList.map((c) => (
        <View key={c.caption} wrap={false}>
          {c.kind === "limits" ? (
            <LimitRowsChart rows={c.rows} legend={c.legend} />
          ) : (
            <ResidualsChart residuals={c.residuals} />
          )}
          {caption(c.caption)}
        </View>
      ))}
    </View>
  );
}

export function ReportDocument({
  data,
  qrDataUrl,
  images = new Map(),
}: {
  data: ReportData;
  qrDataUrl: string;
  images?: ReadonlyMap<string, Buffer>;
}) {
  const rev = `revision ${data.revision}`;
  const facts = reportFacts(data);
  return (
    <Document
      title={`Acceptance report ${data.reference} ${rev}`}
      author={data.issuer.name}
      subject={`Two-axis head ${data.head.serial}`}
      creator="Trammel"
      producer="Trammel"
    >
      <Page size="A4" style={s.page}>
        {data.draft ? (
          <Text
            fixed
            style={{
              position: "absolute",
              top: 360,
              left: 70,
              fontSize: 120,
              fontWeight: 700,
              color: C.muted,
              opacity: 0.18,
              transform: "rotate(-35deg)",
            }}
          >
            DRAFT
          </Text>
        ) : null}
        <View style={s.footerRule} fixed />
        <Text style={[s.footerText, { left: 40, right: 200 }]} fixed>
          {data.reference} · {rev} · {data.reportId}
        </Text>
        <Text
          style={[s.footerText, { left: 400, right: 40, textAlign: "right" }]}
          fixed
          render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`}
        />
        <View>
          <View style={s.header} fixed>
            <View style={{ flexDirection: "row", gap: 8, alignItems: "center", flex: 1 }}>
              <Mark />
              <View style={{ flex: 1 }}>
                <Text style={s.title}>Acceptance report — two-axis head</Text>
                <Text style={s.subtitle}>
                  {data.issuer.name}
                  {data.issuer.address ? ` · ${data.issuer.address}` : ""}
                </Text>
                {data.issuer.contact ? <Text style={s.subtitle}>{data.issuer.contact}</Text> : null}
              </View>
            </View>
            <View style={s.idBox}>
              <Text style={[s.mono, { fontSize: 9, fontWeight: 700 }]}>{data.reference}</Text>
              <Text style={s.subtitle}>
                {rev}
                {data.draft
                  ? " · DRAFT, not issued"
                  : data.issuedAtUtc
                    ? ` · issued ${data.issuedAtUtc}`
                    : " · not issued"}
              </Text>
              <Text style={[s.mono, { fontSize: 6.5, color: C.muted }]}>{data.reportId}</Text>
            </View>
          </View>

          {data.amendment ? (
            <View style={s.note}>
              <Text style={{ fontWeight: 700 }}>
                Amendment: this revision supersedes revision {data.amendment.supersedesRevision}.
              </Text>
              <Text>{data.amendment.reason}</Text>
            </View>
          ) : null}

          {data.conformity ? (
            <View style={s.note} wrap={false}>
              <Text style={{ fontWeight: 700 }}>Statement of conformity</Text>
              <Text>{data.conformity.text}</Text>
            </View>
          ) : null}

          <Text style={s.h2} minPresenceAhead={40}>
            1 Identification
          </Text>
          <View style={s.grid}>
            <View style={s.col}>
              <Facts rows={facts.machine} />
            </View>
            <View style={s.col}>
              <Facts rows={facts.head} />
            </View>
          </View>

          <Text style={s.h2} minPresenceAhead={40}>
            2 Work, method and decision rule
          </Text>
          <Facts rows={facts.work} />
          {data.records ? <RecordDetailsPdf r={data.records} /> : null}

          <Text style={s.h2} minPresenceAhead={40}>
            3 Instruments
          </Text>
          <Table
            rows={data.instruments}
            empty="No instruments were recorded."
            cols={[
              { header: "Instrument", width: "26%", cell: (r) => r.kind },
              { header: "Serial", width: "16%", cell: (r) => r.serial },
              { header: "Resolution", width: "14%", cell: (r) => unitCell(r.resolution), numeric: true },
              {
                header: "Std. uncertainty",
                width: "16%",
                cell: (r) => unitCell(r.uncertainty),
                numeric: true,
              },
              { header: "Calibration due", width: "14%", cell: (r) => r.calibrationDue },
              { header: "Status", width: "14%", cell: (r) => r.status },
            ]}
          />

          <Text style={s.h2} minPresenceAhead={40}>
            4 Readings before and after adjustment
          </Text>
          <Text style={{ color: C.muted, marginBottom: 3 }}>
            {DecisionWithRowsOf(data.readings)} (judged on the final reading)
          </Text>
          <Table
            rows={data.readings}
            empty="No checklist readings."
            cols={[
              {
                header: "Step",
                width: "19%",
                cell: (r) => r.step,
                node: (r, w) => (
                  <View style={[s.td, { width: w }]}>
                    <Text>{r.step}</Text>
                    {r.points ? <Text style={{ color: C.muted, fontSize: 6.5 }}>{r.points}</Text> : null}
                  </View>
                ),
              },
              { header: "Limits", width: "15%", cell: (r) => unitCell(r.limits) },
              { header: "Before", width: "13%", cell: (r) => unitCell(r.pre), numeric: true },
              { header: "After", width: "13%", cell: (r) => unitCell(r.post), numeric: true },
              { header: "Change", width: "12%", cell: (r) => unitCell(r.change), numeric: true },
              { header: "U (k = 2)", width: "13%", cell: (r) => unitCell(r.expanded), numeric: true },
              {
                header: "Result",
                width: "15%",
                cell: (r) => RECORDED_DECISION_TEXT[r.decision],
                node: (r, w) => <DecisionCell d={r.decision} width={w} basis={r.basis} />,
              },
            ]}
          />

          <Text style={s.h2} minPresenceAhead={40}>
            5 Kinematic parameters of the head
          </Text>
          <Text style={{ color: C.muted, marginBottom: 3 }}>
            Fitted from sphere-probe data; U is the expanded uncertainty (k = 2, about 95 %).
          </Text>
          <View style={s.table}>
            <View style={[s.tr, s.th]} fixed>
              {["Parameter", "ISO 230-1", "Value", "U (k = 2)", "Tolerance", "Identifiable", "Result"].map(
                (h, i) => (
                  <Text
                    key={h}
                    style={[s.td, { width: ["27%", "11%", "14%", "12%", "12%", "11%", "13%"][i] }]}
                  >
                    {h}
                  </Text>
                ),
              )}
            </View>
            {data.parameters.length === 0 ? (
              <Text style={[s.td, { color: C.muted }]}>No kinematic fit is part of this report.</Text>
            ) : null}
            {data.parameters.map((p) => (
              <View key={p.symbol + p.name} style={s.tr} wrap={false}>
                <Text style={[s.td, { width: "27%" }]}>{p.name}</Text>
                <Text style={[s.td, s.mono, { width: "11%" }]}>{p.symbol}</Text>
                <Text style={[s.td, s.num, { width: "14%" }]}>{p.value}</Text>
                <Text style={[s.td, s.num, { width: "12%" }]}>
                  {p.expanded === "—" ? "—" : `± ${p.expanded}`}
                </Text>
                <Text style={[s.td, s.num, { width: "12%" }]}>{p.tolerance ?? "—"}</Text>
                <Text style={[s.td, { width: "11%" }]}>{p.identifiable}</Text>
                <DecisionCell d={p.decision} width="13%" basis={p.basis} />
              </View>
            ))}
          </View>

          <ControlValuesPdf section={data.controlValues} />
          <BudgetPdf budget={data.budget} />
          <PositioningPdf tests={data.rotaryPositioning} />

          <Text style={s.h2} minPresenceAhead={40}>
            6 Test part
          </Text>
          <Text style={{ color: C.muted, marginBottom: 3 }}>{DecisionWithRowsOf(data.testPart)}</Text>
          <Table
            rows={data.testPart}
            empty="No test part was measured for this report."
            cols={[
              { header: "Feature", width: "14%", cell: (r) => r.feature },
              { header: "Characteristic", width: "15%", cell: (r) => r.characteristic },
              { header: "Nominal", width: "12%", cell: (r) => r.nominal, numeric: true },
              { header: "Measured", width: "12%", cell: (r) => r.measured, numeric: true },
              { header: "Deviation", width: "10%", cell: (r) => r.deviation, numeric: true },
              { header: "Limits", width: "19%", cell: (r) => r.limits, numeric: true },
              { header: "U", width: "8%", cell: (r) => r.expanded, numeric: true },
              {
                header: "Result",
                width: "13%",
                cell: (r) => RECORDED_DECISION_TEXT[r.decision],
                node: (r, w) => <DecisionCell d={r.decision} width={w} basis={r.basis} />,
              },
            ]}
          />

          <FiguresAndCharts data={data} images={images} />

          <View wrap={false}>
            <Text style={s.h2}>8 Deviations and remarks</Text>
            {(data.deviations ?? []).map((x, i) => (
              <Text key={`d${i}`}>
                • Deviation: {x.result} ({x.decision}) is carried into this report. Justification:{" "}
                {x.justification} Approved by {x.approvedBy}, {x.recordedAtUtc}.
              </Text>
            ))}
            {data.remarks.map((r, i) => (
              <Text key={i}>• {r}</Text>
            ))}
            {data.remarks.length || data.deviations?.length ? null : (
              <Text style={{ color: C.muted }}>None.</Text>
            )}
          </View>

          <View wrap={false}>
            <Text style={s.h2} minPresenceAhead={40}>
              9 Safety
            </Text>
            <View style={s.note}>
              {data.safety.map((t, i) => (
                <Text key={i}>⚠ {t}</Text>
              ))}
            </View>
          </View>

          <PhotoAppendix rows={data.photos} />

          {data.draft ? (
            <View wrap={false} style={s.note}>
              <Text style={{ fontWeight: 700 }}>DRAFT: not signed, not issued, not valid as a report</Text>
              <Text>
                This preview shows the record as it stands. The report is signed and given its identity and
                verification code only when an application engineer approves and issues it.
              </Text>
            </View>
          ) : (
            <>
              <View wrap={false}>
                <Text style={s.h2} minPresenceAhead={40}>
                  10 Signatures
                </Text>
                <View style={{ flexDirection: "row", flexWrap: "wrap", justifyContent: "space-between" }}>
                  {data.signatures.length === 0 ? (
                    <Text style={{ color: C.muted }}>Not signed yet.</Text>
                  ) : null}
                  {data.signatures.map((g, i) => (
                    <View key={i} style={s.sigBox}>
                      <Text style={{ fontWeight: 700 }}>{g.meaning}</Text>
                      <Text>
                        {g.name} — {g.role}
                      </Text>
                      <Text style={s.mono}>{g.signedAtUtc}</Text>
                      <Text style={{ color: C.muted, fontSize: 7 }}>
                        Signed electronically; the signer re-entered their password at signing.
                      </Text>
                    </View>
                  ))}
                </View>
              </View>

              <View
                wrap={false}
                style={{ flexDirection: "row", gap: 10, marginTop: 10, alignItems: "center" }}
              >
                <Image src={qrDataUrl} style={{ width: 72, height: 72 }} />
                <View style={{ flex: 1 }}>
                  <Text style={{ fontWeight: 700 }}>Verify this report</Text>
                  <Text>
                    Scan the code or open {data.verifyUrl} and upload this file: the check compares its
                    SHA-256 with the signed record.
                  </Text>
                  <Text style={[s.mono, { fontSize: 7, color: C.muted }]}>
                    content SHA-256 {data.contentSha256}
                  </Text>
                </View>
              </View>
            </>
          )}
          {data.records ? <ClosingStatementsPdf r={data.records} /> : null}
          <Text style={s.end}>END OF REPORT</Text>
        </View>
      </Page>
    </Document>
  );
}
