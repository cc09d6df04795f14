import { drawing, palette } from "@/lib/domain/theme";
import { YGrid } from "@/components/charts/axis";
import { niceTicks } from "@/lib/chart-ticks";

/**
 * Residuals per pose: for each pose (in file order) the largest residual component in µm, with
 * the 3 s line the outlier rule uses. Outliers are drawn as triangles and labelled with their row,
 * so the chart does not depend on colour alone. Beyond MAX_BARS poses, consecutive poses share a
 * bar that shows the largest of them (so no outlier disappears).
 */
const MAX_BARS = 1200;

export function ResidualChart({
  residuals,
  rows: allRows,
  toolMm: allTool,
  sUm,
}: {
  residuals: ReadonlyArray<readonly [number, number, number]>;
  rows: readonly number[];
  toolMm: readonly number[];
  sUm: number;
}) {
  const W = 880;
  const H = 240;
  const m = { l: 52, r: 16, t: 30, b: 34 };
  const perBar = Math.max(1, Math.ceil(residuals.length / MAX_BARS));
  const worst: number[] = [];
  const rows: number[] = [];
  const toolMm: number[] = [];
  residuals.forEach((r, i) => {
    const w = Math.max(Math.abs(r[0]), Math.abs(r[1]), Math.abs(r[2]));
    const b = Math.floor(i / perBar);
    if (b === worst.length) {
      worst.push(w);
      rows.push(allRows[i]!);
      toolMm.push(allTool[i]!);
    } else if (w > worst[b]!) {
      worst[b] = w;
      rows[b] = allRows[i]!;
    }
  });
  const n = worst.length;
  const limit = 3 * sUm;
  const axis = niceTicks(0, Math.max(limit * 1.25, ...worst) || 1);
  const yMax = axis.max;
  const x = (i: number) => m.l + ((i + 0.5) / Math.max(1, n)) * (W - m.l - m.r);
  const y = (v: number) => H - m.b - (v / yMax) * (H - m.t - m.b);
  const ticks = axis.ticks;
  const tickDigits = ticks.some((t) => !Number.isInteger(t * 10)) ? 2 : 1;
  const outlierIdx = worst.flatMap((w, i) => (w > limit ? [i] : []));
  // Label heights: a label that would touch the previous one goes above it.
  const labelY: number[] = [];
  outlierIdx.forEach((i, j) => {
    let ly = y(worst[i]!) - 12;
    if (j > 0 && x(i) - x(outlierIdx[j - 1]!) < 44) ly = Math.min(ly, labelY[j - 1]! - 11);
    labelY.push(ly);
  });
  // Where the tool length changes: a separator and a label.
  const breaks: { i: number; tool: number }[] = [];
  toolMm.forEach((t, i) => {
    if (i === 0 || t !== toolMm[i - 1]) breaks.push({ i, tool: t });
  });
  return (
    <figure className="space-y-2">
      <svg
        viewBox={`0 0 ${W} ${H}`}
        className="h-auto w-full"
        role="img"
        aria-label={`Largest residual component per pose for ${residuals.length} poses; ${worst.filter((w) => w > limit).length} beyond 3 s = ${limit.toFixed(2)} µm`}
      >
        <YGrid ticks={ticks} y={y} left={m.l} right={W - m.r} label={(t) => t.toFixed(tickDigits)} numeric />
        <text
          x={12}
          y={m.t + (H - m.t - m.b) / 2}
          fontSize="11"
          fill={drawing.axisText}
          transform={`rotate(-90 12 ${m.t + (H - m.t - m.b) / 2})`}
          textAnchor="middle"
        >
          µm
        </text>
        {breaks.map((b) => (
          <g key={b.i}>
            {b.i > 0 ? (
              <line
                x1={x(b.i) - 0.5 * ((W - m.l - m.r) / n)}
                x2={x(b.i) - 0.5 * ((W - m.l - m.r) / n)}
                y1={m.t}
                y2={H - m.b}
                stroke={drawing.faint}
                strokeDasharray="3 3"
              />
            ) : null}
            <text x={x(b.i)} y={H - m.b + 26} fontSize="11" fill={drawing.labelText}>
              tool {b.tool} mm
            </text>
          </g>
        ))}
        {worst.map((w, i) => (
          <line
            key={i}
            x1={x(i)}
            x2={x(i)}
            y1={y(0)}
            y2={y(w)}
            stroke={w > limit ? drawing.warning : palette.nominal[500]}
            strokeWidth={Math.max(1, Math.min(4, (W - m.l - m.r) / n - 0.5))}
          />
        ))}
        {outlierIdx.map((i, j) => (
          <g key={`o${i}`}>
            <path d={`M ${x(i)} ${y(worst[i]!) - 9} l 5 8 l -10 0 z`} fill={drawing.warning} />
            <text
              x={x(i)}
              y={labelY[j]}
              fontSize="10"
              textAnchor="middle"
              fill={drawing.warningText}
              className="num"
            >
              row {rows[i]}
            </text>
          </g>
        ))}
        <line
          x1={m.l}
          x2={W - m.r}
          y1={y(limit)}
          y2={y(limit)}
          stroke={drawing.warning}
          strokeDasharray="6 4"
        />
        <text x={m.l + 6} y={y(limit) - 4} fontSize="11" fill={drawing.warningText}>
          3 s = {limit.toFixed(2)} µm
        </text>
        <line x1={m.l} x2={W - m.r} y1={y(0)} y2={y(0)} stroke={drawing.zeroLine} />
        <text x={m.l} y={H - m.b + 13} fontSize="11" fill={drawing.axisText}>
          poses in file order →
        </text>
      </svg>
      <figcaption className="text-sm text-graphite-600">
        Largest of the three residual components (measured − modelled sphere centre) at each pose
        {perBar > 1 ? ` (each bar the largest of ${perBar} consecutive poses)` : ""}. A pose beyond the dashed
        3 s line is listed as an outlier (▲ with its row).
      </figcaption>
    </figure>
  );
}
