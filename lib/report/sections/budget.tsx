/** The report's uncertainty budget of the approved fit (5.3), for the PDF; absent without an approved fit. */
import { Text, View } from "@react-pdf/renderer";
import type { BudgetTableRow } from "@/lib/budget-display";
import { pdfSectionStyles } from "@/lib/report/pdf-styles";
import { PdfHeadRow } from "./pdf-head-row";

export interface ReportBudget {
  /** The Type B inputs in words, with their standard uncertainties. */
  inputs: string;
  rows: BudgetTableRow[];
  notes: string[];
}

/** The budget's rows sit closer together than the other tables: one parameter spans several. */
const s = { ...pdfSectionStyles, td: { ...pdfSectionStyles.td, paddingVertical: 2 } };

const W = ["46%", "18%", "18%", "18%"] as const;
const HEAD = ["Parameter / component", "u", "Sensitivity c", "Contribution"].map(
  (h, i) => [h, W[i]!] as const,
);

export function BudgetPdf({ budget }: { budget: ReportBudget | undefined }) {
  if (!budget) return null;
  return (
    <View>
      <Text style={s.h2} minPresenceAhead={60}>
        5.3 Uncertainty budget of the head parameters (JCGM 100)
      </Text>
      <Text style={s.muted}>
        Each parameter&apos;s u_c is the root sum of squares of its contributions |c|·u (uncorrelated inputs);
        U = 2·u_c (k = 2, about 95 %). {budget.inputs}
      </Text>
      <View style={s.table}>
        <PdfHeadRow cols={HEAD} fixed cellStyle={s.td} />
        {budget.rows.map((r) => (
          <View key={r.parameter} wrap={false}>
            <View style={s.tr}>
              <Text style={[s.td, { width: "100%", fontWeight: 700 }]}>
                {r.parameter}: u_c {r.uc} {r.unit}, U {r.U} {r.unit}
              </Text>
            </View>
            {r.components.map((c) => (
              <View key={c.name} style={s.tr}>
                <Text style={[s.td, { width: W[0], paddingLeft: 12 }]}>{c.name}</Text>
                <Text style={[s.td, s.num, { width: W[1] }]}>{c.u}</Text>
                <Text style={[s.td, s.num, { width: W[2] }]}>{c.sensitivity}</Text>
                <Text style={[s.td, s.num, { width: W[3] }]}>
                  {c.contribution} {r.unit}
                </Text>
              </View>
            ))}
          </View>
        ))}
      </View>
      {budget.notes.map((n) => (
        <Text key={n} style={s.muted}>
          Note: {n}.
        </Text>
      ))}
    </View>
  );
}
