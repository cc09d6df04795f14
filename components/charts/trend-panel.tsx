/** One panel of the parameter trend: a parameter's value ± U per job, in its own unit. */
import { palette } from "@/lib/domain/theme";
import { niceTicks } from "@/lib/chart-ticks";
import type { TrendJob, TrendSeries } from "@/components/charts/parameter-trend";

const UNIT_AXIS = { um: "µm", arcsec: "″ (arc seconds)" } as const;
const W = 340;
const H = 210;
const M = { left: 56, right: 14, top: 30, bottom: 46 };

export function Panel({ jobs, s, index }: { jobs: TrendJob[]; s: TrendSeries; index: number }) {
  const vals = s.points.flatMap((p) => (p ? [p.value - p.U, p.value + p.U] : []));
  const t = niceTicks(Math.min(0, ...vals), Math.max(0, ...vals), 4);
  const pw = W - M.left - M.right;
  const ph = H - M.top - M.bottom;
  const x = (i: number) => M.left + (jobs.length === 1 ? pw / 2 : 12 + (i * (pw - 24)) / (jobs.length - 1));
  const y = (v: number) => M.top + ph - ((v - t.min) / (t.max - t.min)) * ph;
  const pts = s.points
    .map((p, i) => (p ? { ...p, i } : null))
    .filter((p): p is NonNullable<typeof p> => p !== null);
  const titleId = `trend-${index}-title`;
  const descId = `trend-${index}-desc`;
  const digits = t.step >= 1 ? 0 : t.step >= 0.1 ? 1 : 2;
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      className="w-full"
      role="img"
      aria-labelledby={`${titleId} ${descId}`}
      data-testid="trend-panel"
      data-parameter={s.key}
    >
      <title id={titleId}>{`${s.symbol}: ${s.words}, per job`}</title>
      <desc id={descId}>
        {jobs.map((j, i) => `${j.reference} (${j.dateText}): ${s.points[i]?.text ?? "no value"}`).join("; ")}.
      </desc>
      <text x={M.left} y={16} fontSize="13" fontWeight="600" className="fill-graphite-900">
        {s.symbol}
        <tspan
          fontWeight="400"
          className="fill-graphite-600"
        >{` ${s.words.length > 36 ? `${s.words.slice(0, 35)}…` : s.words}`}</tspan>
      </text>
      {t.ticks.map((v) => (
        <g key={v}>
          <line
            x1={M.left}
            x2={W - M.right}
            y1={y(v)}
            y2={y(v)}
            stroke={v === 0 ? palette.graphite[400] : palette.graphite[100]}
            strokeWidth="1"
            strokeDasharray={v === 0 ? "4 3" : undefined}
          />
          <text
            x={M.left - 6}
            y={y(v) + 4}
            fontSize="10.5"
            textAnchor="end"
            className="fill-graphite-600"
            fontFamily="var(--font-mono), monospace"
          >
            {v === 0 ? "0" : `${v < 0 ? "−" : ""}${Math.abs(v).toFixed(digits)}`}
          </text>
        </g>
      ))}
      <text
        transform={`translate(13 ${M.top + ph / 2}) rotate(-90)`}
        fontSize="10.5"
        textAnchor="middle"
        className="fill-graphite-700"
      >
        {UNIT_AXIS[s.unit]}
      </text>
      <line x1={M.left} x2={M.left} y1={M.top} y2={M.top + ph} stroke={palette.graphite[300]} />
      {jobs.map((j, i) => (
        <g key={j.key} textAnchor="middle">
          <text
            x={x(i)}
            y={H - M.bottom + 16}
            fontSize="10.5"
            className="fill-graphite-800"
            fontFamily="var(--font-mono), monospace"
          >
            {j.reference.replace(/^TR-\d{4}-/, "")}
          </text>
          <text x={x(i)} y={H - M.bottom + 29} fontSize="9.5" className="fill-graphite-600">
            {j.dateText}
          </text>
        </g>
      ))}
      <text x={M.left + pw / 2} y={H - 4} fontSize="10" textAnchor="middle" className="fill-graphite-600">
        Job (reference, date)
      </text>
      {pts.length > 1 ? (
        <polyline
          points={pts.map((p) => `${x(p.i)},${y(p.value)}`).join(" ")}
          fill="none"
          stroke={palette.accent[500]}
          strokeWidth="1.5"
        />
      ) : null}
      {pts.map((p) => (
        <g key={p.i}>
          <line
            x1={x(p.i)}
            x2={x(p.i)}
            y1={y(p.value - p.U)}
            y2={y(p.value + p.U)}
            stroke={palette.accent[800]}
            strokeWidth="1.5"
          />
          <line
            x1={x(p.i) - 5}
            x2={x(p.i) + 5}
            y1={y(p.value - p.U)}
            y2={y(p.value - p.U)}
            stroke={palette.accent[800]}
            strokeWidth="1.5"
          />
          <line
            x1={x(p.i) - 5}
            x2={x(p.i) + 5}
            y1={y(p.value + p.U)}
            y2={y(p.value + p.U)}
            stroke={palette.accent[800]}
            strokeWidth="1.5"
          />
          <circle
            cx={x(p.i)}
            cy={y(p.value)}
            r="5"
            fill={p.approved ? palette.accent[500] : palette.white}
            stroke={palette.accent[800]}
            strokeWidth="2"
          />
        </g>
      ))}
    </svg>
  );
}
