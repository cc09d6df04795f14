import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Card } from "@/components/ui/card";
import { getJobActivity } from "@/db/queries/activity";
import { requirePageUser } from "@/lib/auth/session";
import { formatDateTimeUtc } from "@/lib/format";

export const metadata: Metadata = { title: "Activity" };
type Props = { params: Promise<{ id: string }> };

/** Plain words for the recorded actions; unknown ones are shown as recorded. */
function describe(action: string): string {
  const words: Record<string, string> = {
    "job.created": "Job created",
    "signature.performed": "Signed as work performed",
    "signature.inspected": "Signed as inspected",
    "report.issued": "Report approved and issued",
    "report.amended": "Amended report issued",
    "report.accepted": "Report accepted by the customer",
    "report.rejected": "Report rejected by the customer",
  };
  return words[action] ?? action.replace(/[._]/g, " ");
}

function summary(values: unknown): string {
  if (!values || typeof values !== "object") return "";
  return Object.entries(values as Record<string, unknown>)
    .filter(([, v]) => v !== null && v !== undefined && typeof v !== "object")
    .map(([k, v]) => `${k.replace(/([A-Z])/g, " $1").toLowerCase()}: ${String(v)}`)
    .join(" · ");
}

/** The job's timeline from the append-only, hash-chained audit trail. */
export default async function ActivityPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser(`/jobs/${id}/activity`);
  const events = await getJobActivity(user, id);
  if (!events) notFound();
  return (
    <Card title="Activity">
      <p className="mb-4 text-sm text-graphite-600">
        Every change to this job, its readings, data, signatures and reports, with who and when (UTC). The
        record is append-only and each entry is chained to the one before by its SHA-256.
      </p>
      <ol className="relative space-y-4 border-l-2 border-graphite-200 pl-5">
        {events.map((e) => (
          <li key={e.id} className="relative">
            <span
              aria-hidden="true"
              className="absolute -left-[1.6rem] top-1.5 h-3 w-3 rounded-full border-2 border-white bg-accent-600"
            />
            <p className="font-medium">{describe(e.action)}</p>
            <p className="text-sm text-graphite-600">
              <span className="num">{formatDateTimeUtc(e.at)}</span> · {e.actorEmail ?? "system"}
            </p>
            {summary(e.newValues) ? (
              <p className="text-sm text-graphite-700">{summary(e.newValues)}</p>
            ) : null}
            <p className="num text-xs text-graphite-500">
              #{e.id} · {e.hash.slice(0, 12)}…
            </p>
          </li>
        ))}
      </ol>
    </Card>
  );
}
