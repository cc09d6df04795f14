// Steps several browser tests share. Before writing a step into a test file, look here and in
// browser.ts (contexts, sign-in, screenshots, accessibility, mail).
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import type { BrowserContext, Locator, Page } from "playwright-core";
import sharp from "sharp";
import { expect } from "vitest";
import { headPoseGrid, synthesiseSphereProbe, type HeadErrors } from "@/geometry";
import { canvasPixels, pageAs, screenshotPath } from "./browser";

/**
 * A route handler that makes the tablet offline: every request aborted, the service worker's own
 * fetches too (the browser's offline switch is not reliable once a service worker controls the page).
 */
export const offline = (r: { abort: (code: string) => Promise<void> }) => r.abort("internetdisconnected");

/** One step of the checklist is open at a time: open this one (its header button) unless it already is. */
export async function openStep(p: Page, n: number): Promise<Locator> {
  const step = p.getByTestId(`step-${n}`);
  const header = step.getByRole("button", { name: new RegExp(`^Step ${n}`) });
  if ((await header.getAttribute("aria-expanded")) !== "true") await header.click();
  return step;
}

/** Opens a section of the job page (Data, Checklist, Report, …) from its "Job sections" navigation. */
export async function jobSection(p: Page, section: string): Promise<void> {
  await p.getByRole("navigation", { name: "Job sections" }).getByRole("link", { name: section }).click();
}

/** Opens a job from the jobs list by its reference, then a section of its page. */
export async function openJobSection(p: Page, reference: string, section: string): Promise<void> {
  await p.getByRole("link", { name: reference }).click();
  await jobSection(p, section);
}

/**
 * Signed in as `email`, the page at `url` answers 404 and shows nothing of `hidden`: another
 * company's record is as absent as a missing one.
 */
export async function expectNotFound(ctx: BrowserContext, email: string, url: string, hidden: string) {
  const q = await pageAs(ctx, email);
  const res = await q.goto(url);
  expect(res?.status()).toBe(404);
  expect(await q.content()).not.toContain(hidden);
  await q.close();
}

/**
 * Sets the 3-D viewer's exaggeration slider to its fourth step (×10 000) and waits until the
 * drawn picture differs from the one whose digest is `before`.
 */
export async function exaggerateTenThousandfold(p: Page, before: string): Promise<void> {
  await p.getByLabel("Exaggeration factor").fill("4");
  await expect.poll(() => p.getByTestId("factor-label").innerText()).toMatch(/×10\u2009000/);
  await expect.poll(async () => (await canvasPixels(p)).digest, { timeout: 10_000 }).not.toBe(before);
}

/** Downloads the report page's signed PDF beside the screenshots as `<name>.pdf` and returns its path. */
export async function downloadSignedPdf(p: Page, name: string): Promise<string> {
  const [download] = await Promise.all([
    p.waitForEvent("download"),
    p.getByRole("link", { name: "Download signed PDF" }).click(),
  ]);
  const file = screenshotPath(name).replace(/\.png$/, ".pdf");
  await download.saveAs(file);
  return file;
}

/**
 * Signed out, checks the PDF file on the public verification page and expects it vouched for:
 * "Authentic", naming the checked file by its SHA-256 (only a checked file is vouched for). Returns
 * the page and its result.
 */
export async function verifyAuthentic(
  ctx: BrowserContext,
  file: string,
): Promise<{ page: Page; result: Locator }> {
  await ctx.clearCookies();
  const page = await ctx.newPage();
  await page.goto("/verify");
  await page.getByLabel("Report PDF").setInputFiles(file);
  const result = page.getByTestId("verification-result");
  await expect.poll(() => result.innerText()).toContain("Authentic");
  const sha = createHash("sha256").update(readFileSync(file)).digest("hex");
  expect(await result.innerText()).toContain(`SHA-256 of the checked file: ${sha}`);
  return { page, result };
}

/** The test-part evaluation table of an uploaded dataset's page. */
export const testPartEvaluation = (p: Page) => p.getByRole("table", { name: "Test-part evaluation" });

/** Each row of an evaluation table as [feature, decision] (the row's `data-decision`). */
export function decisionsOf(table: Locator): Promise<(string | null)[][]> {
  return table
    .locator("tbody tr")
    .evaluateAll((trs) =>
      trs.map((tr) => [
        tr.children[0]!.textContent,
        tr.querySelector("[data-decision]")!.getAttribute("data-decision"),
      ]),
    );
}

/** Waits until the photo in `list` (its one img) is drawn: the browser has decoded it, so its natural width is above 0. */
export async function expectPhotoDrawn(list: Locator, timeout?: number): Promise<void> {
  await expect
    .poll(() => list.locator("img").evaluate((i: HTMLImageElement) => i.naturalWidth), { timeout })
    .toBeGreaterThan(0);
}

/** Chooses the registered instrument with this serial in a checklist step's instrument list. */
export async function chooseInstrument(step: Locator, serial: string): Promise<void> {
  const select = step.getByLabel("Instrument");
  const label = (await select.locator("option", { hasText: serial }).textContent())!.trim();
  await select.selectOption({ label });
}

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

/** Picks the first real option of a select (after its "Choose…" placeholder) once it has one. */
export async function pickFirst(p: Page, label: string): Promise<void> {
  const select = p.getByLabel(label, { exact: true });
  await expect.poll(() => select.locator("option").count()).toBeGreaterThan(1);
  const value = await select.locator("option").nth(1).getAttribute("value");
  await select.selectOption(value!);
}

/**
 * On the jobs board: opens the new-job form and fills who and what the job is for: Marlow Creek's
 * first site, host machine and head, an installation with this title. The rest is the caller's.
 */
export async function startInstallationJob(p: Page, title: string): Promise<void> {
  await p.getByRole("link", { name: "New job" }).click();
  await p.waitForURL("**/jobs/new");
  await p.getByLabel("Customer", { exact: true }).selectOption({ label: "Marlow Creek Aerostructures" });
  await pickFirst(p, "Site");
  await pickFirst(p, "Host machine");
  await pickFirst(p, "Head");
  await p.getByLabel("Kind of job").selectOption("installation");
  await p.getByLabel("Title", { exact: true }).fill(title);
}

/** Step n of the procedure builder's list of steps. */
export const builderStep = (p: Page, n: number): Locator =>
  p.getByRole("listitem", { name: new RegExp(`^Step ${n}:`) });

/** In the procedure builder: adds a step at the end of the list, step n, and returns it. */
export async function addBuilderStep(p: Page, n: number): Promise<Locator> {
  await p.getByRole("button", { name: "Add a step" }).click();
  return builderStep(p, n);
}

/** In the procedure builder: makes `s` a yes/no check with this title (its limit source not yet said). */
export async function buildCheckStep(s: Locator, title: string): Promise<void> {
  await s.getByLabel("Title").fill(title);
  await s.getByLabel("Kind of step").selectOption("check");
}

/**
 * In the procedure builder: makes `s` the collar run-out step, readings at 12, 3, 6 and 9 o'clock
 * judged by their TIR against ≤ 0.0005 in ("common practice", the trade's usual collar figure).
 */
export async function buildRunOutStep(s: Locator): Promise<void> {
  await s.getByLabel("Title").fill("Collar run-out");
  await s.getByLabel("Kind of step").selectOption("multi_point");
  await s.getByRole("button", { name: "12 · 3 · 6 · 9" }).click();
  expect(await s.getByLabel("Points, in the order they are read").inputValue()).toBe("12, 3, 6, 9");
  await s.getByLabel("Unit of the limits").selectOption("in");
  await s.getByLabel("Upper limit").fill("0.0005");
  await s.getByLabel("Value judged from the points").selectOption("tir");
  await s.getByLabel("Where the limit comes from").selectOption("common_practice");
  await s.getByLabel("Source note").fill("The trade's usual collar figure.");
}

/** In the procedure builder: makes `s` a value for the record in `unit` that needs a photo. */
export async function buildPhotoRecordStep(s: Locator, title: string, unit: string): Promise<void> {
  await s.getByLabel("Title").fill(title);
  await s.getByLabel("Kind of step").selectOption("record");
  await s.getByLabel("Unit of the recorded value").fill(unit);
  await s.getByLabel("Photo required").check();
}

/**
 * On the tablet: enters the collar run-out of open step n at 12, 3, 6 and 9 o'clock with
 * DTI-0112 (0, 0.0002, 0.0004, −0.0001 in) and waits for the live TIR: largest − smallest =
 * 0.0004 − (−0.0001) = 0.0005 in (ASME B89.3.4 definition of run-out). Nothing is saved yet.
 */
export async function enterRunOutPoints(s: Locator, n: number): Promise<void> {
  const inst = s.getByLabel("Instrument");
  await inst.selectOption({
    label: (await inst.locator("option", { hasText: "DTI-0112" }).textContent())!.trim(),
  });
  for (const [point, v] of [
    ["12", "0"],
    ["3", "0.0002"],
    ["6", "0.0004"],
    ["9", "-0.0001"],
  ] as const)
    await s.getByTestId(`point-${n}-${point}`).fill(v);
  await expect.poll(() => s.getByTestId(`live-${n}`).innerText()).toMatch(/TIR = 0\.0005 in/);
}

/** On the tablet: attaches a plain PNG of this size to open step n, as the camera or a file would. */
export async function attachPhoto(s: Locator, n: number, width: number, height: number): Promise<void> {
  const png = await sharp({ create: { width, height, channels: 3, background: { r: 30, g: 90, b: 160 } } })
    .png()
    .toBuffer();
  await s
    .getByTestId(`photo-input-${n}`)
    .setInputFiles({ name: "photo.png", mimeType: "image/png", buffer: png });
}
