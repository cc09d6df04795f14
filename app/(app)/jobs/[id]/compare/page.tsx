import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { BandChart } from "@/components/charts/band-chart";
import { StatusButtons, UnitToggle } from "@/components/checklist/job-actions";
import { DecisionBadge } from "@/components/readings/decision-badge";
import { LIMIT_SOURCE_LABELS } from "@/lib/domain/procedures";
import { Card } from "@/components/ui/card";
import { Table } from "@/components/ui/table";
import { getComparison } from "@/db/queries/readings";
import { getUnitSystem } from "@/db/queries/user-prefs";
import { type JobStatus } from "@/lib/domain/jobs";
import { allowedTransitions } from "@/lib/policy/jobs";
import { requirePageUser } from "@/lib/auth/session";
import { shownValue, TEXT_KINDS } from "@/lib/step-kinds";
import { arcsecToUmPerM, formatLimits, formatValue } from "@/lib/units";

export const metadata: Metadata = { title: "Before and after" };

type Props = { params: Promise<{ id: string }> };

/** Review moves offered beside the comparison; the server checks them again (lib/policy/jobs.transitionRefusal). */
const REVIEW_MOVES: Partial<Record<JobStatus, string>> = {
  measuring: "Send back for more readings",
  approved: "Approve the readings",
};

export default async function ComparePage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser(`/jobs/${id}/compare`);
  const [c, unitSystem] = await Promise.all([getComparison(user, id), getUnitSystem(user)]);
  if (!c) notFound();
  const counts = { pass: 0, fail: 0, other: 0 };
  for (const r of c.rows) {
    if (r.status === "pass") counts.pass++;
    else if (r.status === "fail") counts.fail++;
    else counts.other++;
  }
  const moves =
    c.detail.job.status === "in_review"
      ? allowedTransitions(user, c.detail.job)
          .filter((to) => REVIEW_MOVES[to])
          .map((to) => ({ to, label: REVIEW_MOVES[to]! }))
      : [];
  const fmt = (v: number | null | undefined, kind: "length" | "angle", signed = false) =>
    formatValue(v, kind, unitSystem, { signed });

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h2 className="text-xl font-semibold">Before and after the adjustment</h2>
          <p className="text-sm text-graphite-600" data-testid="compare-summary">
            <span className="num">{counts.pass}</span> of <span className="num">{c.rows.length}</span> steps
            pass on their latest reading
            {counts.fail ? (
              <>
                , <span className="num">{counts.fail}</span> fail
              </>
            ) : null}
            {counts.other ? (
              <>
                , <span className="num">{counts.other}</span> not yet judged
              </>
            ) : null}
            . Corrected readings are left out; the latest current reading of each phase is shown.
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <UnitToggle current={unitSystem} path={`/jobs/${id}/compare`} />
          <a
            href={`/api/jobs/${id}/comparison/csv`}
            className="flex min-h-touch items-center rounded-md border border-graphite-300 bg-white px-4 text-sm font-medium hover:bg-graphite-100"
            download
          >
            Download CSV
          </a>
          <StatusButtons jobId={id} moves={moves} />
        </div>
      </div>

      <Table
        caption="Each step with its reading before and after the adjustment, the change, the limits and the result"
        empty="The job's procedure has no steps to compare."
        tableProps={{ "data-testid": "compare-table" }}
        data={c.rows}
        getRowId={(r) => r.stepId}
        rowProps={(r) => ({ "data-testid": `compare-row-${r.position}`, className: "align-top" })}
        columns={(column) => [
          column(
            "Step",
            (r) => (
              <>
                <span className="num mr-2 text-graphite-500">{r.position}</span>
                <span className="font-medium text-graphite-900">{r.title}</span>
                <span className="block text-xs text-graphite-500">
                  {r.quantity} · {LIMIT_SOURCE_LABELS[r.limitSource as keyof typeof LIMIT_SOURCE_LABELS]}
                </span>
              </>
            ),
            { rowHeader: true },
          ),
          ...(["pre", "post"] as const).map((p) =>
            column(
              p === "pre" ? "Before" : "After",
              (r) => {
                const v = r[p];
                if (!v) return <span className="text-graphite-400">—</span>;
                return (
                  <>
                    <span
                      className={`font-semibold ${r.derivation === "note" ? "whitespace-normal" : "whitespace-nowrap"}`}
                    >
                      {shownValue(r.kindStep, v.shown, unitSystem)}
                    </span>
                    {r.quantityKind === "angle" ? (
                      <span className="block text-xs text-graphite-500">
                        {arcsecToUmPerM(v.value).toFixed(1)} µm/m
                      </span>
                    ) : null}
                    {v.U > 0 && r.decisionRule === "guarded" ? (
                      <span className="block text-xs text-graphite-500">
                        U = ± {fmt(v.U, r.quantityKind)} (k = 2)
                      </span>
                    ) : null}
                    <span className="mt-1 block">
                      <DecisionBadge decision={v.decision} />
                    </span>
                  </>
                );
              },
              { numeric: true, cellProps: (r) => ({ "data-testid": `compare-${p}-${r.position}` }) },
            ),
          ),
          column("Change", (r) => (r.change != null ? fmt(r.change, r.quantityKind, true) : "—"), {
            numeric: true,
            cellProps: (r) => ({ "data-testid": `compare-change-${r.position}` }),
          }),
          column(
            "Limits",
            // A value never parts from its unit: a range may break only at "to".
            (r) =>
              formatLimits(r.lowerLimit, r.upperLimit, r.quantityKind, unitSystem)
                .split(" to ")
                .map((part, i) => (
                  <span key={i} className="whitespace-nowrap">
                    {i > 0 ? " to " : ""}
                    {part}
                  </span>
                )),
            { numeric: true },
          ),
          column("Result", (r) => <DecisionBadge decision={r.status} />, {
            cellProps: (r) => ({ "data-testid": `compare-status-${r.position}` }),
          }),
        ]}
      />

      <Card title="Readings against their limits">
        <BandChart
          rows={c.rows
            .map((r) => ({
              key: r.stepId,
              label: `${r.position}. ${r.quantity}`,
              lower: r.lowerLimit,
              upper: r.upperLimit,
              limitText: formatLimits(r.lowerLimit, r.upperLimit, r.quantityKind, unitSystem),
              pre: r.pre
                ? { value: r.pre.value, decision: r.pre.decision, text: fmt(r.pre.value, r.quantityKind) }
                : null,
              post: r.post
                ? { value: r.post.value, decision: r.post.decision, text: fmt(r.post.value, r.quantityKind) }
                : null,
            }))
            // Answers, records and notes have no place on a scale of lengths.
            .filter((_, i) => !TEXT_KINDS.includes(c.rows[i]!.derivation))}
        />
      </Card>
    </div>
  );
}
