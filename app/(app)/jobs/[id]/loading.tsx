import { PageSkeleton } from "@/components/ui/skeleton";

/** Shown under the job's header and tabs while a section of the job loads. */
export default function JobSectionLoading() {
  return <PageSkeleton label="Loading this part of the job…" rows={5} />;
}
