// Steps several browser tests share. Before writing a step into a test file, look here and in
// browser.ts (contexts, sign-in, screenshots, accessibility, mail).
import type { Locator, Page } from "playwright-core";
import { expect } from "vitest";
import { headPoseGrid, synthesiseSphereProbe, type HeadErrors } from "@/geometry";

/**
 * Invented sphere-probe data (demo only) from geometry's synthesiser for the job's own head, with
 * the given errors, uploaded as the signed-in user through the datasets API the upload page uses;
 * returns the head it was made for.
 */
export async function uploadSyntheticProbe(
  p: Page,
  jobId: string,
  o: { errors: Partial<HeadErrors>; seed: number; filename: string },
): Promise<{ pivotLengthMm: number }> {
  const job = (await (await p.request.get(`/api/jobs/${jobId}`)).json()).job as {
    head: {
      primaryAxis: "A" | "B" | "C";
      secondaryAxis: "A" | "B" | "C";
      nominalPivotLengthMm: number;
      toolDirection: [number, number, number];
    };
  };
  const head = {
    primary: job.head.primaryAxis,
    secondary: job.head.secondaryAxis,
    pivotLengthMm: job.head.nominalPivotLengthMm,
    toolDirection: job.head.toolDirection,
  };
  const poses = headPoseGrid({ primarySteps: 12, secondaryDeg: [-90, -45, 0, 45, 90], toolMm: [0, 80] });
  const d = synthesiseSphereProbe(head, o.errors, poses, { noiseUm: 1, seed: o.seed });
  const csv = [
    "primary_deg,secondary_deg,x,y,z,tool_mm",
    ...Array.from({ length: d.rows }, (_, i) =>
      [
        d.primaryDeg[i],
        d.secondaryDeg[i],
        d.xMm[i]!.toFixed(5),
        d.yMm[i]!.toFixed(5),
        d.zMm[i]!.toFixed(5),
        d.toolMm![i],
      ].join(","),
    ),
  ].join("\n");
  const up = await p.request.post(`/api/jobs/${jobId}/datasets`, {
    multipart: {
      kind: "sphere_probe",
      phase: "pre",
      units: "mm",
      file: { name: o.filename, mimeType: "text/csv", buffer: Buffer.from(csv) },
    },
  });
  expect(up.status()).toBe(201);
  return head;
}

/** One checklist step is open at a time: open step n (its header button) unless it already is. */
export async function openStep(p: Page, n: number): Promise<Locator> {
  const step = p.getByTestId(`step-${n}`);
  const header = step.getByRole("button", { name: new RegExp(`^Step ${n}`) });
  if ((await header.getAttribute("aria-expanded")) !== "true") await header.click();
  return step;
}

/** Picks the first real option of a select (after its "Choose…" placeholder) once it has one. */
export async function pickFirst(p: Page, label: string): Promise<void> {
  const select = p.getByLabel(label, { exact: true });
  await expect.poll(() => select.locator("option").count()).toBeGreaterThan(1);
  const value = await select.locator("option").nth(1).getAttribute("value");
  await select.selectOption(value!);
}
