import { PageSkeleton } from "@/components/ui/skeleton";

/**
 * Shown under the job's header and tabs while a section of the job loads. The job's access check
 * runs in the layout above this boundary, so a job the user may not open still answers 404.
 */
export default function JobSectionLoading() {
  return <PageSkeleton label="Loading this part of the job…" rows={5} />;
}
