import type { Metadata } from "next";
import { headFacts } from "@/components/heads/head-facts";
import Link from "next/link";
import { notFound } from "next/navigation";
import { StatusFlow } from "@/components/jobs/status-flow";
import { Card, Facts } from "@/components/ui/card";
import { SafetyNote } from "@/components/ui/safety-note";
import { ConformityStatement } from "@/components/report/conformity-statement";
import { getJobDetail } from "@/db/queries/jobs";
import { getJobConformity } from "@/db/queries/reports";
import { headHistoryRefusal } from "@/lib/policy/heads";
import { requirePageUser } from "@/lib/auth/session";
import { DECISION_RULE_MEANINGS } from "@/lib/domain/decisions";
import { formatDateTimeUtc } from "@/lib/format";
import { JobRecordCard, jobOfficeControls } from "@/components/jobs/job-record-card";
import { listActiveInstallers } from "@/db/queries/users-admin";

type Props = { params: Promise<{ id: string }> };

export const metadata: Metadata = { title: "Job" };

export default async function JobPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser(`/jobs/${id}`);
  // A job the user may not see is "not found", exactly like one that does not exist.
  const d = await getJobDetail(user, id);
  if (!d) notFound();
  const { job, site, machine, head, installer } = d;
  const statement = await getJobConformity(user, id);

  return (
    <div className="space-y-6">
      <Card>
        <StatusFlow status={job.status} heldFrom={job.heldFromStatus} />
      </Card>
      <JobRecordCard
        user={user}
        job={job}
        installerName={installer?.name ?? null}
        installers={jobOfficeControls(user, job).mayAssign ? await listActiveInstallers() : []}
      />
      {statement ? (
        <ConformityStatement
          conformity={statement.conformity}
          note={
            statement.issuedRevision !== null
              ? `As issued in the report, revision ${statement.issuedRevision}.`
              : "Provisional: the record as it stands now, by the rule the report will use; it is final when the report is issued."
          }
        />
      ) : null}

      <div className="grid gap-6 lg:grid-cols-2">
        <Card title="Host machine">
          <Facts
            items={[
              { label: "Name", value: machine.name },
              { label: "Kind", value: machine.kind },
              {
                label: "Builder and model",
                value: [machine.builder, machine.model].filter(Boolean).join(" ") || null,
              },
              { label: "Serial", value: machine.serial, mono: true },
              { label: "Control", value: machine.control },
              { label: "Site", value: `${site.name}${site.address ? `, ${site.address}` : ""}` },
            ]}
          />
        </Card>
        <Card title="Head">
          <Facts items={[{ label: "Serial", value: head.serial, mono: true }, ...headFacts(head)]} />
          {headHistoryRefusal(user) === null ? (
            <p className="mt-4 border-t border-graphite-100 pt-3 text-sm">
              <Link href={`/heads/${head.id}`} className="font-medium text-accent-700 underline">
                This head&apos;s fitted parameters, job by job
              </Link>
            </p>
          ) : null}
        </Card>
        <Card title="Work">
          <Facts
            items={[
              {
                label: "Air temperature",
                value: job.airTempC != null ? `${job.airTempC.toFixed(1)} °C` : "Not recorded",
                mono: true,
              },
              { label: "Decision rule", value: DECISION_RULE_MEANINGS[job.decisionRule] },
              { label: "Last change", value: formatDateTimeUtc(job.updatedAt) },
            ]}
          />
        </Card>
        <div className="space-y-4">
          <SafetyNote title="A heavy head is lifted and the spindle is worked on">
            <p>
              {head.massKg ? `This head weighs about ${head.massKg} kg. ` : ""}Lift it only with rated gear at
              its lifting points, keep hands clear of pinch points between head, collar and spindle nose, and
              lock out the machine before working on the spindle.
            </p>
            <p>
              Axes may move when jogging or probing: keep clear of the head&apos;s sweep. Follow the machine
              builder&apos;s and head maker&apos;s manuals, local codes and licensed practice.
            </p>
          </SafetyNote>
        </div>
      </div>
    </div>
  );
}
