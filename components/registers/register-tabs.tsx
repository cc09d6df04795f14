"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

/** The registers an administrator keeps; other roles see only what they may read. */
export function RegisterTabs({ items }: { items: ReadonlyArray<{ href: string; label: string }> }) {
  const path = usePathname();
  if (items.length < 2) return null;
  return (
    <nav aria-label="Registers" className="flex gap-1 overflow-x-auto border-b border-graphite-200">
      {items.map((t) => {
        const active = t.href === "/registers" ? path === "/registers" : path.startsWith(t.href);
        return (
          <Link
            key={t.href}
            href={t.href}
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
