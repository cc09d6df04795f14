/**
 * ISO 230-2 positioning of a rotary axis: the mean positional deviation at each target with a bar
 * of ± 2s, for the positive approach (filled circle, accent) and the negative approach (hollow
 * square, blue-grey) side by side, so shape as well as colour tells the directions apart.
 * Server-rendered SVG with its title and description; the numbers follow as a table.
 */
import { ChartedValues } from "./charted-values";
import { drawing, palette } from "@/lib/domain/theme";
import { positioningChartLayout, type ChartMark } from "@/lib/positioning-chart";
import { arcsecText, type PositioningChartPoint } from "@/lib/rotary-positioning-display";

const POS = palette.accent[600];
const NEG = palette.nominal[700];

function Series({
  marks,
  colour,
  shape,
}: {
  marks: ChartMark[];
  colour: string;
  shape: "circle" | "square";
}) {
  return (
    <g>
      <polyline
        points={marks.map((m) => `${m.x},${m.y}`).join(" ")}
        fill="none"
        stroke={colour}
        strokeWidth="1.2"
        strokeOpacity="0.6"
      />
      {marks.map((m) => (
        <g key={m.targetDeg}>
          {[m.bar, ...m.caps].map((seg, i) => (
            <line key={i} {...seg} stroke={colour} strokeWidth="1.5" />
          ))}
          {shape === "circle" ? (
            <circle cx={m.x} cy={m.y} r="3.6" fill={colour} />
          ) : (
            <rect
              x={m.x - 3.4}
              y={m.y - 3.4}
              width="6.8"
              height="6.8"
              fill={palette.white}
              stroke={colour}
              strokeWidth="1.6"
            />
          )}
        </g>
      ))}
    </g>
  );
}

export function PositioningChart({
  chart,
  title,
}: {
  chart: { pos: readonly PositioningChartPoint[]; neg: readonly PositioningChartPoint[] };
  title: string;
}) {
  const l = positioningChartLayout(chart);
  const rows = chart.pos.map((p, i) => ({ p, n: chart.neg[i]! }));
  return (
    <figure data-testid="positioning-chart" className="space-y-2">
      <svg
        viewBox={`0 0 ${l.width} ${l.height}`}
        className="h-auto w-full max-w-3xl"
        role="img"
        aria-labelledby="positioning-chart-title positioning-chart-desc"
      >
        <title id="positioning-chart-title">{title}</title>
        <desc id="positioning-chart-desc">
          Mean positional deviation in arc seconds at each target angle, with bars of plus and minus two
          standard deviations; positive approach as filled circles, negative approach as hollow squares.
        </desc>
        {l.yTicks.map((t) => (
          <g key={t.label}>
            <line {...t.grid} stroke={drawing.grid} />
            <text x={l.plot.x0 - 6} y={t.y + 3.5} textAnchor="end" fontSize="10" fill={drawing.axisText}>
              {t.label}
            </text>
          </g>
        ))}
        <line {...l.zeroLine} stroke={drawing.zeroLine} strokeDasharray="4 3" />
        {l.xTicks.map((t) => (
          <text
            key={t.label}
            x={t.x}
            y={l.plot.y1 + 14}
            textAnchor="middle"
            fontSize="10"
            fill={drawing.axisText}
          >
            {t.label}
          </text>
        ))}
        <text
          x={(l.plot.x0 + l.plot.x1) / 2}
          y={l.height - 4}
          textAnchor="middle"
          fontSize="10"
          fill={drawing.labelText}
        >
          Target angle
        </text>
        <rect {...l.frame} fill="none" stroke={palette.graphite[200]} />
        <Series marks={l.pos} colour={POS} shape="circle" />
        <Series marks={l.neg} colour={NEG} shape="square" />
      </svg>
      <figcaption className="flex flex-wrap items-center gap-x-5 gap-y-1 text-xs text-graphite-600">
        <span className="inline-flex items-center gap-1">
          <svg viewBox="0 0 12 12" className="h-3 w-3" aria-hidden="true">
            <circle cx="6" cy="6" r="4" fill={POS} />
          </svg>
          positive approach ↑
        </span>
        <span className="inline-flex items-center gap-1">
          <svg viewBox="0 0 12 12" className="h-3 w-3" aria-hidden="true">
            <rect x="2" y="2" width="8" height="8" fill={palette.white} stroke={NEG} strokeWidth="1.6" />
          </svg>
          negative approach ↓
        </span>
        <span>bars: mean ± 2s; dashed: zero</span>
      </figcaption>
      <ChartedValues
        caption="Mean positional deviation and standard deviation per target"
        empty="No targets."
        data={rows}
        getRowId={(r) => String(r.p.targetDeg)}
        columns={(column) => [
          column("Target", (r) => `${r.p.targetDeg}°`, { rowHeader: true, numeric: true }),
          column("Mean ↑", (r) => arcsecText(r.p.mean), { numeric: true }),
          column("± 2s ↑", (r) => arcsecText((r.p.hi - r.p.lo) / 2), { numeric: true }),
          column("Mean ↓", (r) => arcsecText(r.n.mean), { numeric: true }),
          column("± 2s ↓", (r) => arcsecText((r.n.hi - r.n.lo) / 2), { numeric: true }),
        ]}
      />
    </figure>
  );
}
