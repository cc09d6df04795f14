/**
 * The PDF's 5.4: each rotary axis's ISO 230-2 positioning test, from the report's data: the
 * quantities table (both directions and per direction, limit, source, result) and the chart of the
 * mean positional deviation ± 2s per target (positive approach: filled circle; negative: hollow
 * square), drawn from lib/positioning-chart.ts like the page's chart.
 */
import { Fragment } from "react";
import { Circle, Line, Polyline, Rect, StyleSheet, Svg, Text, View } from "@react-pdf/renderer";
import { drawing, palette } from "@/lib/domain/theme";
import { positioningChartLayout, type ChartMark } from "@/lib/positioning-chart";
import { sectionStyles, TCP_DECISION } from "./control-pdf";
import { PdfHeadRow } from "./pdf-head-row";
import type { ReportPositioningTest } from "./positioning";

// The 5.x sections' look (headings, tables, figures), plus a heading for each axis.
const s = {
  ...sectionStyles,
  ...StyleSheet.create({ h3: { fontWeight: 700, marginTop: 6, marginBottom: 2 } }),
};

const COLS = [
  ["Quantity", "30%"],
  ["Both", "10%"],
  ["Positive ↑", "10%"],
  ["Negative ↓", "10%"],
  ["Limit", "10%"],
  ["Source", "18%"],
  ["Result", "12%"],
] as const;

const POS = palette.accent[600];
const NEG = palette.nominal[700];
const CHART_W = 515;

function Marks({ marks, colour, square }: { marks: ChartMark[]; colour: string; square?: boolean }) {
  return (
    <>
      <Polyline
        points={marks.map((m) => `${m.x},${m.y}`).join(" ")}
        fill="none"
        stroke={colour}
        strokeWidth={0.8}
        strokeOpacity={0.6}
      />
      {marks.flatMap((m) =>
        [m.bar, ...m.caps].map((seg, i) => (
          <Line key={`b${m.targetDeg}-${i}`} {...seg} stroke={colour} strokeWidth={1.1} />
        )),
      )}
      {marks.map((m) =>
        square ? (
          <Rect
            key={`m${m.targetDeg}`}
            x={m.x - 3}
            y={m.y - 3}
            width={6}
            height={6}
            fill={palette.white}
            stroke={colour}
            strokeWidth={1.2}
          />
        ) : (
          <Circle key={`m${m.targetDeg}`} cx={m.x} cy={m.y} r={3.2} fill={colour} />
        ),
      )}
    </>
  );
}

/** A number on one of the chart's scales. */
function ScaleLabel({
  x,
  y,
  anchor,
  text,
}: {
  x: number;
  y: number;
  anchor: "end" | "middle";
  text: string;
}) {
  return (
    <Text x={x} y={y} textAnchor={anchor} style={{ fontSize: 8 }} fill={drawing.axisText}>
      {text}
    </Text>
  );
}

function Chart({ test }: { test: ReportPositioningTest }) {
  const l = positioningChartLayout(test.chart);
  return (
    <View wrap={false} style={{ marginTop: 4 }}>
      <Svg width={CHART_W} height={(CHART_W * l.height) / l.width} viewBox={`0 0 ${l.width} ${l.height}`}>
        {l.yTicks.map((t) => (
          <Line key={`g${t.label}`} {...t.grid} stroke={drawing.grid} strokeWidth={0.5} />
        ))}
        {l.yTicks.map((t) => (
          <ScaleLabel key={`y${t.label}`} x={l.plot.x0 - 4} y={t.y + 3} anchor="end" text={t.value} />
        ))}
        {l.xTicks.map((t) => (
          <ScaleLabel key={`x${t.label}`} x={t.x} y={l.plot.y1 + 12} anchor="middle" text={t.label} />
        ))}
        <Line {...l.zeroLine} stroke={drawing.zeroLine} strokeWidth={0.7} strokeDasharray="3 2" />
        <Rect {...l.frame} fill="none" stroke={palette.graphite[200]} strokeWidth={0.6} />
        <Marks marks={l.pos} colour={POS} />
        <Marks marks={l.neg} colour={NEG} square />
      </Svg>
      <Text style={{ fontSize: 7, color: palette.graphite[600], marginTop: 2 }}>
        Mean positional deviation in arc seconds (″, left scale) at each target angle, bars ± 2s; positive
        approach: filled circles, negative approach: hollow squares; dashed line: zero.
      </Text>
    </View>
  );
}

export function PositioningPdf({ tests }: { tests: ReportPositioningTest[] | undefined }) {
  if (!tests?.length) return null;
  return (
    <View>
      {tests.map((t, i) => (
        <Fragment key={t.axis + t.file}>
          {/* The section's heading stays with its first table. */}
          <View wrap={false}>
            {i === 0 ? <Text style={s.h2}>5.4 Positioning of the rotary axes (ISO 230-2)</Text> : null}
            <Text style={s.h3}>
              {t.axis[0]!.toUpperCase() + t.axis.slice(1)}: {TCP_DECISION[t.decision]}
            </Text>
            <Text style={s.muted}>
              {t.file}: {t.basis}
            </Text>
            <View style={s.table}>
              <PdfHeadRow cols={COLS} />
              {t.rows.map((r) => (
                <View key={r.symbol} style={s.tr}>
                  <Text style={[s.td, { width: COLS[0][1] }]}>
                    {/* One string, the symbol bound to its last word: split fragments broke as "(-M)". */}
                    {`${r.quantity}\u00a0(${r.symbol})`}
                  </Text>
                  <Text style={[s.td, s.num, { width: COLS[1][1] }]}>{r.both}</Text>
                  <Text style={[s.td, s.num, { width: COLS[2][1] }]}>{r.pos}</Text>
                  <Text style={[s.td, s.num, { width: COLS[3][1] }]}>{r.neg}</Text>
                  <Text style={[s.td, s.num, { width: COLS[4][1] }]}>{r.limit}</Text>
                  <Text style={[s.td, { width: COLS[5][1] }]}>{r.source}</Text>
                  <Text style={[s.td, { width: COLS[6][1] }, r.decision === "fail" ? s.flag : {}]}>
                    {TCP_DECISION[r.decision]}
                    {r.reason ? ` — ${r.reason}` : ""}
                  </Text>
                </View>
              ))}
            </View>
          </View>
          {t.warnings.length ? <Text style={s.muted}>Note: {t.warnings.join(" ")}</Text> : null}
          <Chart test={t} />
        </Fragment>
      ))}
    </View>
  );
}
