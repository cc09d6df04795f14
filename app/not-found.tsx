import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg space-y-3 py-24 text-center">
      <h1 className="text-2xl font-semibold">Page not found</h1>
      <p className="text-graphite-600">There is nothing at this address that you may open.</p>
      <Link
        href="/jobs"
        className="inline-flex min-h-touch items-center rounded-lg bg-graphite-800 px-4 font-semibold text-white"
      >
        Go to jobs
      </Link>
    </main>
  );
}
