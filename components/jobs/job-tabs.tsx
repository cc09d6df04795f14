"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

/**
 * The sections of a job. Each entry is a route under /jobs/{id}; add one here when its page
 * exists (never link to a page that is not built).
 */
export const JOB_TABS: ReadonlyArray<{ segment: string; label: string }> = [
  { segment: "", label: "Overview" },
  { segment: "checklist", label: "Checklist" },
  { segment: "compare", label: "Compare" },
  { segment: "data", label: "Data" },
  { segment: "analysis", label: "Analysis" },
  { segment: "control", label: "Control" },
  { segment: "report", label: "Report" },
  { segment: "activity", label: "Activity" },
];

export function JobTabs({ jobId }: { jobId: string }) {
  const path = usePathname();
  const base = `/jobs/${jobId}`;
  return (
    <nav aria-label="Job sections" className="flex gap-1 overflow-x-auto border-b border-graphite-200">
      {JOB_TABS.map((t) => {
        const href = t.segment ? `${base}/${t.segment}` : base;
        const active = t.segment ? path.startsWith(href) : path === base;
        return (
          <Link
            key={t.label}
            href={href}
            aria-current={active ? "page" : undefined}
            className={`-mb-px flex min-h-touch items-center whitespace-nowrap border-b-2 px-4 text-sm font-medium ${active ? "border-accent-600 text-graphite-900" : "border-transparent text-graphite-600 hover:text-graphite-900"}`}
          >
            {t.label}
          </Link>
        );
      })}
    </nav>
  );
}
