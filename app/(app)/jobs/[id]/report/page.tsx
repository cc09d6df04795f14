import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { DataInstruments } from "@/components/report/data-instruments";
import { DeviationForm } from "@/components/report/deviation-form";
import { ReadinessList } from "@/components/report/readiness-list";
import { ReportView } from "@/components/report/report-view";
import { SignForm } from "@/components/report/sign-form";
import { Card } from "@/components/ui/card";
import { getJobDetail } from "@/db/queries/jobs";
import { getReadinessView } from "@/db/queries/readiness";
import { getReportContent, listJobReports } from "@/db/queries/reports";
import { listJobSignatures } from "@/db/queries/signatures";
import { ROLE_LABELS } from "@/lib/domain/roles";
import { SIGNATURE_LABELS, SIGNING_WORDS } from "@/lib/domain/signatures";
import { signatureRefusal } from "@/lib/policy/signatures";
import { requirePageUser } from "@/lib/auth/session";
import { formatDateTimeUtc } from "@/lib/format";
import { amendRefusal, deviationRefusal, draftPreviewRefusal, readinessRefusal } from "@/lib/policy/reports";
import { listInstrumentsForPicker, listJobInstruments } from "@/db/queries/job-instruments";
import { jobInstrumentRefusal, jobInstrumentsListRefusal } from "@/lib/policy/job-instruments";
import {
  issueReportAction,
  recordDeviationAction,
  recordJobInstrumentAction,
  respondAction,
  signWorkAction,
} from "./actions";

export const metadata: Metadata = { title: "Report" };
type Props = { params: Promise<{ id: string }> };

export default async function ReportPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser(`/jobs/${id}/report`);
  const d = await getJobDetail(user, id);
  if (!d) notFound();
  const [revisions, sigs] = await Promise.all([listJobReports(user, id), listJobSignatures(user, id)]);
  const current = revisions?.[0] ?? null;
  const content = current ? await getReportContent(user, current.id) : null;
  const mayIssueRole = !current && !signatureRefusal(user, { meaning: "approved", job: d.job });
  const mayAmend = !amendRefusal(user, { status: d.job.status, hasIssuedRevision: Boolean(current) });
  const mayRespond = current && !signatureRefusal(user, { meaning: "accepted", job: d.job });
  // Before issue, staff see what still stands in the way; a signature the record has moved past is stale.
  const view = !current && !readinessRefusal(user) ? await getReadinessView(user, id) : null;
  const stale = new Set(view?.staleSignatureIds ?? []);
  const work = (["performed", "inspected"] as const).filter(
    (m) =>
      !signatureRefusal(user, { meaning: m, job: d.job }) &&
      !sigs?.some(
        (s) => s.meaning === m && s.reportId === null && s.signerId === user.id && !stale.has(s.id),
      ),
  );
  const openResults = view?.nonConforming.filter((r) => !r.deviation) ?? [];
  // The issue form appears once nothing stands in the way (issueReport refuses otherwise, 409).
  const mayIssue = mayIssueRole && Boolean(view?.readiness.ready);
  const mayRecordDeviation = Boolean(view) && !deviationRefusal(user, d.job) && openResults.length > 0;
  // The probe, reference sphere and CMM behind the data (staff only; added while the work is open).
  const dataInstruments = jobInstrumentsListRefusal(user) ? null : await listJobInstruments(d.job.id);
  const pickable = !current && !jobInstrumentRefusal(user, d.job) ? await listInstrumentsForPicker() : null;

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6 xl:grid-cols-[minmax(0,1fr)_22rem]">
      <div className="space-y-4">
        {content ? (
          <>
            <div className="flex flex-wrap items-center justify-between gap-3">
              <p className="text-sm text-graphite-600">
                Revision {current!.revision}, issued {formatDateTimeUtc(current!.issuedAt)} · SHA-256{" "}
                <span className="num">{current!.pdfSha256.slice(0, 16)}…</span>
              </p>
              <div className="flex gap-2">
                <a
                  href={`/api/reports/${current!.id}/pdf`}
                  className="inline-flex min-h-touch items-center rounded-lg bg-graphite-800 px-4 font-semibold text-white hover:bg-graphite-900"
                >
                  Download signed PDF
                </a>
                <a
                  href={`/verify/${current!.id}`}
                  className="inline-flex min-h-touch items-center rounded-lg border border-graphite-300 bg-white px-4 font-semibold"
                >
                  Verification page
                </a>
              </div>
            </div>
            <ReportView data={content} />
          </>
        ) : (
          <>
            <Card title="No report issued yet">
              <p className="text-sm text-graphite-600">
                The report is rendered and signed once, when the application engineer issues it after
                approving the head&apos;s parameters. Until then the work is signed here as performed and
                inspected.
              </p>
              {draftPreviewRefusal(user) === null ? (
                <p className="mt-3">
                  <a
                    href={`/api/jobs/${d.job.id}/report/draft`}
                    target="_blank"
                    rel="noopener"
                    className="inline-flex min-h-touch items-center rounded-lg border border-graphite-300 bg-white px-4 font-semibold"
                  >
                    Preview the draft (PDF)
                  </a>
                  <span className="ml-3 text-sm text-graphite-600">
                    Watermarked DRAFT, unsigned and not stored.
                  </span>
                </p>
              ) : null}
            </Card>
            {view ? (
              <section aria-label="Readiness" id="readiness">
                <Card title="Before issue">
                  <ReadinessList blockers={view.readiness.blockers} />
                </Card>
              </section>
            ) : null}
            {view && (view.nonConforming.length > 0 || mayRecordDeviation) ? (
              <section aria-label="Deviations" id="deviations" className="space-y-3">
                <Card title="FAIL and undecided results">
                  <ul className="space-y-2 text-sm">
                    {view.nonConforming.map((r) => (
                      <li key={r.subject} className="border-l-4 border-graphite-300 pl-3">
                        <p className="font-semibold">
                          {r.label} — {r.decision === "fail" ? "FAIL" : "undecided"}
                        </p>
                        {r.deviation ? (
                          <p className="text-graphite-700">
                            Carried as a deviation by {r.deviation.approvedByName},{" "}
                            {formatDateTimeUtc(r.deviation.createdAt)}: {r.deviation.justification}
                          </p>
                        ) : (
                          <p className="text-graphite-600">Open: measure again or record a deviation.</p>
                        )}
                      </li>
                    ))}
                  </ul>
                </Card>
                {mayRecordDeviation ? (
                  <DeviationForm jobId={d.job.id} results={openResults} run={recordDeviationAction} />
                ) : null}
              </section>
            ) : null}
          </>
        )}
        {dataInstruments ? (
          <DataInstruments
            jobId={d.job.id}
            recorded={dataInstruments.map((x) => ({
              id: x.id,
              use: x.use,
              serial: x.serial,
              kind: x.kind,
              size: x.calibratedSizeMm ? `${x.calibratedSizeMm.toFixed(4)} mm` : null,
            }))}
            register={pickable}
            run={recordJobInstrumentAction}
          />
        ) : null}
      </div>
      <aside className="space-y-4" aria-label="Signatures">
        <Card title="Signatures">
          {sigs && sigs.length ? (
            <ul className="space-y-3 text-sm">
              {sigs.map((s) => (
                <li key={s.id} className="border-l-4 border-accent-500 pl-3">
                  <p className="font-semibold">{SIGNATURE_LABELS[s.meaning]}</p>
                  <p>
                    {s.signerName} — {ROLE_LABELS[s.signerRole]}
                  </p>
                  <p className="num text-graphite-600">{formatDateTimeUtc(s.signedAt)}</p>
                  {stale.has(s.id) ? (
                    <p className="text-fail-700" data-testid="signature-stale">
                      Stale: the record changed after this signature; sign again.
                    </p>
                  ) : null}
                  {s.comment ? <p className="text-graphite-700">“{s.comment}”</p> : null}
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-sm text-graphite-600">No signatures yet.</p>
          )}
        </Card>
        <div id="sign" className="space-y-4">
          {work.map((m) => (
            <SignForm
              key={m}
              {...SIGNING_WORDS[m]}
              hidden={{ jobId: d.job.id, meaning: m }}
              run={signWorkAction}
            />
          ))}
        </div>
        {mayIssue ? (
          <SignForm {...SIGNING_WORDS.approved} hidden={{ jobId: d.job.id }} run={issueReportAction} />
        ) : null}
        {mayAmend ? (
          <SignForm {...SIGNING_WORDS.amendment} hidden={{ jobId: d.job.id }} run={issueReportAction} />
        ) : null}
        {mayRespond ? (
          <>
            <SignForm
              {...SIGNING_WORDS.accepted}
              hidden={{ jobId: d.job.id, reportId: current!.id, decision: "accepted" }}
              run={respondAction}
            />
            <SignForm
              {...SIGNING_WORDS.rejected}
              tone="danger"
              hidden={{ jobId: d.job.id, reportId: current!.id, decision: "rejected" }}
              run={respondAction}
            />
          </>
        ) : null}
      </aside>
    </div>
  );
}
