/**
 * Demo data: a sphere-probe dataset for the invented re-verification job TR-2026-0052, generated
 * by geometry's synthesiser from known, invented errors plus 1 µm Gaussian noise (never a real
 * measurement), uploaded by the demo installer through the same validation and storage path as
 * the app, and its head fit run by the demo engineer through the same query the page uses.
 */
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { runHeadFit } from "@/db/queries/analyses";
import { insertDataset } from "@/db/queries/datasets";
import { getActor } from "@/db/queries/users";
import { datasets, jobs, users } from "@/db/schema";
import { headPoseGrid, synthesiseSphereProbe, type HeadConfig, type HeadErrors } from "@/geometry";
import { parseDatasetText, parseUploadForm } from "@/lib/storage/parse-dataset";

/** Invented errors of the demo head (µm and arc seconds, as the keys say). */
export const DEMO_HEAD_ERRORS: HeadErrors = {
  pivot_length_error_um: 38.0,
  tip_offset_s_um: -12.5,
  tip_offset_n_um: 21.0,
  secondary_offset_um: 9.0,
  primary_zero_arcsec: 14.0,
  secondary_zero_arcsec: -22.0,
  secondary_tilt_arcsec: 18.0,
  primary_tilt_s_arcsec: 6.0,
  primary_tilt_n_arcsec: -9.0,
};
export const DEMO_HEAD_CONFIG: HeadConfig = { primary: "C", secondary: "A", pivotLengthMm: 152.4, toolDirection: [0, 0, -1] };
export const DEMO_PROBE_FILENAME = "TR-2026-0052 sphere probe (demo, synthetic).csv";

/** The demo CSV: full primary turn in 15° steps, secondary −90…+90° in 30° steps, tool lengths 0 and 100 mm. */
export function demoSphereProbeCsv(): string {
  const poses = headPoseGrid({ primarySteps: 24, secondaryDeg: [-90, -60, -30, 0, 30, 60, 90], toolMm: [0, 100] });
  const d = synthesiseSphereProbe(DEMO_HEAD_CONFIG, DEMO_HEAD_ERRORS, poses, { noiseUm: 1, seed: 52, centreMm: [612.5, -204.0, 388.25] });
  const lines = ["primary_deg,secondary_deg,x,y,z,tool_mm"];
  for (let i = 0; i < d.rows; i++) {
    lines.push([d.primaryDeg[i]!, d.secondaryDeg[i]!, d.xMm[i]!.toFixed(5), d.yMm[i]!.toFixed(5), d.zMm[i]!.toFixed(5), d.toolMm![i]!].join(","));
  }
  return lines.join("\n") + "\n";
}

export async function seedAnalyses(): Promise<void> {
  const [job] = await db.select().from(jobs).where(eq(jobs.reference, "TR-2026-0052"));
  if (!job) return;
  const [inst] = await db.select({ id: users.id }).from(users).where(eq(users.email, "installer@halvard.example"));
  const [eng] = await db.select({ id: users.id }).from(users).where(eq(users.email, "engineer@halvard.example"));
  const installer = inst ? await getActor(inst.id) : null;
  const engineer = eng ? await getActor(eng.id) : null;
  if (!installer || !engineer) throw new Error("seed: no demo installer or engineer");
  let [ds] = await db.select().from(datasets).where(and(eq(datasets.jobId, job.id), eq(datasets.kind, "sphere_probe"), eq(datasets.originalFilename, DEMO_PROBE_FILENAME)));
  if (!ds) {
    const text = demoSphereProbeCsv();
    const data = Buffer.from(text, "utf8");
    const form = parseUploadForm({ kind: "sphere_probe", phase: "pre", units: "mm" });
    const parsed = parseDatasetText(form, text);
    const sha256 = createHash("sha256").update(data).digest("hex");
    ds = await insertDataset(installer, job.id, form, { filename: DEMO_PROBE_FILENAME, contentType: "text/csv", data, sha256 }, parsed);
  }
  // Idempotent: the same input finds the stored analysis.
  await runHeadFit(engineer, ds.id);
}
