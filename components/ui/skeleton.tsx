/** Grey placeholders shown while a page's data loads (loading.tsx), shaped like what will come. */
export function Skeleton({ className = "" }: { className?: string }) {
  return <div aria-hidden="true" className={`animate-pulse rounded-md bg-graphite-200/70 ${className}`} />;
}

/** A page-sized placeholder: a heading, a line of text and a table or a stack of cards. */
export function PageSkeleton({ label, rows = 6 }: { label: string; rows?: number }) {
  return (
    <div role="status" aria-label={label} className="space-y-4">
      <span className="sr-only">{label}</span>
      <Skeleton className="h-7 w-64" />
      <Skeleton className="h-4 w-full max-w-xl" />
      <div className="space-y-2 rounded-card border border-graphite-200 bg-white p-4 shadow-sm">
        {Array.from({ length: rows }, (_, i) => (
          <Skeleton key={i} className="h-9 w-full" />
        ))}
      </div>
    </div>
  );
}
