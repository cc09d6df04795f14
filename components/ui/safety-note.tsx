/** A bordered caution beside the step it concerns; never a modal to click away. */
export function SafetyNote({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <aside
      role="note"
      aria-label={`Safety: ${title}`}
      className="flex gap-3 rounded-card border-2 border-accent-500 bg-accent-50 p-4 text-graphite-900"
    >
      <svg viewBox="0 0 24 24" className="mt-0.5 h-6 w-6 shrink-0 text-accent-700" aria-hidden="true">
        <path
          d="M12 2.5 22 20.5H2z"
          fill="none"
          stroke="currentColor"
          strokeWidth="2"
          strokeLinejoin="round"
        />
        <path d="M12 9v5.5" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />
        <circle cx="12" cy="17.5" r="1.3" fill="currentColor" />
      </svg>
      <div className="space-y-1 text-sm leading-relaxed">
        <p className="font-semibold">{title}</p>
        {children}
      </div>
    </aside>
  );
}
