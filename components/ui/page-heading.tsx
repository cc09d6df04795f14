/** A page's title and the sentence under it that says what the page holds. */
export function PageHeading({ title, children }: { title: React.ReactNode; children: React.ReactNode }) {
  return (
    <div>
      <h1 className="text-2xl font-semibold">{title}</h1>
      <p className="text-sm text-graphite-600">{children}</p>
    </div>
  );
}
