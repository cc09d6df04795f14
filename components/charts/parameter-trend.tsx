/**
 * A head's fitted parameters across its jobs, as small multiples: one panel per parameter, jobs
 * in date order along x, the value with its ± U (k = 2) bar along y in the parameter's own unit.
 * An approved fit is a filled circle, a fit not (yet) approved a hollow one, so the state does not
 * rest on colour. Server-rendered SVG; each panel has its title and description, and the same
 * numbers follow as a table.
 */
import { palette } from "@/lib/domain/theme";
import { niceTicks } from "@/lib/chart-ticks";
import { Table, type ColumnDef } from "@/components/ui/table";

export interface TrendJob {
  key: string;
  reference: string;
  dateText: string;
}

export interface TrendSeries {
  key: string;
  symbol: string;
  words: string;
  unit: "um" | "arcsec";
  /** One entry per job, in the order of `jobs`; null where the job has no fit or the parameter was held. */
  points: ({ value: number; U: number; approved: boolean; text: string } | null)[];
}

const UNIT_AXIS = { um: "µm", arcsec: "″ (arc seconds)" } as const;
const W = 340;
const H = 210;
const M = { left: 56, right: 14, top: 30, bottom: 46 };

function Panel({ jobs, s, index }: { jobs: TrendJob[]; s: TrendSeries; index: number }) {
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
        <g key={j.key}>
          <text
            x={x(i)}
            y={H - M.bottom + 16}
            fontSize="10.5"
            textAnchor="middle"
            className="fill-graphite-800"
            fontFamily="var(--font-mono), monospace"
          >
            {j.reference.replace(/^TR-\d{4}-/, "")}
          </text>
          <text
            x={x(i)}
            y={H - M.bottom + 29}
            fontSize="9.5"
            textAnchor="middle"
            className="fill-graphite-600"
          >
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

export function ParameterTrend({
  jobs,
  series,
  caption,
}: {
  jobs: TrendJob[];
  series: TrendSeries[];
  caption?: string;
}) {
  return (
    <figure data-testid="parameter-trend">
      <div className="grid gap-x-6 gap-y-4 sm:grid-cols-2 xl:grid-cols-3">
        {series.map((s, i) => (
          <div key={s.key} className="rounded-md border border-graphite-100 p-2">
            <Panel jobs={jobs} s={s} index={i} />
          </div>
        ))}
      </div>
      <figcaption className="mt-3 flex flex-wrap items-center gap-x-5 gap-y-1 text-xs text-graphite-600">
        <span>{caption ?? "Each panel has its own scale; bars are ± U (k = 2); dashed: zero."}</span>
        <span className="inline-flex items-center gap-1">
          <svg viewBox="0 0 12 12" className="h-3 w-3" aria-hidden="true">
            <circle
              cx="6"
              cy="6"
              r="4.5"
              fill={palette.accent[500]}
              stroke={palette.accent[800]}
              strokeWidth="1.5"
            />
          </svg>
          approved fit
        </span>
        <span className="inline-flex items-center gap-1">
          <svg viewBox="0 0 12 12" className="h-3 w-3" aria-hidden="true">
            <circle
              cx="6"
              cy="6"
              r="4.5"
              fill={palette.white}
              stroke={palette.accent[800]}
              strokeWidth="1.5"
            />
          </svg>
          latest fit, not approved
        </span>
      </figcaption>
      <details className="mt-3 text-sm">
        <summary className="min-h-touch cursor-pointer py-2 font-medium text-graphite-800">
          The charted values as a table
        </summary>
        <Table
          caption="Charted parameter values"
          empty="Nothing charted."
          bare
          layout="scroll"
          data={series}
          getRowId={(s) => s.key}
          columns={[
            {
              id: "parameter",
              header: "Parameter",
              cell: ({ row }) => <span className="font-medium">{row.original.symbol}</span>,
              meta: { rowHeader: true },
            },
            ...jobs.map((j, i): ColumnDef<TrendSeries, unknown> => ({
              id: j.key,
              header: () => (
                <>
                  {j.reference} <span className="font-normal">({j.dateText})</span>
                </>
              ),
              cell: ({ row }) => row.original.points[i]?.text ?? "—",
              meta: { numeric: true, label: `${j.reference} (${j.dateText})` },
            })),
          ]}
        />
      </details>
    </figure>
  );
}
