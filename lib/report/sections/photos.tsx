/** The report's appendix of photos in the PDF (its rows: photo-rows.ts). */
import { Text, View } from "@react-pdf/renderer";
import { pdfColours, pdfSectionStyles } from "../pdf-styles";
import { PHOTO_APPENDIX_TITLE, photoLine, type PhotoAppendixRow } from "./photo-rows";

/** The appendix in the PDF; nothing when no step asks for a photo. */
export function PhotoAppendix({ rows }: { rows: readonly PhotoAppendixRow[] | undefined }) {
  if (!rows?.length) return null;
  return (
    <View>
      <Text style={pdfSectionStyles.h2} minPresenceAhead={40}>
        {PHOTO_APPENDIX_TITLE}
      </Text>
      {rows.map((r, i) => (
        <View key={i} wrap={false} style={{ marginBottom: 3 }}>
          <Text>• {photoLine(r)}</Text>
          <Text style={{ fontSize: 6.5, color: pdfColours.muted }}>SHA-256 {r.sha256}</Text>
        </View>
      ))}
    </View>
  );
}
