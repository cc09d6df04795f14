import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { DatasetTable } from "@/components/datasets/dataset-table";
import { UploadPanel } from "@/components/datasets/upload-panel";
import { listDatasets } from "@/db/queries/datasets";
import { dataHandlerRefusal, uploadRefusal } from "@/lib/policy/datasets";
import { getJobDetail } from "@/db/queries/jobs";
import { requirePageUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Data" };

type Props = { params: Promise<{ id: string }> };

export default async function DataPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser(`/jobs/${id}/data`);
  const [d, rows] = await Promise.all([getJobDetail(user, id), listDatasets(user, id)]);
  if (!d || !rows) notFound();
  const mayUpload = uploadRefusal(user, d.job) === null;
  return (
    <div className="space-y-6">
      <div className="space-y-3">
        <h2 className="text-lg font-semibold">Measurement data</h2>
        <DatasetTable jobId={id} rows={rows} />
      </div>
      {mayUpload ? (
        <UploadPanel jobId={id} />
      ) : dataHandlerRefusal(user, "upload") === null ? (
        <p className="rounded-card border border-graphite-200 bg-white p-4 text-sm text-graphite-700">
          This job is {d.job.status.replace("_", " ")}: its data is fixed. New data goes on a new job or a
          correction of the report.
        </p>
      ) : null}
    </div>
  );
}
