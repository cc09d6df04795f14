import { notFound } from "next/navigation";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { JobTabs } from "@/components/jobs/job-tabs";
import { StatusBadge } from "@/components/ui/status-badge";
import { getJobDetail } from "@/db/queries/jobs";
import { requirePageUser } from "@/lib/auth/session";
import { JOB_KIND_LABELS } from "@/lib/domain/jobs";
import { pageUuid } from "@/lib/domain/uuid";

type Props = { params: Promise<{ id: string }>; children: React.ReactNode };

/** Header and section tabs shared by every page of a job; the access check runs here and again in each page's query. */
export default async function JobLayout({ params, children }: Props) {
  const id = pageUuid((await params).id);
  const user = await requirePageUser(`/jobs/${id}`);
  const d = await getJobDetail(user, id);
  if (!d) notFound();
  const { job, customer, site } = d;
  return (
    <div className="space-y-6">
      <Breadcrumb parent={{ href: "/jobs", label: "Jobs" }}>
        <span className="num">{job.reference}</span>
      </Breadcrumb>
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <p className="num text-sm text-graphite-600">{job.reference}</p>
          <h1 className="text-2xl font-semibold">{job.title}</h1>
          <p className="text-graphite-600">
            {JOB_KIND_LABELS[job.kind]} · {customer.name}, {site.name}
          </p>
        </div>
        <StatusBadge status={job.status} />
      </div>
      <JobTabs jobId={job.id} />
      {children}
    </div>
  );
}
