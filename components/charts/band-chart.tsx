/**
 * Readings against their limits as bands, before and after the adjustment side by side. Each
 * step is one row with its own scale (steps have different units): the tolerance band is shaded,
 * the limits are ticked and labelled, and the reading is a marker whose shape says its result
 * (circle pass, cross fail, diamond undecided) so colour is never the only signal.
 */
import { palette } from "@/lib/domain/theme";
import { rowLimits } from "@/lib/report/chart-data";
import { PHASE_LABELS } from "@/lib/domain/datasets";
import { ScrollRegion } from "@/components/ui/scroll-region";
import type { StepDecision } from "@/lib/checklist";

export interface BandRow {
  key: string;
  label: string;
  lower: number | null;
  upper: number | null;
  pre: { value: number; decision: StepDecision; text: string } | null;
  post: { value: number; decision: StepDecision; text: string } | null;
  limitText: string;
}

const PANEL_W = 300;
const LABEL_W = 230;
const ROW_H = 46;
const GAP = 28;
const TOP = 34;

const COLOURS: Record<StepDecision, string> = {
  pass: palette.pass[600],
  fail: palette.fail[600],
  undecided: palette.undecided[600],
  no_limit: palette.nominal[700],
  not_measured: palette.unmeasured[600],
};

function scale(row: BandRow) {
  const vals = [row.lower, row.upper, row.pre?.value, row.post?.value].filter(
    (v): v is number => v != null && Number.isFinite(v),
  );
  // A one-sided limit (flatness, TIR) starts at zero.
  if (row.lower == null && row.upper != null) vals.push(0);
  let lo = Math.min(...vals);
  let hi = Math.max(...vals);
  if (!(hi > lo)) {
    lo -= 1;
    hi += 1;
  }
  const pad = (hi - lo) * 0.15;
  lo -= pad;
  hi += pad;
  return (v: number) => ((v - lo) / (hi - lo)) * (PANEL_W - 20) + 10;
}

function Marker({ x, y, decision }: { x: number; y: number; decision: StepDecision }) {
  const c = COLOURS[decision];
  if (decision === "fail")
    return (
      <path
        d={`M${x - 6} ${y - 6}L${x + 6} ${y + 6}M${x + 6} ${y - 6}L${x - 6} ${y + 6}`}
        stroke={c}
        strokeWidth="3"
        strokeLinecap="round"
      />
    );
  if (decision === "undecided")
    return (
      <path
        d={`M${x} ${y - 7}L${x + 7} ${y}L${x} ${y + 7}L${x - 7} ${y}Z`}
        fill={c}
        stroke={palette.white}
        strokeWidth="1.5"
      />
    );
  return <circle cx={x} cy={y} r="6" fill={c} stroke={palette.white} strokeWidth="1.5" />;
}

export function BandChart({ rows }: { rows: BandRow[] }) {
  const width = LABEL_W + 2 * PANEL_W + GAP;
  const height = TOP + rows.length * ROW_H + 8;
  const panels = [
    { key: "pre" as const, title: PHASE_LABELS.pre, x0: LABEL_W },
    { key: "post" as const, title: PHASE_LABELS.post, x0: LABEL_W + PANEL_W + GAP },
  ];
  return (
    <ScrollRegion label="Readings against their limits, chart">
      <figure>
        <svg
          viewBox={`0 0 ${width} ${height}`}
          className="w-full min-w-[44rem]"
          role="img"
          aria-labelledby="band-title band-desc"
          data-testid="band-chart"
        >
          <title id="band-title">Readings against their limits, before and after the adjustment</title>
          <desc id="band-desc">
            {rows
              .map(
                (r) =>
                  `${r.label}: limit ${r.limitText}; before ${r.pre?.text ?? "not measured"}; after ${r.post?.text ?? "not measured"}.`,
              )
              .join(" ")}
          </desc>
          {panels.map((p) => (
            <text
              key={p.key}
              x={p.x0 + PANEL_W / 2}
              y={18}
              textAnchor="middle"
              className="fill-graphite-800"
              fontSize="13"
              fontWeight="600"
            >
              {p.title}
            </text>
          ))}
          {rows.map((row, i) => {
            const y = TOP + i * ROW_H + ROW_H / 2;
            const sx = scale(row);
            return (
              <g key={row.key}>
                {i % 2 === 0 ? (
                  <rect x={0} y={y - ROW_H / 2} width={width} height={ROW_H} fill={palette.graphite[50]} />
                ) : null}
                <text x={8} y={y - 3} fontSize="12" className="fill-graphite-900">
                  {row.label.length > 34 ? `${row.label.slice(0, 33)}…` : row.label}
                </text>
                <text
                  x={8}
                  y={y + 13}
                  fontSize="11"
                  className="fill-graphite-600"
                  fontFamily="var(--font-mono), monospace"
                >
                  {row.limitText}
                </text>
                {panels.map((p) => {
                  const lo = row.lower ?? (row.upper != null ? Math.min(0, row.upper) : null);
                  const hi = row.upper;
                  const r = row[p.key];
                  return (
                    <g key={p.key} transform={`translate(${p.x0},0)`}>
                      <line
                        x1={10}
                        x2={PANEL_W - 10}
                        y1={y}
                        y2={y}
                        stroke={palette.graphite[300]}
                        strokeWidth="1"
                      />
                      {lo != null && hi != null ? (
                        <rect
                          x={sx(lo)}
                          y={y - 9}
                          width={Math.max(1, sx(hi) - sx(lo))}
                          height={18}
                          fill={palette.nominal[100]}
                          stroke={palette.nominal[500]}
                          strokeWidth="1"
                          rx="2"
                        />
                      ) : null}
                      {rowLimits(row).map((v, j) => (
                        <line
                          key={`l${j}`}
                          x1={sx(v)}
                          x2={sx(v)}
                          y1={y - 13}
                          y2={y + 13}
                          stroke={palette.nominal[700]}
                          strokeWidth="2"
                        />
                      ))}
                      {r ? (
                        <>
                          <Marker x={sx(r.value)} y={y} decision={r.decision} />
                          <text
                            x={Math.min(PANEL_W - 4, Math.max(4, sx(r.value)))}
                            y={y - 14}
                            fontSize="10.5"
                            textAnchor="middle"
                            className="fill-graphite-800"
                            fontFamily="var(--font-mono), monospace"
                          >
                            {r.text}
                          </text>
                        </>
                      ) : (
                        <text
                          x={PANEL_W / 2}
                          y={y + 4}
                          fontSize="11"
                          textAnchor="middle"
                          className="fill-graphite-500"
                        >
                          not measured
                        </text>
                      )}
                    </g>
                  );
                })}
              </g>
            );
          })}
        </svg>
        <figcaption className="mt-2 flex flex-wrap gap-x-5 gap-y-1 text-xs text-graphite-600">
          <span>Shaded: tolerance band; bars: limits. Each row has its own scale.</span>
          <span className="inline-flex items-center gap-1">
            <svg viewBox="0 0 12 12" className="h-3 w-3" aria-hidden="true">
              <circle cx="6" cy="6" r="5" fill={COLOURS.pass} />
            </svg>{" "}
            pass
          </span>
          <span className="inline-flex items-center gap-1">
            <svg viewBox="0 0 12 12" className="h-3 w-3" aria-hidden="true">
              <path d="M1 1l10 10M11 1 1 11" stroke={COLOURS.fail} strokeWidth="2.5" />
            </svg>{" "}
            fail
          </span>
          <span className="inline-flex items-center gap-1">
            <svg viewBox="0 0 12 12" className="h-3 w-3" aria-hidden="true">
              <path d="M6 0l6 6-6 6-6-6z" fill={COLOURS.undecided} />
            </svg>{" "}
            undecided
          </span>
        </figcaption>
      </figure>
    </ScrollRegion>
  );
}
