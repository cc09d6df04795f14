export function Card({
  title,
  actions,
  children,
  className = "",
}: {
  title?: string;
  actions?: React.ReactNode;
  children: React.ReactNode;
  className?: string;
}) {
  return (
    <section className={`rounded-card border border-graphite-200 bg-white shadow-sm ${className}`}>
      {title ? (
        <header className="flex items-center justify-between gap-4 border-b border-graphite-100 px-5 py-3">
          <h2 className="text-base font-semibold text-graphite-900">{title}</h2>
          {actions}
        </header>
      ) : null}
      <div className="p-5">{children}</div>
    </section>
  );
}

/** A label/value list for identification blocks (machine, head, customer). */
export function Facts({
  items,
}: {
  items: ReadonlyArray<{ label: string; value: React.ReactNode; mono?: boolean }>;
}) {
  return (
    <dl className="grid grid-cols-[minmax(7rem,auto)_minmax(0,1fr)] gap-x-6 gap-y-2 text-sm">
      {items.map((it) => (
        <div key={it.label} className="contents">
          <dt className="text-graphite-600">{it.label}</dt>
          <dd className={`break-words text-graphite-900 ${it.mono ? "num" : ""}`}>{it.value ?? "—"}</dd>
        </div>
      ))}
    </dl>
  );
}
