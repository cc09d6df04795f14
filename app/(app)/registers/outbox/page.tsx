import type { Metadata } from "next";
import { PageHeading } from "@/components/ui/page-heading";
import { notFound } from "next/navigation";
import { listOutbox } from "@/db/queries/outbox";
import { registerReadRefusal } from "@/lib/policy/registers";
import { requirePageUser } from "@/lib/auth/session";
import { OUTBOX_STATUS_LABELS } from "@/lib/domain/outbox";
import { formatDateTimeUtc } from "@/lib/format";

export const metadata: Metadata = { title: "Outbox" };

/** The dev inbox: every e-mail the app has queued, with its delivery state. */
export default async function OutboxPage() {
  const user = await requirePageUser("/registers/outbox");
  if (registerReadRefusal(user, "outbox")) notFound();
  const rows = await listOutbox(user);
  return (
    <div className="space-y-6">
      <PageHeading title="Outbox">
        E-mail queued by the app, newest first. A worker inside the app sends due messages every few seconds
        through SMTP (in the demo, a local fake that keeps them under <span className="num">.data/mail</span>
        ), retrying with growing waits.
      </PageHeading>
      {rows.length === 0 ? <p className="text-sm text-graphite-600">Nothing has been queued yet.</p> : null}
      <ul className="space-y-3">
        {rows.map((m) => (
          <li key={m.id} className="rounded-card border border-graphite-200 bg-white p-4 shadow-sm">
            <details>
              <summary className="flex min-h-touch cursor-pointer flex-wrap items-center gap-x-4 gap-y-1">
                <span className="font-medium">{m.subject}</span>
                <span className="text-sm text-graphite-600">to {m.toAddress}</span>
                <span
                  className={`ml-auto rounded-full px-2.5 py-0.5 text-xs font-medium ring-1 ring-inset ${m.status === "sent" ? "bg-pass-50 text-pass-700 ring-pass-600/40" : m.status === "failed" ? "bg-fail-50 text-fail-700 ring-fail-600/40" : "bg-accent-50 text-accent-800 ring-accent-300"}`}
                >
                  {OUTBOX_STATUS_LABELS[m.status]}
                </span>
              </summary>
              <dl className="mt-3 grid grid-cols-[10rem_1fr] gap-x-4 gap-y-1 text-sm">
                <dt className="text-graphite-600">Queued</dt>
                <dd className="num">{formatDateTimeUtc(m.createdAt)}</dd>
                <dt className="text-graphite-600">Sent</dt>
                <dd className="num">{formatDateTimeUtc(m.sentAt)}</dd>
                <dt className="text-graphite-600">Attempts</dt>
                <dd className="num">{m.attempts}</dd>
                {m.lastError ? (
                  <>
                    <dt className="text-graphite-600">Last error</dt>
                    <dd className="text-fail-700">{m.lastError}</dd>
                  </>
                ) : null}
              </dl>
              <pre className="mt-3 whitespace-pre-wrap rounded-md bg-graphite-50 p-3 text-sm">
                {m.textBody.replace(/token=[A-Za-z0-9_-]+/g, "token=…")}
              </pre>
            </details>
          </li>
        ))}
      </ul>
    </div>
  );
}
