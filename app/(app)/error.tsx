"use client";

export default function AppError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div className="mx-auto max-w-lg space-y-3 py-16 text-center">
      <h1 className="text-2xl font-semibold">This page could not be loaded</h1>
      <p className="text-graphite-600">
        Nothing you entered was lost. Try again; if it keeps happening, tell your administrator the time it
        happened.
      </p>
      <button
        onClick={reset}
        className="min-h-touch rounded-lg bg-graphite-800 px-4 font-semibold text-white"
      >
        Try again
      </button>
    </div>
  );
}
