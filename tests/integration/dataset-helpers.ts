// Helpers for the dataset upload tests: build a multipart request the way a browser's FormData
// does, and call the route handlers directly.
import { readFileSync } from "node:fs";
import { sql } from "drizzle-orm";
import { db } from "@/db";
import { POST as uploadRoute, GET as listRoute } from "@/app/api/jobs/[id]/datasets/route";
import { GET as summaryRoute, DELETE as deleteRoute } from "@/app/api/datasets/[id]/route";
import { GET as fileRoute } from "@/app/api/datasets/[id]/file/route";
import { GET as evaluationRoute } from "@/app/api/datasets/[id]/evaluation/route";
import { formPost, request } from "./helpers";

export const fixture = (name: string): Buffer => readFileSync(`tests/fixtures/uploads/${name}`);

export function uploadRequest(
  jobId: string,
  file: Uint8Array | null,
  fields: Record<string, string>,
  filename = "data.csv",
): Request {
  return formPost(
    `/api/jobs/${jobId}/datasets`,
    fields,
    file && { bytes: file, type: "text/csv", name: filename },
  );
}

export async function upload(
  jobId: string,
  file: Uint8Array | null,
  fields: Record<string, string>,
  filename?: string,
): Promise<Response> {
  return uploadRoute(uploadRequest(jobId, file, fields, filename), {
    params: Promise.resolve({ id: jobId }),
  });
}

const p = (id: string) => ({ params: Promise.resolve({ id }) });
export const listDatasetsApi = (jobId: string) => listRoute(request(`/api/jobs/${jobId}/datasets`), p(jobId));
export const summaryApi = (id: string) => summaryRoute(request(`/api/datasets/${id}`), p(id));
export const fileApi = (id: string) => fileRoute(request(`/api/datasets/${id}/file`), p(id));
export const deleteApi = (id: string) =>
  deleteRoute(request(`/api/datasets/${id}`, { method: "DELETE" }), p(id));
export const evaluationApi = (id: string, query = "") =>
  evaluationRoute(request(`/api/datasets/${id}/evaluation${query}`), p(id));
export { uploadRoute };

/** What is stored: dataset rows, their columns and the stored objects (counts and keys). */
export async function storedState() {
  const ds = await db.execute<{ id: string; status: string; sha256: string }>(
    sql`select id, status, sha256 from datasets order by id`,
  );
  const cols = await db.execute<{ n: string }>(sql`select count(*)::text as n from dataset_columns`);
  const objs = await db.execute<{ key: string; sha256: string }>(
    sql`select key, sha256 from storage_objects order by key`,
  );
  return { datasets: ds.rows, columns: Number(cols.rows[0]!.n), objects: objs.rows };
}
