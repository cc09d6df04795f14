import { PageSkeleton } from "@/components/ui/skeleton";

export default function JobsLoading() {
  return <PageSkeleton label="Loading the jobs…" rows={8} />;
}
