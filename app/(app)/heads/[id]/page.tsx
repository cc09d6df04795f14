import type { Metadata } from "next";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import Link from "next/link";
import { notFound } from "next/navigation";
import { FitHistory } from "@/components/heads/fit-history";
import { getHeadFitHistory } from "@/db/queries/heads-admin";
import { headHistoryRefusal } from "@/lib/policy/heads";
import { registerReadRefusal } from "@/lib/policy/registers";
import { requirePageUser } from "@/lib/auth/session";
import { pageUuid } from "@/lib/domain/uuid";

export const metadata: Metadata = { title: "Head history" };

type Props = { params: Promise<{ id: string }> };

/**
 * A head's fitted parameters job by job, for the people who come back to compare: the engineer
 * and the office see every job on the head, the customer their own company's jobs on it only. A
 * head the person may not read is "not found", like one that does not exist.
 */
export default async function HeadHistoryPage({ params }: Props) {
  const id = pageUuid((await params).id);
  const user = await requirePageUser(`/heads/${id}`);
  if (headHistoryRefusal(user)) notFound();
  const history = await getHeadFitHistory(user, id);
  if (!history) notFound();
  const { head } = history;
  const staff = registerReadRefusal(user, "heads") === null;
  return (
    <div className="space-y-6">
      <Breadcrumb parent={{ href: "/jobs", label: "Jobs" }}>
        Head <span className="num">{head.serial}</span>
      </Breadcrumb>
      <div className="space-y-1">
        <h1 className="text-2xl font-semibold">
          Head <span className="num">{head.serial}</span>: fitted parameters over time
        </h1>
        <p className="text-sm text-graphite-600">
          {[head.maker, head.model].filter(Boolean).join(" ")}
          {head.maker || head.model ? " · " : ""}
          {head.primaryAxis} primary (rotary) / {head.secondaryAxis} secondary (tilt) · nominal pivot length{" "}
          <span className="num">{head.nominalPivotLengthMm.toFixed(3)} mm</span>
        </p>
        <p className="text-sm text-graphite-600">
          {staff ? (
            <>
              Every job on this head. Where it has been mounted and its configuration are in the{" "}
              <Link href={`/registers/heads/${head.id}`} className="text-accent-700 underline">
                heads register
              </Link>
              .
            </>
          ) : (
            "Your company's jobs on this head. A change between two jobs (after a collision, say) shows as a step in the trend."
          )}
        </p>
      </div>
      <FitHistory history={history} />
    </div>
  );
}
