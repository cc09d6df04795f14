/** The head row of a PDF table in the report's sections. */
import { Text, View, type Styles } from "@react-pdf/renderer";
import { pdfSectionStyles as s } from "@/lib/report/pdf-styles";

/**
 * Each column's title at its width on the shaded head band; `fixed` repeats the row at the top of
 * every page the table runs onto, and `cellStyle` replaces the cells' padding where a table is set
 * tighter.
 */
export function PdfHeadRow({
  cols,
  fixed = false,
  cellStyle = s.td,
}: {
  cols: ReadonlyArray<readonly [title: string, width: string]>;
  fixed?: boolean;
  cellStyle?: Styles[string];
}) {
  return (
    <View style={[s.tr, s.th]} fixed={fixed}>
      {cols.map(([h, w]) => (
        <Text key={h} style={[cellStyle, { width: w }]}>
          {h}
        </Text>
      ))}
    </View>
  );
}
