/**
 * Demo data: a test-part dataset for the invented installation job TR-2026-0041, uploaded by the
 * demo inspector through the same validation and storage path as the app (so its original
 * downloads). All numbers are invented. No sphere-probe dataset yet: geometry/ exports no head
 * synthesiser to generate one from known errors plus noise.
 */
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { insertDataset } from "@/db/queries/datasets";
import { getActor } from "@/db/queries/users";
import { datasets, jobs, users } from "@/db/schema";
import { parseDatasetText, parseUploadForm } from "@/lib/storage/parse-dataset";

/** Invented measurements of the demo test part (mm; tolerances as offsets from nominal). */
export const DEMO_TEST_PART_CSV = [
  "feature,characteristic,nominal,measured,lower_tol,upper_tol,unit",
  "Bore A,diameter,20.000,20.0021,-0.005,0.005,mm",
  "Bore B,diameter,20.000,19.9987,-0.005,0.005,mm",
  "Bore A to B,distance,120.000,120.0034,-0.010,0.010,mm",
  "Top face,flatness,0,0.0042,,0.008,mm",
  "Side wall,squareness to top face,0,0.0051,,0.010,mm",
  "Slot,width,12.000,12.0068,-0.008,0.008,mm",
  "Pocket,depth,8.000,8.0012,-0.005,0.005,mm",
  "Tilted face,angle to base,30.0000,30.0021,-0.0050,0.0050,deg",
  "",
].join("\n");

export async function seedDatasets(): Promise<void> {
  const [job] = await db.select().from(jobs).where(eq(jobs.reference, "TR-2026-0041"));
  if (!job) return;
  const existing = await db.select({ id: datasets.id }).from(datasets).where(and(eq(datasets.jobId, job.id), eq(datasets.kind, "test_part")));
  if (existing.length > 0) return;
  const [u] = await db.select({ id: users.id }).from(users).where(eq(users.email, "inspector@halvard.example"));
  const inspector = u ? await getActor(u.id) : null;
  if (!inspector) throw new Error("seed: no demo inspector");
  const data = Buffer.from(DEMO_TEST_PART_CSV, "utf8");
  const form = parseUploadForm({ kind: "test_part", phase: "post", uncertainty_mm: "0.0015" });
  const parsed = parseDatasetText(form, DEMO_TEST_PART_CSV);
  const sha256 = createHash("sha256").update(data).digest("hex");
  await insertDataset(inspector, job.id, form, { filename: "TR-2026-0041 test part (demo).csv", contentType: "text/csv", data, sha256 }, parsed);
}
