import { sql } from "drizzle-orm";
import { db } from "@/db";

const state = globalThis as unknown as { __testSessionUserId?: string | null; __testSignedInAt?: number };

/** Acts as the given demo user (by e-mail) for the following route calls; null = anonymous. */
export async function signInAs(email: string | null, signedInAt?: number): Promise<string | null> {
  state.__testSignedInAt = signedInAt;
  if (email === null) {
    state.__testSessionUserId = null;
    return null;
  }
  const rows = await db.execute<{ id: string }>(sql`select id from users where email = ${email}`);
  const id = rows.rows[0]?.id;
  if (!id) throw new Error(`no demo user ${email}`);
  state.__testSessionUserId = id;
  return id;
}

export async function jobIdByReference(reference: string): Promise<string> {
  const rows = await db.execute<{ id: string }>(sql`select id from jobs where reference = ${reference}`);
  const id = rows.rows[0]?.id;
  if (!id) throw new Error(`no job ${reference}`);
  return id;
}

export function request(path: string, init?: RequestInit): Request {
  return new Request(`http://localhost${path}`, init);
}

/** The fields a refused answer's issues name (the API's 422 body), in its order. */
export async function issueFields(res: Response): Promise<string[]> {
  const body = (await res.json()) as { error: { issues: { field: string }[] } };
  return body.error.issues.map((i) => i.field);
}

/** The init of a request whose body is this value as JSON, the way the app's forms send it. */
export function jsonBody(method: string, body: unknown): RequestInit {
  return { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) };
}

/** A file field of a form: its bytes, type and name. */
export interface FormFile {
  bytes: Uint8Array;
  type: string;
  name: string;
}

/** These fields (and the file, when given) as FormData, the way a browser's form sends them. */
export function formData(fields: Record<string, string>, file?: FormFile | null): FormData {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  if (file) form.set("file", new Blob([new Uint8Array(file.bytes)], { type: file.type }), file.name);
  return form;
}

/** A multipart POST to `path` of these fields and, when given, the file. */
export function formPost(path: string, fields: Record<string, string>, file?: FormFile | null): Request {
  return request(path, { method: "POST", body: formData(fields, file) });
}
