/**
 * What the demo seeds share: the demo people as actors, whether a step's rows are already there,
 * a demo job with its audit event, storing a CSV through the same parse and
 * insert path as the upload route, writing synthesised sphere-probe data as CSV text, and the
 * engineer's approval of a fit (confirming any parameter that does not conform, as the form asks).
 */
import { createHash } from "node:crypto";
import { eq, sql, type SQL } from "drizzle-orm";
import type { PgTable } from "drizzle-orm/pg-core";
import { db } from "@/db";
import { approveAnalysis, nonConformingParameters, runHeadFit } from "@/db/queries/analyses";
import { appendAudit, jobEvent, type AuditActor } from "@/db/queries/audit";
import { insertDataset } from "@/db/queries/datasets";
import { getActor } from "@/db/queries/users";
import { jobs, users } from "@/db/schema";
import type { SphereProbeData } from "@/geometry";
import type { Actor } from "@/lib/domain/roles";
import { parseDatasetText, parseUploadForm } from "@/lib/storage/parse-dataset";

/** A demo user as the queries want them; the seed stops if the user is missing. */
export async function demoActor(email: string): Promise<Actor> {
  const [u] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
  const a = u ? await getActor(u.id) : null;
  if (!a) throw new Error(`seed: no demo user ${email}`);
  return a;
}

/** Whether `table` has a row matching `where`: a seed step whose rows are already there skips them. */
export async function hasRows(table: PgTable, where: SQL): Promise<boolean> {
  const found = await db
    .select({ one: sql`1` })
    .from(table)
    .where(where)
    .limit(1);
  return found.length > 0;
}

/** Adds a demo job with its `job.created` event, in one transaction as the app's own job creation. */
export async function insertDemoJob(actor: AuditActor, values: typeof jobs.$inferInsert) {
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(jobs).values(values).returning();
    await appendAudit(
      tx,
      actor,
      jobEvent(row!.id, "job.created", {
        newValues: { reference: row!.reference, status: row!.status, note: "demo data (invented)" },
      }),
    );
    return row!;
  });
}

/** Stores CSV text as a dataset of the job, parsed and checked as an upload with these form fields is. */
export async function storeCsv(
  actor: Actor,
  jobId: string,
  fields: Record<string, string>,
  filename: string,
  text: string,
) {
  const data = Buffer.from(text, "utf8");
  const form = parseUploadForm(fields);
  const parsed = parseDatasetText(form, text);
  const sha256 = createHash("sha256").update(data).digest("hex");
  return insertDataset(actor, jobId, form, { filename, contentType: "text/csv", data, sha256 }, parsed);
}

/** Sphere-probe data as CSV text, positions to 0.01 µm, with or without its tool-length column. */
export function sphereProbeCsvText(d: SphereProbeData, { toolColumn }: { toolColumn: boolean }): string {
  const lines = [toolColumn ? "primary_deg,secondary_deg,x,y,z,tool_mm" : "primary_deg,secondary_deg,x,y,z"];
  for (let i = 0; i < d.rows; i++) {
    const row = [
      d.primaryDeg[i]!,
      d.secondaryDeg[i]!,
      d.xMm[i]!.toFixed(5),
      d.yMm[i]!.toFixed(5),
      d.zMm[i]!.toFixed(5),
    ];
    if (toolColumn) row.push(d.toolMm![i]!);
    lines.push(row.join(","));
  }
  return lines.join("\n") + "\n";
}

/** The engineer fits the dataset and approves the fit, confirming each parameter that does not conform. */
export async function fitAndApprove(engineer: Actor, datasetId: string, password: string) {
  const { analysis } = await runHeadFit(engineer, datasetId);
  const open = await nonConformingParameters(engineer, analysis.id);
  await approveAnalysis(
    engineer,
    analysis.id,
    password,
    open.map((p) => p.key),
  );
  return analysis;
}
