"use client";

import { useEffect, useState } from "react";
import Link from "next/link";
import { usePathname, useSearchParams } from "next/navigation";
import useSWR from "swr";
import { JobsTable } from "@/components/jobs/jobs-table";
import { buttonClass } from "@/components/ui/button";
import { closedSetOptions, OptionList } from "@/components/ui/field";
import { JOB_STATUSES, STATUS_LABELS, type JobListRow, type JobSortKey } from "@/lib/domain/jobs";
import { boardQuery } from "@/lib/jobs-board-query";
import type { JobQueue } from "@/lib/policy/job-queues";

/** How often the board asks again while it is open (it also asks when the tab regains focus). */
const REFRESH_MS = 30_000;

type WireRow = Omit<JobListRow, "updatedAt" | "scheduledFor"> & {
  updatedAt: string;
  scheduledFor: string | null;
};
export interface BoardData {
  jobs: JobListRow[];
  total: number;
  page: number;
  pageSize: number;
  queues: { queue: JobQueue; label: string; count: number }[];
}

class BoardError extends Error {}
async function fetchBoard(url: string): Promise<BoardData> {
  const res = await fetch(url, { headers: { accept: "application/json" } });
  const body = await res.json().catch(() => null);
  if (!res.ok) throw new BoardError(body?.error?.message ?? `The jobs could not be loaded (${res.status}).`);
  return {
    ...body,
    jobs: (body.jobs as WireRow[]).map((r) => ({
      ...r,
      updatedAt: new Date(r.updatedAt),
      scheduledFor: r.scheduledFor ? new Date(r.scheduledFor) : null,
    })),
  };
}

/**
 * The jobs board: the list reads GET /api/jobs through SWR with its filters, sort, search, queue
 * and page in the URL. The server renders the first answer (`fallback`), so nothing flashes; the
 * board then asks again on focus and every 30 s.
 */
export function JobsBoard({
  fallback,
  showCustomer,
  heading,
  scope,
  newJob,
}: {
  fallback: { query: string; data: BoardData };
  showCustomer: boolean;
  heading: string;
  scope: string;
  newJob: boolean;
}) {
  const pathname = usePathname();
  const params = useSearchParams();
  const query = boardQuery(new URLSearchParams(params.toString()));
  const { data, error, isValidating } = useSWR(`/api/jobs?${query}`, fetchBoard, {
    // The server's answer for this very URL; SWR's keepPreviousData would ignore it, so it is not used.
    fallbackData: query === fallback.query ? fallback.data : undefined,
    refreshInterval: REFRESH_MS,
    revalidateOnFocus: true,
  });
  // Until a new filter's answer arrives, the server's first rows stay on screen, dimmed and marked busy.
  // (SWR's isLoading is true on the first check even when the server's answer is shown, so it is not used.)
  const board = data ?? fallback.data;
  const busy = data === undefined && !error;

  /** Changes the URL (and so the SWR key) without a server round trip; page goes back to 1 unless given. */
  const setParams = (changes: Record<string, string | null>) => {
    const next = new URLSearchParams(params.toString());
    if (!("page" in changes)) next.delete("page");
    for (const [k, v] of Object.entries(changes)) {
      if (v) next.set(k, v);
      else next.delete(k);
    }
    const s = next.toString();
    window.history.replaceState(null, "", s ? `${pathname}?${s}` : pathname);
  };

  // The search box follows the URL and writes to it after a short pause in typing.
  const urlQ = params.get("q") ?? "";
  const [q, setQ] = useState(urlQ);
  useEffect(() => {
    if (q === urlQ) return;
    const t = setTimeout(() => setParams({ q: q.trim() || null }), 350);
    return () => clearTimeout(t);
    // setParams is rebuilt every render; the pause restarts only when the text or the URL changes.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [q, urlQ]);

  const activeQueue = params.get("queue");
  const status = params.get("status") ?? "";
  const sortKey = (params.get("sort") as JobSortKey | null) ?? "updated";
  const sort = {
    sort: sortKey,
    dir: (params.get("dir") as "asc" | "desc" | null) ?? (params.get("sort") ? "asc" : "desc"),
  };
  const pages = Math.max(1, Math.ceil(board.total / board.pageSize));
  const linkParams = new URLSearchParams(params.toString());
  linkParams.delete("page");

  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-2xl font-semibold">{heading}</h1>
          <p className="text-sm text-graphite-600" aria-live="polite">
            {board.total} {board.total === 1 ? "job" : "jobs"}
            {scope}
            {isValidating ? <span className="sr-only"> (refreshing)</span> : null}
          </p>
        </div>
        {newJob ? (
          <Link href="/jobs/new" className={buttonClass("primary")}>
            New job
          </Link>
        ) : null}
      </div>

      {board.queues.length ? (
        <nav aria-label="What waits on you" className="flex flex-wrap gap-2">
          {[{ queue: null, label: "All jobs", count: null }, ...board.queues].map((t) => {
            const on = (t.queue ?? null) === activeQueue;
            return (
              <button
                key={t.queue ?? "all"}
                type="button"
                aria-pressed={on}
                onClick={() => setParams({ queue: t.queue })}
                className={`inline-flex min-h-touch items-center gap-2 rounded-full px-4 text-sm font-medium ring-1 ring-inset ${
                  on
                    ? "bg-graphite-900 text-white ring-graphite-900"
                    : "bg-white text-graphite-800 ring-graphite-300 hover:bg-graphite-50"
                }`}
              >
                {t.label}
                {t.count !== null ? (
                  <span
                    className={`num rounded-full px-2 text-xs ${on ? "bg-white/20" : t.count > 0 ? "bg-accent-100 text-accent-800" : "bg-graphite-100 text-graphite-600"}`}
                  >
                    {t.count}
                  </span>
                ) : null}
              </button>
            );
          })}
        </nav>
      ) : null}

      <div className="flex flex-wrap items-end gap-3" role="search" aria-label="Filter jobs">
        <label className="space-y-1">
          <span className="block text-xs font-medium text-graphite-600">Search</span>
          <input
            type="search"
            name="q"
            value={q}
            onChange={(e) => setQ(e.target.value)}
            placeholder="Reference, machine, head…"
            className="min-h-touch w-60 rounded-lg border border-graphite-300 bg-white px-3 text-sm"
          />
        </label>
        <label className="space-y-1">
          <span className="block text-xs font-medium text-graphite-600">Status</span>
          <select
            name="status"
            value={status}
            onChange={(e) => setParams({ status: e.target.value || null })}
            className="min-h-touch rounded-lg border border-graphite-300 bg-white px-3 text-sm"
          >
            <option value="">Any status</option>
            <OptionList options={closedSetOptions(JOB_STATUSES, STATUS_LABELS)} />
          </select>
        </label>
      </div>

      {error ? (
        <p role="alert" className="rounded-md bg-fail-50 px-3 py-2 text-sm text-fail-700">
          {error instanceof BoardError ? error.message : "The jobs could not be loaded."} The list below may
          be out of date; it will try again.
        </p>
      ) : null}

      <div aria-busy={busy} className={busy ? "opacity-50 transition-opacity" : undefined}>
        <JobsTable rows={board.jobs} sort={sort} params={linkParams} showCustomer={showCustomer} />
      </div>

      {pages > 1 ? (
        <nav aria-label="Pages" className="flex items-center justify-between gap-3 text-sm">
          <button
            type="button"
            className={buttonClass("secondary")}
            disabled={board.page <= 1}
            onClick={() => setParams({ page: board.page - 1 > 1 ? String(board.page - 1) : null })}
          >
            Previous
          </button>
          <span className="num text-graphite-600">
            Page {board.page} of {pages}
          </span>
          <button
            type="button"
            className={buttonClass("secondary")}
            disabled={board.page >= pages}
            onClick={() => setParams({ page: String(board.page + 1) })}
          >
            Next
          </button>
        </nav>
      ) : null}
    </div>
  );
}
