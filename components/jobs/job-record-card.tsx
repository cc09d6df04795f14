import { AssignInstallerForm, JobMoveControls, JobRecordForm } from "@/components/jobs/job-office-forms";
import { LocalTime } from "@/components/readings/local-time";
import { Card, Facts } from "@/components/ui/card";
import type { JobStatus } from "@/lib/domain/jobs";
import type { Actor } from "@/lib/domain/roles";
import { utcToZoned } from "@/lib/domain/schedule";
import { formatDateTime } from "@/lib/format";
import {
  jobAssignRefusal,
  jobCancelRefusal,
  jobHoldRefusal,
  jobRecordEditRefusal,
  jobReleaseRefusal,
} from "@/lib/policy/jobs";

/**
 * The job's record as the office keeps it (order, customer contact, schedule with its zone,
 * condition as found, next re-check, notes), the hold or cancel reason, and — for the office while
 * the job is open — the forms that change them.
 */
export interface JobRecordFields {
  id: string;
  title: string;
  status: JobStatus;
  assignedInstallerId: string | null;
  orderReference: string | null;
  customerContactName: string | null;
  customerContactEmail: string | null;
  scheduledFor: Date | null;
  timeZone: string | null;
  conditionAsFound: string | null;
  nextRecheckOn: string | null;
  notes: string | null;
  holdReason: string | null;
  cancelReason: string | null;
}

/** Which office controls this actor gets on this job (the page loads the installers only when assigning is open). */
export function jobOfficeControls(user: Actor, job: { status: JobStatus }) {
  return {
    mayEdit: jobRecordEditRefusal(user, job) === null,
    mayAssign: jobAssignRefusal(user, job) === null,
    mayHold: jobHoldRefusal(user, job) === null,
    mayRelease: jobReleaseRefusal(user, job) === null,
    mayCancel: jobCancelRefusal(user, job) === null,
  };
}

export function JobRecordCard({
  user,
  job,
  installerName,
  installers,
}: {
  user: Actor;
  job: JobRecordFields;
  installerName: string | null;
  /** Active installers, when the actor may assign. */
  installers: { id: string; name: string }[];
}) {
  const { mayEdit, mayAssign, ...moves } = jobOfficeControls(user, job);
  const zone = job.timeZone ?? "UTC";
  const wall = job.scheduledFor ? utcToZoned(job.scheduledFor, zone) : null;
  const contact = [job.customerContactName, job.customerContactEmail].filter(Boolean).join(", ");
  return (
    <Card title="Order and schedule">
      {job.status === "cancelled" ? (
        <p role="status" className="mb-4 rounded-md bg-graphite-100 px-3 py-2 text-sm text-graphite-800">
          Cancelled: {job.cancelReason ?? "no reason recorded"}. The job and its readings stay readable;
          nothing more can be changed.
        </p>
      ) : null}
      {job.status === "on_hold" ? (
        <p role="status" className="mb-4 rounded-md bg-graphite-100 px-3 py-2 text-sm text-graphite-800">
          On hold{job.holdReason ? `: ${job.holdReason}` : ""}. No readings or data are taken until it is
          released.
        </p>
      ) : null}
      <Facts
        items={[
          { label: "Order reference", value: job.orderReference, mono: true },
          { label: "Customer contact", value: contact || null },
          {
            label: "Scheduled",
            value: job.scheduledFor ? (
              <>
                <span className="num">{formatDateTime(job.scheduledFor, zone)}</span>{" "}
                <span className="text-graphite-600">({zone} at the machine)</span>
                <br />
                <span className="text-graphite-600">
                  Your time: <LocalTime at={job.scheduledFor} />
                </span>
              </>
            ) : (
              "Not scheduled yet"
            ),
          },
          { label: "Installer", value: installerName ?? "Not assigned yet" },
          { label: "Condition as found", value: job.conditionAsFound },
          { label: "Next re-check", value: job.nextRecheckOn, mono: true },
          {
            label: "Notes",
            value: job.notes ? <span className="whitespace-pre-line">{job.notes}</span> : null,
          },
        ]}
      />
      {mayEdit || mayAssign || moves.mayHold || moves.mayRelease || moves.mayCancel ? (
        <div className="mt-5 space-y-5 border-t border-graphite-100 pt-4">
          {mayAssign ? (
            <div className="max-w-md">
              <AssignInstallerForm jobId={job.id} current={job.assignedInstallerId} installers={installers} />
            </div>
          ) : null}
          {mayEdit ? (
            <details>
              <summary className="min-h-touch cursor-pointer py-2 text-sm font-medium text-accent-700">
                Edit the order, schedule and notes
              </summary>
              <div className="pt-3">
                <JobRecordForm
                  v={{
                    jobId: job.id,
                    title: job.title,
                    orderReference: job.orderReference ?? "",
                    customerContactName: job.customerContactName ?? "",
                    customerContactEmail: job.customerContactEmail ?? "",
                    scheduledDate: wall?.date ?? "",
                    scheduledTime: wall?.time ?? "",
                    timeZone: job.timeZone ?? "",
                    notes: job.notes ?? "",
                    conditionAsFound: job.conditionAsFound ?? "",
                    nextRecheckOn: job.nextRecheckOn ?? "",
                  }}
                />
              </div>
            </details>
          ) : null}
          <JobMoveControls jobId={job.id} {...moves} />
        </div>
      ) : null}
    </Card>
  );
}
