"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import type { NavItem } from "@/lib/policy/navigation";

export function MainNav({ items }: { items: readonly NavItem[] }) {
  const path = usePathname();
  return (
    <nav aria-label="Main" className="flex items-center gap-1 overflow-x-auto">
      {items.map((it) => {
        const active = path === it.href || path.startsWith(`${it.href}/`);
        return (
          <Link
            key={it.href}
            href={it.href}
            aria-current={active ? "page" : undefined}
            className={`flex min-h-touch items-center whitespace-nowrap rounded-lg px-3 text-sm font-medium ${active ? "bg-graphite-800 text-white" : "text-graphite-300 hover:bg-graphite-800 hover:text-white"}`}
          >
            {it.label}
          </Link>
        );
      })}
    </nav>
  );
}
