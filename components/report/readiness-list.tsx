import Link from "next/link";
import type { Blocker } from "@/lib/report/readiness";

/** The blockers before issue, each a link to where it is resolved; or a plain "ready". */
export function ReadinessList({ blockers }: { blockers: readonly Blocker[] }) {
  if (blockers.length === 0)
    return (
      <p className="text-sm text-pass-700" data-testid="readiness-ready">
        ✓ Nothing stands in the way: the report can be issued.
      </p>
    );
  return (
    <div className="space-y-2">
      <p className="text-sm text-graphite-700">
        The report can be issued once{" "}
        {blockers.length === 1 ? "this item is" : `these ${blockers.length} items are`} resolved:
      </p>
      <ul className="space-y-2 text-sm" aria-label="Before issue">
        {blockers.map((b, i) => (
          <li key={`${b.code}-${i}`} data-code={b.code} className="border-l-4 border-fail-600 pl-3">
            <Link
              href={b.href}
              className="text-graphite-900 underline decoration-graphite-300 hover:decoration-graphite-700"
            >
              {b.message}
            </Link>
          </li>
        ))}
      </ul>
    </div>
  );
}
