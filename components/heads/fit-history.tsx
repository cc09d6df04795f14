import Link from "next/link";
import { ParameterTrend, type TrendSeries } from "@/components/charts/parameter-trend";
import { Card } from "@/components/ui/card";
import { ScrollRegion } from "@/components/ui/scroll-region";
import { StatusBadge } from "@/components/ui/status-badge";
import type { HeadHistoryJob } from "@/lib/domain/heads";
import { HEAD_PARAMETER_KEYS } from "@/geometry";
import { parameterRows, PARAMETER_WORDS, type ParameterRow } from "@/lib/fit-display";
import { JOB_KIND_LABELS } from "@/lib/domain/jobs";
import { formatDate, formatDateTimeUtc } from "@/lib/format";

const UNIT_TEXT = { um: "µm", arcsec: "″" } as const;

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
          <ScrollRegion label="Fitted parameters by job, table">
            <table
              className="w-full min-w-[40rem] text-sm"
              aria-label="Fitted parameters by job"
              data-testid="head-history"
            >
              <thead>
                <tr className="border-b border-graphite-200 align-bottom">
                  <th scope="col" className="py-2 pr-4 text-left font-medium text-graphite-600">
                    Parameter
                  </th>
                  {jobs.map((j) => (
                    <th
                      key={j.id}
                      scope="col"
                      className="min-w-[11rem] py-2 pr-4 text-right align-bottom font-normal"
                      data-job={j.reference}
                    >
                      <Link
                        href={j.fit ? `/jobs/${j.id}/analysis?analysis=${j.fit.analysisId}` : `/jobs/${j.id}`}
                        className="num font-semibold text-accent-700 underline-offset-2 hover:underline"
                      >
                        {j.reference}
                      </Link>
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
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {HEAD_PARAMETER_KEYS.map((key) => (
                  <tr key={key} className="border-b border-graphite-100" data-key={key}>
                    <th scope="row" className="py-2 pr-4 text-left font-normal">
                      <span className="num font-semibold text-graphite-900">{symbolOf(key)}</span>{" "}
                      <span className="text-graphite-700">{PARAMETER_WORDS[key]}</span>
                    </th>
                    {jobs.map((j, i) => {
                      const r = rowsByJob[i]?.get(key);
                      return (
                        <td
                          key={j.id}
                          className="num py-2 pr-4 text-right"
                          data-value={r && !r.heldAtZero ? r.value : undefined}
                        >
                          {!r ? (
                            <span className="text-graphite-500">—</span>
                          ) : r.heldAtZero ? (
                            <span className="text-graphite-600">held at 0</span>
                          ) : (
                            valuePlusMinus(r)
                          )}
                        </td>
                      );
                    })}
                  </tr>
                ))}
                <tr>
                  <th scope="row" className="py-2 pr-4 text-left font-normal text-graphite-700">
                    Residual RMS · dataset
                  </th>
                  {jobs.map((j) => (
                    <td key={j.id} className="py-2 pr-4 text-right text-xs text-graphite-600">
                      {j.fit ? (
                        <>
                          <span className="num">{j.fit.fit.rms_um.toFixed(2)} µm</span> ·{" "}
                          {j.fit.phase === "pre" ? "before" : "after"} adjustment
                          <span className="block">{j.fit.datasetFilename}</span>
                        </>
                      ) : (
                        "—"
                      )}
                    </td>
                  ))}
                </tr>
              </tbody>
            </table>
          </ScrollRegion>
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
  return `${r.valueText.replace(` ${UNIT_TEXT[r.unit]}`, "")} ${r.UText}`.trim();
}
