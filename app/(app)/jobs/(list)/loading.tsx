import { PageSkeleton } from "@/components/ui/skeleton";

/**
 * The list's own skeleton. It sits in the (list) group so that it does not wrap the job pages: a
 * loading boundary above the job's layout would send the page before the layout's access check,
 * and a job the user may not open would answer 200 instead of 404.
 */
export default function JobsLoading() {
  return <PageSkeleton label="Loading the jobs…" rows={8} />;
}
