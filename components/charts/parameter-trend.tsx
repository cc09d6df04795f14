/**
 * A head's fitted parameters across its jobs, as small multiples: one panel per parameter, jobs
 * in date order along x, the value with its ± U (k = 2) bar along y in the parameter's own unit.
 * An approved fit is a filled circle, a fit not (yet) approved a hollow one, so the state does not
 * rest on colour. Server-rendered SVG; each panel has its title and description, and the same
 * numbers follow as a table.
 */
import { Panel } from "@/components/charts/trend-panel";
import { palette } from "@/lib/domain/theme";
import type { ColumnDef } from "@/components/ui/table";
import { ChartedValues } from "./charted-values";

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
          <FitSwatch fill={palette.accent[500]} />
          approved fit
        </span>
        <span className="inline-flex items-center gap-1">
          <FitSwatch fill={palette.white} />
          latest fit, not approved
        </span>
      </figcaption>
      <ChartedValues
        className="mt-3"
        caption="Charted parameter values"
        empty="Nothing charted."
        data={series}
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
    </figure>
  );
}

/** The legend's mark for a fit: filled for the approved one, hollow for one not approved. */
function FitSwatch({ fill }: { fill: string }) {
  return (
    <svg viewBox="0 0 12 12" className="h-3 w-3" aria-hidden="true">
      <circle cx="6" cy="6" r="4.5" fill={fill} stroke={palette.accent[800]} strokeWidth="1.5" />
    </svg>
  );
}
