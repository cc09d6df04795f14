/**
 * A region that scrolls sideways when its content (a wide table, a chart) is wider than the
 * screen, as on a tablet. It is focusable and named, so it can be scrolled from the keyboard and a
 * screen reader announces what it holds (WCAG 2.1.1; axe's scrollable-region-focusable rule).
 */
export function ScrollRegion({
  label,
  className = "",
  children,
}: {
  label: string;
  className?: string;
  children: React.ReactNode;
}) {
  return (
    <div className={`overflow-x-auto ${className}`} tabIndex={0} role="region" aria-label={label}>
      {children}
    </div>
  );
}
