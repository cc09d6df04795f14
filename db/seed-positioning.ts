/**
 * Demo data (invented) for the ISO 230-2 positioning test of a rotary axis: on TR-2026-0059 the
 * primary (C) axis was indexed to 12 targets, 5 runs in each direction, against a reference. The
 * deviations are made up: a once-round and a twice-round error of a few arc seconds, about 1.2″ of
 * reversal and 0.4″ of scatter. The demo procedure limits A and R of that axis (invented customer
 * figures). Runs once: a job that already has a positioning test is left as it is.
 */
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { insertDataset, listDatasets } from "@/db/queries/datasets";
import { getActor } from "@/db/queries/users";
import { jobs, procedureTemplates, templatePositioningLimits, users } from "@/db/schema";
import { DEMO_CONTROL_JOB, DEMO_CONTROL_PROCEDURE } from "@/db/seed-control";
import { parseDatasetText, parseUploadForm } from "@/lib/storage/parse-dataset";

export const DEMO_POSITIONING_FILENAME = "TR-2026-0059 C-axis positioning ISO 230-2 (demo, synthetic).csv";

/** A deterministic pseudo-random sequence (a linear congruential generator) mapped to about ±1. */
function noise(seed: number) {
  let x = seed >>> 0;
  return () => {
    x = (Math.imul(x, 1664525) + 1013904223) >>> 0;
    return (x / 2 ** 32) * 2 - 1;
  };
}

/** A positioning CSV (`target_deg,run,direction,measured_deg,axis`), invented deviations in arc seconds. */
export function demoRotaryPositioningCsv(
  opts: { axis?: string; targets?: readonly number[]; runs?: number; seed?: number; scale?: number } = {},
): string {
  const { axis = "C", runs = 5, seed = 230, scale = 1 } = opts;
  const targets = opts.targets ?? Array.from({ length: 12 }, (_, i) => i * 30);
  const rnd = noise(seed);
  const lines = ["target_deg,run,direction,measured_deg,axis"];
  for (let j = 1; j <= runs; j++)
    for (const direction of ["pos", "neg"] as const)
      for (const t of direction === "pos" ? targets : [...targets].reverse()) {
        const r = (t * Math.PI) / 180;
        const arcsec =
          scale * (3.0 * Math.sin(r) + 1.5 * Math.cos(2 * r) + (direction === "pos" ? 0.6 : -0.6)) +
          0.4 * rnd();
        lines.push(`${t},${j},${direction},${(t + arcsec / 3600).toFixed(7)},${axis}`);
      }
  return lines.join("\n") + "\n";
}

export async function seedPositioning(): Promise<void> {
  const [procedure] = await db
    .select({ id: procedureTemplates.id })
    .from(procedureTemplates)
    .where(and(eq(procedureTemplates.name, DEMO_CONTROL_PROCEDURE), eq(procedureTemplates.version, 1)));
  const [job] = await db.select().from(jobs).where(eq(jobs.reference, DEMO_CONTROL_JOB));
  if (!procedure || !job) return;
  await db
    .insert(templatePositioningLimits)
    .values([
      {
        templateId: procedure.id,
        axis: "primary" as const,
        quantity: "A",
        upperLimitArcsec: 20,
        limitSource: "customer_spec" as const,
        limitSourceNote: "demo customer specification (invented)",
      },
      {
        templateId: procedure.id,
        axis: "primary" as const,
        quantity: "R",
        upperLimitArcsec: 6,
        limitSource: "customer_spec" as const,
        limitSourceNote: "demo customer specification (invented)",
      },
    ])
    .onConflictDoNothing();
  const [u] = await db
    .select({ id: users.id })
    .from(users)
    .where(eq(users.email, "installer@halvard.example"));
  const installer = u ? await getActor(u.id) : null;
  if (!installer) return;
  if ((await listDatasets(installer, job.id))?.some((d) => d.kind === "rotary_positioning")) return;
  const text = demoRotaryPositioningCsv();
  const data = Buffer.from(text, "utf8");
  const form = parseUploadForm({
    kind: "rotary_positioning",
    phase: "post",
    axis: "primary",
    uncertainty_arcsec: "0.5",
  });
  await insertDataset(
    installer,
    job.id,
    form,
    {
      filename: DEMO_POSITIONING_FILENAME,
      contentType: "text/csv",
      data,
      sha256: createHash("sha256").update(data).digest("hex"),
    },
    parseDatasetText(form, text),
  );
}
