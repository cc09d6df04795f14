import { drawing, palette } from "@/lib/domain/theme";
import {
  LIMIT_ROW_BOX,
  limitRowLayout,
  reportCharts,
  type LimitRow,
  type LimitRowMark,
} from "@/lib/report/chart-data";
import type { ReportData } from "@/lib/report/types";
import { Residuals } from "@/components/report/residuals-figure";
import { StoredViewImage } from "@/components/viewer/stored-view-image";

/**
 * Section 7 of the report read online: the saved pictures and the same charts as the PDF, drawn
 * from the same numbers (lib/report/chart-data.ts) as SVG. Shapes and words carry the meaning as
 * well as colour: a hollow ring is before adjustment, a filled dot after.
 */
export function ReportFigures({ data }: { data: ReportData }) {
  const chartList = reportCharts(data.charts);
  let n = 0;
  const caption = (text: string) => (
    <figcaption className="mt-1 text-sm text-graphite-600">
      Figure {++n}. {text}
    </figcaption>
  );
  const none = data.figures.length === 0 && chartList.length === 0;
  if (none)
    return (
      <p className="text-sm text-graphite-600">No figures: nothing measured on this job gives a chart.</p>
    );
  return (
    <div className="space-y-6">
      {data.figures.map((f) => (
        <figure key={f.sha256}>
          <StoredViewImage
            viewId={f.viewId}
            alt={f.caption}
            width={f.widthPx}
            height={f.heightPx}
            className="mx-auto h-auto max-h-[28rem] w-auto max-w-full rounded border border-graphite-200"
          />
          {caption(`${f.caption} (${f.widthPx} × ${f.heightPx} px, SHA-256 ${f.sha256.slice(0, 16)}…)`)}
        </figure>
      ))}
      {data.figures.length === 0 && data.parameters.length > 0 ? (
        <p className="text-sm text-graphite-600">No picture of the 3D view was saved for this report.</p>
      ) : null}
      {chartList.map((c) => (
        <figure key={c.caption}>
          {c.kind === "limits" ? (
            <LimitRows rows={c.rows} title={c.title} legend={c.legend} />
          ) : (
            <Residuals r={c.residuals} />
          )}
          {caption(c.caption)}
        </figure>
      ))}
    </div>
  );
}

const { width: W, height: H } = LIMIT_ROW_BOX.page;

/** Each kind of mark: before adjustment a hollow ring, after it a filled dot, a single value an accent dot. */
const MARK: Record<LimitRowMark["kind"], React.SVGProps<SVGCircleElement>> = {
  before: { r: 4, fill: palette.white, stroke: palette.nominal[500], strokeWidth: 1.6 },
  after: { r: 3.6, fill: palette.graphite[900] },
  value: { r: 3.6, fill: drawing.accentLine },
};

function LimitRows({ rows, title, legend }: { rows: readonly LimitRow[]; title: string; legend: string }) {
  return (
    <div>
      <table className="w-full text-sm" aria-label={title}>
        <tbody className="divide-y divide-graphite-100">
          {rows.map((r, i) => {
            const l = limitRowLayout(r, LIMIT_ROW_BOX.page);
            return (
              <tr key={i}>
                <th scope="row" className="w-56 py-1 pr-3 text-left font-normal">
                  {r.label}
                </th>
                <td className="py-1 pr-3">
                  <svg
                    viewBox={`0 0 ${W} ${H}`}
                    className="h-[18px] w-full max-w-[360px]"
                    role="img"
                    aria-label={r.note}
                  >
                    <rect {...l.band} fill={drawing.limitBand} />
                    {l.limits.map((seg, j) => (
                      <line key={`l${j}`} {...seg} stroke={palette.pass[700]} strokeWidth={1.4} />
                    ))}
                    {l.zero ? (
                      <line
                        {...l.zero}
                        stroke={palette.graphite[600]}
                        strokeWidth={0.6}
                        strokeDasharray="2 2"
                      />
                    ) : null}
                    {l.travel ? <line {...l.travel} stroke={palette.graphite[600]} strokeWidth={1} /> : null}
                    {l.uBars.map((seg, j) => (
                      <line key={`u${j}`} {...seg} stroke={palette.graphite[900]} strokeWidth={1.4} />
                    ))}
                    {l.marks.map((m, j) => (
                      <circle key={j} cx={m.x} cy={l.mid} {...MARK[m.kind]} />
                    ))}
                  </svg>
                </td>
                <td className="num py-1 text-xs text-graphite-600">{r.note}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-graphite-600">{legend}</p>
    </div>
  );
}
