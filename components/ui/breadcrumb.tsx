import Link from "next/link";

/** The way back above a page's heading: the list it belongs to, then where the person is. */
export function Breadcrumb({
  parent,
  children,
}: {
  parent: { href: string; label: string };
  children: React.ReactNode;
}) {
  return (
    <nav aria-label="Breadcrumb" className="text-sm text-graphite-600">
      <Link href={parent.href} className="hover:text-graphite-900 hover:underline">
        {parent.label}
      </Link>{" "}
      / {children}
    </nav>
  );
}

/** A plain link back to the list, above the heading of a page that edits one of its entries. */
export function BackLink({ href, children }: { href: string; children: React.ReactNode }) {
  return (
    <p className="text-sm">
      <Link href={href} className="underline">
        {children}
      </Link>
    </p>
  );
}
