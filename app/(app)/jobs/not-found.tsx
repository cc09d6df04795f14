import Link from "next/link";

export default function JobNotFound() {
  return (
    <div className="mx-auto max-w-lg space-y-3 py-16 text-center">
      <h1 className="text-2xl font-semibold">Job not found</h1>
      <p className="text-graphite-600">
        There is no job at this address that you may open. It may have been mistyped, or it belongs to someone
        else&apos;s account.
      </p>
      <Link
        href="/jobs"
        className="inline-flex min-h-touch items-center rounded-lg bg-graphite-800 px-4 font-semibold text-white"
      >
        Back to jobs
      </Link>
    </div>
  );
}
