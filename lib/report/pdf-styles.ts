/**
 * The look shared by every section of the PDF report (lib/report/document.tsx and
 * lib/report/sections/*): one set of colours and one StyleSheet for headings, notes and tables,
 * so that a section added later reads like the rest of the report.
 */
import { StyleSheet } from "@react-pdf/renderer";
import { drawing, palette } from "@/lib/domain/theme";
import { MONO_FONT } from "./fonts";

/** The report's ink: body text, secondary text, hairlines, table header band and the caution accent. */
export const pdfColours = {
  ink: palette.graphite[900],
  muted: palette.graphite[600],
  rule: palette.graphite[200],
  band: palette.graphite[50],
  accent: drawing.accentLine,
  fail: palette.fail[700],
} as const;

export const pdfSectionStyles = StyleSheet.create({
  /** A numbered section heading with a hairline under it. */
  h2: {
    fontSize: 10.5,
    lineHeight: 1.2,
    fontWeight: 700,
    marginTop: 12,
    marginBottom: 5,
    paddingBottom: 2,
    borderBottomWidth: 0.75,
    borderBottomColor: pdfColours.rule,
  },
  h3: { fontSize: 9, fontWeight: 700, marginTop: 7, marginBottom: 3 },
  muted: { color: pdfColours.muted, marginBottom: 3 },
  mono: { fontFamily: MONO_FONT as unknown as string },
  /** A boxed caution or statement. */
  note: {
    borderWidth: 1.2,
    borderColor: pdfColours.accent,
    padding: 7,
    marginTop: 4,
    backgroundColor: palette.accent[50],
  },
  flag: { color: pdfColours.fail, fontWeight: 700 },
  /** Under a decision: the rule and the limit source it was judged by. */
  basis: { color: pdfColours.muted, fontSize: 6.5 },
  table: { borderWidth: 0.75, borderColor: pdfColours.rule },
  tr: { flexDirection: "row", borderBottomWidth: 0.5, borderBottomColor: pdfColours.rule },
  th: { backgroundColor: pdfColours.band, fontWeight: 700, color: pdfColours.muted, fontSize: 7.5 },
  td: { paddingVertical: 3, paddingHorizontal: 4 },
  num: { fontFamily: MONO_FONT as unknown as string, textAlign: "right", fontSize: 7.5 },
});
