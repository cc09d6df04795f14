/** The fit's residual per pose as the online report draws it: bars against the 3 s line. */
import { drawing, palette } from "@/lib/domain/theme";
import { YGrid } from "@/components/charts/axis";
import { niceTicks } from "@/lib/chart-ticks";
import type { ReportData } from "@/lib/report/types";

export function Residuals({ r }: { r: NonNullable<NonNullable<ReportData["charts"]>["residuals"]> }) {
  const w = 880;
  const h = 200;
  const m = { l: 40, r: 10, t: 10, b: 22 };
  const limit = 3 * r.sUm;
  const axis = niceTicks(0, Math.max(limit * 1.25, ...r.valuesUm) || 1);
  const yMax = axis.max;
  const ticks = axis.ticks;
  const n = r.valuesUm.length;
  const x = (i: number) => m.l + (i / Math.max(1, n)) * (w - m.l - m.r);
  const y = (v: number) => h - m.b - (v / yMax) * (h - m.t - m.b);
  const bw = Math.max(0.6, ((w - m.l - m.r) / Math.max(1, n)) * 0.7);
  const over = r.valuesUm.filter((v) => v > limit).length;
  return (
    <div>
      <svg
        viewBox={`0 0 ${w} ${h}`}
        className="h-auto w-full"
        role="img"
        aria-label={`Largest residual component per pose, ${r.totalPoses} poses; ${over} beyond 3 s = ${limit.toFixed(2)} µm`}
      >
        <YGrid ticks={ticks} y={y} left={m.l} right={w - m.r} />
        {r.valuesUm.map((v, i) => (
          <rect
            key={i}
            x={x(i)}
            y={y(v)}
            width={bw}
            height={Math.max(0.5, y(0) - y(v))}
            fill={v > limit ? palette.fail[700] : palette.nominal[500]}
          />
        ))}
        <line
          x1={m.l}
          x2={w - m.r}
          y1={y(limit)}
          y2={y(limit)}
          stroke={drawing.accentLine}
          strokeWidth={1.5}
          strokeDasharray="6 4"
        />
        <text x={w - m.r} y={y(limit) - 4} textAnchor="end" fontSize="11" fill={drawing.accentText}>
          3 s = {limit.toFixed(2)} µm
        </text>
      </svg>
      <p className="text-xs text-graphite-600">
        Largest residual component per pose in µm, {r.totalPoses} poses in file order
        {r.perPoint > 1 ? ` (each bar the largest of ${r.perPoint} consecutive poses)` : ""}; dashed line: 3
        s, beyond which a pose is reported as an outlier ({over} bar{over === 1 ? "" : "s"} beyond it, drawn
        in red). s = {r.sUm.toFixed(2)} µm per coordinate.
      </p>
    </div>
  );
}
