import Link from "next/link";
import { ParameterTrend, type TrendSeries } from "@/components/charts/parameter-trend";
import { Card } from "@/components/ui/card";
import { StatusBadge } from "@/components/ui/status-badge";
import { Table, type ColumnDef } from "@/components/ui/table";
import type { HeadHistoryJob } from "@/lib/domain/heads";
import { HEAD_PARAMETER_KEYS } from "@/geometry";
import { parameterRows, PARAMETER_WORDS, type ParameterRow } from "@/lib/fit-display";
import { JOB_KIND_LABELS } from "@/lib/domain/jobs";
import { formatDate, formatDateTimeUtc } from "@/lib/format";
import { UNIT_SYMBOL } from "@/lib/units";

type HistoryJob = HeadHistoryJob;
type HistoryRow = { key: (typeof HEAD_PARAMETER_KEYS)[number] | "rms" };

/** The fitted parameters of every job on the head side by side (one column per job), then their trend. */
export function FitHistory({ history }: { history: { readonly jobs: readonly HeadHistoryJob[] } }) {
  const jobs = history.jobs;
  const rowsByJob = jobs.map((j) =>
    j.fit ? new Map(parameterRows(j.fit.fit).map((r) => [r.key, r])) : null,
  );
  const symbolOf = (key: (typeof HEAD_PARAMETER_KEYS)[number]) =>
    rowsByJob.find((m) => m?.get(key))?.get(key)?.iso ?? key;
  const fitted = jobs.map((j, i) => ({ j, rows: rowsByJob[i]! })).filter((x) => x.rows !== null);
  const series: TrendSeries[] = HEAD_PARAMETER_KEYS.flatMap((key) => {
    const pts = fitted.map(({ j, rows }) => {
      const r = rows.get(key);
      const U = j.fit?.fit.parameters.find((p) => p.key === key)?.U;
      return r && !r.heldAtZero && U != null
        ? { value: r.value, U, approved: Boolean(j.fit?.approved), text: valuePlusMinus(r) }
        : null;
    });
    if (pts.every((p) => p === null)) return [];
    const unit = fitted.map(({ rows }) => rows.get(key)?.unit).find(Boolean) ?? "um";
    return [{ key, symbol: symbolOf(key), words: PARAMETER_WORDS[key], unit, points: pts }];
  });

  return (
    <Card title="Fitted parameters by job">
      {jobs.length === 0 ? (
        <p className="text-sm text-graphite-600">No jobs on this head yet.</p>
      ) : (
        <div className="space-y-6">
          <p className="text-sm text-graphite-600">
            For each job on this head: the approved parameter set, or the latest fit where none is approved
            yet. Values are the head as measured minus the head as designed, ± U (k = 2).
          </p>
          <Table
            caption="Fitted parameters by job"
            empty="No jobs on this head yet."
            bare
            layout="scroll"
            tableClassName="min-w-[40rem]"
            tableProps={{ "data-testid": "head-history" }}
            data={[...HEAD_PARAMETER_KEYS.map((key) => ({ key })), { key: "rms" as const }]}
            rowProps={(r) => (r.key === "rms" ? {} : { "data-key": r.key })}
            columns={[
              {
                id: "parameter",
                header: "Parameter",
                cell: ({ row: { original: r } }) =>
                  r.key === "rms" ? (
                    <span className="text-graphite-700">Residual RMS · dataset</span>
                  ) : (
                    <>
                      <span className="num font-semibold text-graphite-900">{symbolOf(r.key)}</span>{" "}
                      <span className="text-graphite-700">{PARAMETER_WORDS[r.key]}</span>
                    </>
                  ),
                meta: { rowHeader: true, className: "pr-4", headerClassName: "text-graphite-600" },
              },
              ...jobs.map((j, i): ColumnDef<HistoryRow, unknown> => ({
                id: j.id,
                header: () => <JobHeading job={j} />,
                cell: ({ row: { original: r } }) =>
                  r.key === "rms" ? <RmsCell job={j} /> : <ValueCell row={rowsByJob[i]?.get(r.key)} />,
                meta: {
                  numeric: true,
                  label: j.reference,
                  nowrap: false,
                  className: "pr-4",
                  headerClassName: "min-w-[11rem] pr-4 align-bottom font-normal",
                  headerProps: { "data-job": j.reference },
                  cellProps: (r) => {
                    const v = r.key === "rms" ? undefined : rowsByJob[i]?.get(r.key);
                    return { "data-value": v && !v.heldAtZero ? v.value : undefined };
                  },
                },
              })),
            ]}
          />
          {series.length > 0 && fitted.length > 0 ? (
            <div>
              <h3 className="mb-2 text-sm font-semibold text-graphite-900">Trend across jobs</h3>
              <ParameterTrend
                jobs={fitted.map(({ j }) => ({
                  key: j.id,
                  reference: j.reference,
                  dateText: formatDate(j.date),
                }))}
                series={series}
              />
            </div>
          ) : (
            <p className="text-sm text-graphite-600">
              No job on this head has a fit yet, so there is no trend to draw.
            </p>
          )}
        </div>
      )}
    </Card>
  );
}

function valuePlusMinus(r: ParameterRow): string {
  return `${r.valueText.replace(` ${UNIT_SYMBOL[r.unit]}`, "")} ${r.UText}`.trim();
}

function JobHeading({ job: j }: { job: HistoryJob }) {
  return (
    <>
      {j.open === false ? (
        <span className="num font-semibold text-graphite-900">{j.reference}</span>
      ) : (
        <Link
          href={j.fit ? `/jobs/${j.id}/analysis?analysis=${j.fit.analysisId}` : `/jobs/${j.id}`}
          className="num font-semibold text-accent-700 underline-offset-2 hover:underline"
        >
          {j.reference}
        </Link>
      )}
      <span className="block text-graphite-800">{JOB_KIND_LABELS[j.kind]}</span>
      <span className="num block text-graphite-600">{formatDate(j.date)}</span>
      <span className="mt-1 inline-block">
        <StatusBadge status={j.status} />
      </span>
      <span className="block text-xs text-graphite-600">
        {j.fit
          ? j.fit.approved
            ? "✓ approved fit"
            : `latest fit, not approved (${formatDateTimeUtc(j.fit.createdAt)})`
          : "no fit yet"}
      </span>
    </>
  );
}

function ValueCell({ row: r }: { row: ParameterRow | undefined }) {
  if (!r) return <span className="text-graphite-500">—</span>;
  if (r.heldAtZero) return <span className="text-graphite-600">held at 0</span>;
  return <span className="whitespace-nowrap">{valuePlusMinus(r)}</span>;
}

function RmsCell({ job: j }: { job: HistoryJob }) {
  if (!j.fit) return <span className="text-xs text-graphite-600">—</span>;
  return (
    <span className="font-sans text-xs text-graphite-600">
      <span className="num">{j.fit.fit.rms_um.toFixed(2)} µm</span> ·{" "}
      {j.fit.phase === "pre" ? "before" : "after"} adjustment
      <span className="block">{j.fit.datasetFilename}</span>
    </span>
  );
}
