import type { Metadata } from "next";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { NewJobForm } from "@/components/jobs/new-job-form";
import { Card } from "@/components/ui/card";
import { SafetyNote } from "@/components/ui/safety-note";
import { newJobChoices } from "@/db/queries/job-office";
import { requirePageUser } from "@/lib/auth/session";
import { jobCreateRefusal } from "@/lib/policy/jobs";

export const metadata: Metadata = { title: "New job" };

export default async function NewJobPage() {
  const user = await requirePageUser("/jobs/new");
  const refusal = jobCreateRefusal(user);
  return (
    <div className="space-y-6">
      <Breadcrumb parent={{ href: "/jobs", label: "Jobs" }}>New job</Breadcrumb>
      <h1 className="text-2xl font-semibold">New job</h1>
      {refusal ? (
        <Card>
          <p role="alert">{refusal}</p>
        </Card>
      ) : (
        <>
          <Card>
            <NewJobForm choices={await newJobChoices(user)} />
          </Card>
          <SafetyNote title="Before the installer goes to the machine">
            <p>
              Book lifting gear rated for the head and agree a lock-out with the customer&apos;s site. The
              machine builder&apos;s and head maker&apos;s manuals, local codes and licensed practice come
              first; the procedure does not replace them.
            </p>
          </SafetyNote>
        </>
      )}
    </div>
  );
}
