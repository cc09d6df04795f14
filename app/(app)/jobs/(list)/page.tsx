import type { Metadata } from "next";
import { JobsBoard } from "@/components/jobs/jobs-board";
import { jobBoard } from "@/db/queries/job-board";
import { requirePageUser } from "@/lib/auth/session";
import { BOARD_PAGE_SIZE, boardQuery } from "@/lib/jobs-board-query";
import { jobCreateRefusal } from "@/lib/policy/jobs";
import { jobListWords } from "@/lib/policy/navigation";
import { jobBoardQuerySchema, type JobBoardQuery } from "@/lib/validations/jobs";

export const metadata: Metadata = { title: "Jobs" };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

/** The URL's parameters, each kept only if valid (a bad one is ignored here; the API names it). */
function lenientQuery(raw: URLSearchParams): JobBoardQuery {
  const out: Record<string, unknown> = {};
  for (const [k, v] of raw) {
    const field = jobBoardQuerySchema.shape[k as keyof typeof jobBoardQuerySchema.shape];
    const parsed = field?.safeParse(v);
    if (parsed?.success) out[k] = parsed.data;
  }
  return out as JobBoardQuery;
}

export default async function JobsPage({ searchParams }: Props) {
  const user = await requirePageUser("/jobs");
  const raw = await searchParams;
  const url = new URLSearchParams(
    Object.entries(raw).flatMap(([k, v]) =>
      typeof v === "string" ? [[k, v]] : Array.isArray(v) ? [[k, v[0]!]] : [],
    ),
  );
  const query = boardQuery(url);
  const data = await jobBoard(user, { ...lenientQuery(url), pageSize: BOARD_PAGE_SIZE });
  const words = jobListWords(user.role);
  return (
    <JobsBoard
      fallback={{ query, data }}
      heading={words.heading}
      scope={words.scope}
      showCustomer={words.showCustomer}
      newJob={jobCreateRefusal(user) === null}
    />
  );
}
