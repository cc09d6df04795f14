export default function Loading() {
  return (
    <div className="space-y-4" aria-busy="true" aria-label="Loading">
      <div className="h-8 w-48 animate-pulse rounded bg-graphite-200" />
      <div className="h-64 animate-pulse rounded-card bg-graphite-100" />
    </div>
  );
}
