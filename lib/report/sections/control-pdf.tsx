/** The PDF's control-values section (5.1), from the report's data; absent when nothing was recorded. */
import { Text, View } from "@react-pdf/renderer";
import { pdfSectionStyles } from "@/lib/report/pdf-styles";
import type { ReportControlValues } from "./control";
import { PdfHeadRow } from "./pdf-head-row";

const s = pdfSectionStyles;

const COLS = [
  ["Setting", "24%"],
  ["As found", "15%"],
  ["Correction", "13%"],
  ["Value to enter", "15%"],
  ["As left", "15%"],
  ["Check", "18%"],
] as const;

const TCP_COLS = [
  ["Figure", "40%"],
  ["Value", "14%"],
  ["Limit", "14%"],
  ["Result", "32%"],
] as const;

export const TCP_DECISION: Record<string, string> = {
  pass: "Pass",
  fail: "FAIL",
  undecided: "Undecided",
  recorded: "Recorded",
  not_measured: "Not measured",
};

export function ControlValuesPdf({ section }: { section: ReportControlValues | undefined }) {
  if (!section) return null;
  return (
    <View>
      <Text style={s.h2} minPresenceAhead={60}>
        5.1 Values for the control: as found, to enter, as left
      </Text>
      <Text style={s.muted}>{section.basis}</Text>
      {section.rows.length === 0 ? <Text style={s.muted}>No control values were recorded.</Text> : null}
      <View style={s.table}>
        <PdfHeadRow cols={COLS} fixed />
        {section.rows.map((r) => (
          <View key={r.setting} style={s.tr} wrap={false}>
            <Text style={[s.td, { width: COLS[0][1] }]}>{r.setting}</Text>
            <Text style={[s.td, s.num, { width: COLS[1][1] }]}>{r.asFound}</Text>
            <Text style={[s.td, s.num, { width: COLS[2][1] }]}>{r.correction}</Text>
            <Text style={[s.td, s.num, { width: COLS[3][1], fontWeight: 700 }]}>{r.toEnter}</Text>
            <Text style={[s.td, s.num, { width: COLS[4][1] }]}>{r.asLeft}</Text>
            <Text style={[s.td, { width: COLS[5][1] }, r.check && r.check !== "As computed" ? s.flag : {}]}>
              {r.check || "—"}
            </Text>
          </View>
        ))}
      </View>
      {section.recorded.map((t) => (
        <Text key={t} style={s.muted}>
          {t}
        </Text>
      ))}
      <Text style={s.muted}>Sign convention: {section.signConvention}</Text>
      <View style={s.note} wrap={false}>
        <Text>⚠ {section.caution}</Text>
      </View>
      {section.tcpCheck ? (
        <View wrap={false}>
          <Text style={s.h2}>5.2 Tool-centre-point check after compensation</Text>
          <Text style={s.muted}>
            {section.tcpCheck.file}: {section.tcpCheck.basis} Result:{" "}
            {TCP_DECISION[section.tcpCheck.decision]}.
          </Text>
          <View style={s.table}>
            <PdfHeadRow cols={TCP_COLS} />
            {section.tcpCheck.rows.map((r) => (
              <View key={r.quantity} style={s.tr}>
                <Text style={[s.td, { width: TCP_COLS[0][1] }]}>{r.quantity}</Text>
                <Text style={[s.td, s.num, { width: TCP_COLS[1][1] }]}>{r.value}</Text>
                <Text style={[s.td, s.num, { width: TCP_COLS[2][1] }]}>{r.limit}</Text>
                <View style={[s.td, { width: TCP_COLS[3][1] }]}>
                  <Text style={r.decision === "fail" ? s.flag : {}}>{TCP_DECISION[r.decision]}</Text>
                  {r.basis ? <Text style={s.basis}>{r.basis}</Text> : null}
                </View>
              </View>
            ))}
          </View>
        </View>
      ) : null}
    </View>
  );
}

/** The look of the 5.x sections' headings and tables, for the sections that follow this one. */
export { s as sectionStyles };
