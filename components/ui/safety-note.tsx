import { WarningIcon } from "./icons";

/** A bordered caution beside the step it concerns; never a modal to click away. */
export function SafetyNote({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <aside
      role="note"
      aria-label={`Safety: ${title}`}
      className="flex gap-3 rounded-card border-2 border-accent-500 bg-accent-50 p-4 text-graphite-900"
    >
      <WarningIcon className="mt-0.5 h-6 w-6 shrink-0 text-accent-700" />
      <div className="space-y-1 text-sm leading-relaxed">
        <p className="font-semibold">{title}</p>
        {children}
      </div>
    </aside>
  );
}
