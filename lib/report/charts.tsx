/**
 * Charts of the acceptance report, drawn as vector graphics in the PDF (@react-pdf/renderer Svg)
 * from the numbers in the report data, so they say exactly what the tables say:
 *  - limit rows: one row per reading or parameter, its tolerance band, the value(s) and U;
 *  - residuals: the largest residual component per pose with the 3 s line of the outlier rule.
 * Shape and a word carry every meaning as well as colour (before: hollow ring, after: filled dot).
 */
import { drawing, palette } from "@/lib/domain/theme";
import { Circle, Line, Rect, Svg, Text, View } from "@react-pdf/renderer";
import { RESIDUALS_BOX, residualsLayout } from "@/lib/report/residuals-layout";
import { LIMIT_ROW_BOX, limitRowLayout, type LimitRow, type LimitRowMark } from "./chart-data";
import { pdfColours } from "./pdf-styles";
import type { ReportCharts } from "./types";

const C = {
  ...pdfColours,
  limitBand: drawing.limitBand,
  limit: palette.pass[700],
  before: palette.nominal[500],
  after: palette.graphite[900],
};

const { width: ROW_W, height: ROW_H } = LIMIT_ROW_BOX.pdf;

/** Each kind of mark: before adjustment a hollow ring, after it a filled dot, a single value an accent dot. */
const MARK: Record<LimitRowMark["kind"], { r: number; fill: string; stroke?: string; strokeWidth?: number }> =
  {
    before: { r: 2.6, fill: palette.white, stroke: C.before, strokeWidth: 1.1 },
    after: { r: 2.4, fill: C.after },
    value: { r: 2.4, fill: C.accent },
  };

function RowPlot({ row }: { row: LimitRow }) {
  const l = limitRowLayout(row, LIMIT_ROW_BOX.pdf);
  return (
    <Svg width={ROW_W} height={ROW_H} viewBox={`0 0 ${ROW_W} ${ROW_H}`}>
      <Rect {...l.band} fill={C.limitBand} />
      {l.limits.map((seg, i) => (
        <Line key={`l${i}`} {...seg} stroke={C.limit} strokeWidth={0.9} />
      ))}
      {l.zero ? <Line {...l.zero} stroke={C.muted} strokeWidth={0.4} strokeDasharray="1 1" /> : null}
      {l.travel ? <Line {...l.travel} stroke={C.muted} strokeWidth={0.6} /> : null}
      {l.uBars.map((seg, i) => (
        <Line key={`u${i}`} {...seg} stroke={C.ink} strokeWidth={0.8} />
      ))}
      {l.marks.map((m, i) => (
        <Circle key={i} cx={m.x} cy={l.mid} {...MARK[m.kind]} />
      ))}
    </Svg>
  );
}

/** Rows of values against their tolerance bands (green lines are the limits, the shaded band is inside). */
export function LimitRowsChart({ rows, legend }: { rows: readonly LimitRow[]; legend: string }) {
  return (
    <View>
      {rows.map((r, i) => (
        <View
          key={i}
          style={{
            flexDirection: "row",
            alignItems: "center",
            borderBottomWidth: 0.4,
            borderBottomColor: C.rule,
            paddingVertical: 1.5,
          }}
          wrap={false}
        >
          <Text style={{ width: 135, fontSize: 7.5, paddingRight: 4 }}>{r.label}</Text>
          <RowPlot row={r} />
          <Text style={{ flex: 1, fontSize: 7, color: C.muted, paddingLeft: 6 }}>{r.note}</Text>
        </View>
      ))}
      <Text style={{ fontSize: 7, color: C.muted, marginTop: 3 }}>{legend}</Text>
    </View>
  );
}

/** The largest residual component per pose (µm), with the 3 s line; bars above it are drawn in red and counted. */
export function ResidualsChart({ residuals }: { residuals: NonNullable<ReportCharts["residuals"]> }) {
  const c = residualsLayout(residuals, RESIDUALS_BOX.pdf);
  return (
    <View>
      <Svg width={c.width} height={c.height} viewBox={`0 0 ${c.width} ${c.height}`}>
        {c.grid.map((g) => (
          <Line key={`g${g.value}`} {...g.line} stroke={C.rule} strokeWidth={0.4} />
        ))}
        {c.ticks.map((t) => (
          <Text
            key={`t${t}`}
            x={c.left - 3}
            y={c.y(t) + 2}
            textAnchor="end"
            style={{ fontSize: 6 }}
            fill={C.muted}
          >
            {String(t)}
          </Text>
        ))}
        {c.bars.map((b, i) => (
          <Rect key={i} x={b.x} y={b.y} width={b.width} height={b.height} fill={b.over ? C.fail : C.before} />
        ))}
        <Line {...c.limitLine} stroke={C.accent} strokeWidth={0.9} strokeDasharray="3 2" />
        <Line {...c.zeroLine} stroke={C.ink} strokeWidth={0.6} />
        <Text x={c.right} y={c.limitY - 2} textAnchor="end" style={{ fontSize: 6 }} fill={C.accent}>
          {`3 s = ${c.limit.toFixed(2)}`}
        </Text>
      </Svg>
      <Text style={{ fontSize: 7, color: C.muted, marginTop: 2 }}>{c.caption}</Text>
    </View>
  );
}
