// Journey 2 of the product brief in Debian's Chromium (SwiftShader WebGL): the engineer opens the
// kinematic fit of TR-2026-0052, sees pivot and squareness error in the 3D view (drawn pixels
// counted from the canvas), changes the exaggeration and sees the picture change, and is refused
// approval while the job is still measuring. The approval case uses the seeded draft TR-2026-0057
// (so TR-2026-0052, which other browser tests record on, stays measuring): the administrator
// starts measuring on the checklist page, the engineer uploads sphere-probe data through the
// datasets API the upload page uses and runs the fit (approval refused: measuring), the
// administrator submits the job for review on the checklist page, and the engineer approves and
// sees the values for the control.
import { mkdirSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import {
  canvasPixels,
  screenshotPath,
  seriousViolations,
  waitForPicture,
  signApproval,
  pageAs,
  contextForFile,
} from "./browser";
import { uploadSyntheticProbe, exaggerateTenThousandfold, expectNotFound } from "./steps";

const ctx = contextForFile({ width: 1440, height: 1000 });

beforeAll(async () => {
  mkdirSync(path.dirname(screenshotPath("x")), { recursive: true });
});

/** The 3D view with its printed factor, scrolled to the top so the page's sticky header does not cover it. */
async function viewerShot(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.locator('[data-testid="head-viewer"]').screenshot({ path: screenshotPath(name) });
}

async function openAnalysis(page: Page, reference: string) {
  await page.goto("/jobs");
  await page.getByRole("link", { name: reference }).click();
  await page
    .getByRole("navigation", { name: "Job sections" })
    .getByRole("link", { name: "Analysis" })
    .click();
  await page.waitForURL(/\/analysis$/);
}

describe("journey 2: the engineer reviews and approves the head fit", () => {
  it("opens TR-2026-0052's Analysis tab: parameters, residuals and a drawn 3D view", async () => {
    const p = await pageAs(ctx(), "engineer@halvard.example");
    await openAnalysis(p, "TR-2026-0052");
    const table = p.getByRole("table", { name: "Fitted parameters" });
    const text = await table.innerText();
    for (const sym of ["ΔL", "EY0A", "EC0C", "EA0A", "EB0A"]) expect(text).toContain(sym);
    expect(text).toContain("Not separable");
    // The numbers shown are the API's (geometry's headFitToJson), rounded only for display.
    const analysisId = await p.locator("[data-analysis-id]").getAttribute("data-analysis-id");
    const api = (await (await p.request.get(`/api/analyses/${analysisId}`)).json()).analysis as {
      fit: { parameters: { key: string; value: number; U: number | null; unit: string }[] };
    };
    expect(api.fit.parameters).toHaveLength(10);
    for (const q of api.fit.parameters) {
      const cell = table.locator(`tr[data-key="${q.key}"] td[data-value]`);
      expect(Number(await cell.getAttribute("data-value"))).toBe(q.value);
      const shown = (await cell.innerText()).trim();
      if (q.U === null) expect(shown).toBe("held at 0");
      else expect(Number(shown.replace("−", "-").replace(/[^\d.+-]/g, ""))).toBeCloseTo(q.value, 2);
    }
    expect(await p.getByRole("img", { name: /Largest residual component per pose/ }).count()).toBe(1);
    await waitForPicture(p);
    const before = await canvasPixels(p);
    expect(before.drawn).toBeGreaterThan(5000);
    expect(await p.getByTestId("factor-label").innerText()).toMatch(/×300\b/);
    await p.screenshot({ path: screenshotPath("analysis-engineer"), fullPage: true });
    await viewerShot(p, "analysis-3d-x300");

    await exaggerateTenThousandfold(p, before.digest);
    await viewerShot(p, "analysis-3d-x10000");

    // Approval is refused while the job is measuring: the button is off and says why.
    const approve = p.getByRole("button", { name: "Approve these parameters" });
    expect(await approve.isDisabled()).toBe(true);
    expect(await p.locator("#approve-refusal").innerText()).toMatch(/measuring/);
    await p.close();
  });

  it("overlays the fit before adjustment on TR-2026-0052 (the drawn pixels change) and saves the view, which then appears on the page", async () => {
    const p = await pageAs(ctx(), "engineer@halvard.example");
    await openAnalysis(p, "TR-2026-0052");
    await waitForPicture(p);
    const plain = await canvasPixels(p);
    expect(await p.getByTestId("legend-other").count()).toBe(0);
    const toggle = p.getByLabel(/Also draw the fit before adjustment/);
    expect(await toggle.isChecked()).toBe(false);
    await toggle.check();
    // The other fit's dashed axes and tip path are drawn: more pixels differ from the background, and the picture changes.
    await expect.poll(async () => (await canvasPixels(p)).digest, { timeout: 10_000 }).not.toBe(plain.digest);
    const overlaid = await canvasPixels(p);
    expect(overlaid.drawn).toBeGreaterThan(plain.drawn);
    const legend = await p.getByTestId("legend-other").innerText();
    expect(legend).toContain("before adjustment");
    expect(legend).toContain("TR-2026-0052 sphere probe (demo, synthetic).csv");
    expect(
      await p.getByRole("group", { name: "Legend" }).or(p.locator('[aria-label="Legend"]')).innerText(),
    ).toContain("after adjustment");
    expect(await p.getByTestId("factor-label").innerText()).toMatch(/×300 for both fits/);
    expect(await p.getByTestId("tip-change").innerText()).toMatch(/up to \d+\.\d µm/);
    await viewerShot(p, "analysis-3d-overlay");
    // Unticking takes the overlay away again.
    await toggle.uncheck();
    await expect.poll(async () => (await canvasPixels(p)).digest, { timeout: 10_000 }).toBe(plain.digest);
    await toggle.check();
    await expect.poll(async () => (await canvasPixels(p)).digest, { timeout: 10_000 }).toBe(overlaid.digest);

    // Save the view: it is stored through the API and listed under "Saved views" with its factor and author.
    const caption = `Tilt axis before and after shimming ${Date.now().toString(36)}`;
    await p.getByLabel("Caption (optional)").fill(caption);
    const saved = p.waitForResponse(
      (r) => /\/api\/analyses\/[0-9a-f-]+\/views$/.test(r.url()) && r.request().method() === "POST",
    );
    await p.getByRole("button", { name: "Save view for the report" }).click();
    const res = await saved;
    expect(res.status()).toBe(201);
    const view = (await res.json()).view as {
      id: string;
      widthPx: number;
      heightPx: number;
      factor: number;
      overlayAnalysisId: string | null;
    };
    expect(view.factor).toBe(300);
    expect(view.overlayAnalysisId).not.toBeNull();
    const canvasSize = await p.evaluate(() => {
      const c = document.querySelector<HTMLCanvasElement>('[data-testid="head-viewer"] canvas')!;
      return { w: c.width, h: c.height };
    });
    // The saved picture is the scene drawn again at twice the screen's pixels (sharp in print;
    // this browser draws at 1 device pixel per CSS pixel), plus a legend band underneath.
    expect(view.widthPx).toBe(2 * canvasSize.w);
    expect(view.heightPx).toBeGreaterThan(2 * canvasSize.h);
    const card = p.locator(`[data-view-id="${view.id}"]`);
    await card.waitFor({ timeout: 15_000 });
    expect(await card.innerText()).toContain(caption);
    expect(await card.innerText()).toMatch(/×300/);
    expect(await card.innerText()).toContain("Emil Haraldsen");
    // The thumbnail (lazy) loads from the image route once it is in view.
    await card.scrollIntoViewIfNeeded();
    await expect
      .poll(() => card.locator("img").evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth), {
        timeout: 10_000,
      })
      .toBe(view.widthPx);
    const img = await p.request.get(`/api/analysis-views/${view.id}/image`);
    expect(img.headers()["content-type"]).toBe("image/png");
    expect((await img.body()).subarray(1, 4).toString("latin1")).toBe("PNG");
    await p.getByRole("heading", { name: "Saved views" }).scrollIntoViewIfNeeded();
    await p.screenshot({ path: screenshotPath("analysis-saved-views") });
    // The overlay controls, the save form and the saved pictures pass the same accessibility scan as every page.
    expect(await seriousViolations(p)).toEqual([]);
    await p.close();
  });

  it("the head's page shows every job's fitted parameters side by side and their trend", async () => {
    const p = await pageAs(ctx(), "engineer@halvard.example");
    await p.getByRole("link", { name: "Heads" }).first().click();
    await p.getByRole("link", { name: "TH-2241" }).click();
    const table = p.getByRole("table", { name: "Fitted parameters by job" });
    await table.waitFor();
    const heads = await table
      .locator("thead th[data-job]")
      .evaluateAll((ths) => ths.map((t) => t.getAttribute("data-job")));
    for (const ref of ["TR-2026-0041", "TR-2026-0052", "TR-2026-0057"]) expect(heads).toContain(ref);
    // TR-2026-0041's column shows its approved fit; TR-2026-0052 (measuring) its latest, not approved.
    expect(await table.locator('thead th[data-job="TR-2026-0041"]').innerText()).toContain("✓ approved fit");
    expect(await table.locator('thead th[data-job="TR-2026-0052"]').innerText()).toContain(
      "latest fit, not approved",
    );
    // The values are the history API's (the stored fits), rounded only for display.
    const headId = p.url().split("/").pop()!;
    const api = (await (await p.request.get(`/api/heads/${headId}/history`)).json()) as {
      jobs: {
        reference: string;
        fit: { parameters: { key: string; value: number; U: number | null }[] } | null;
      }[];
    };
    const j41 = api.jobs.find((j) => j.reference === "TR-2026-0041")!;
    const col = heads.indexOf("TR-2026-0041");
    const pivot = j41.fit!.parameters.find((q) => q.key === "pivot_length_error_um")!;
    const cell = table.locator('tr[data-key="pivot_length_error_um"] td').nth(col);
    expect(Number(await cell.getAttribute("data-value"))).toBe(pivot.value);
    expect((await cell.innerText()).replace("−", "-")).toContain(
      `${pivot.value >= 0 ? "+" : "-"}${Math.abs(pivot.value).toFixed(2)} ± ${pivot.U!.toFixed(2)} µm`,
    );
    // The trend: one panel per parameter the fits determined, each an SVG with a title naming it.
    const panels = p.getByTestId("trend-panel");
    expect(await panels.count()).toBeGreaterThanOrEqual(5);
    expect(await p.getByRole("img", { name: /ΔL: Pivot length error/ }).count()).toBe(1);
    expect(await panels.first().locator("circle").count()).toBeGreaterThanOrEqual(2);
    await p.evaluate(() => window.scrollTo(0, 0));
    await p.screenshot({ path: screenshotPath("head-history"), fullPage: true });
    expect(await seriousViolations(p)).toEqual([]);
    await p.close();
  });

  it("the customer and the head's installer open its history; other companies and visitors do not", async () => {
    const p = await pageAs(ctx(), "buyer@marlowcreek.example");
    await p.getByRole("link", { name: "TR-2026-0041" }).click();
    await p.getByRole("link", { name: "This head's fitted parameters, job by job" }).click();
    await p.waitForURL(/\/heads\/[0-9a-f-]{36}$/);
    const historyPath = new URL(p.url()).pathname;
    expect(await p.getByRole("heading", { level: 1 }).innerText()).toContain("TH-2241");
    const table = p.getByRole("table", { name: "Fitted parameters by job" });
    await table.waitFor();
    const heads = await table
      .locator("thead th[data-job]")
      .evaluateAll((ths) => ths.map((t) => t.getAttribute("data-job")));
    // The same columns as the history API gives this customer (their own company's jobs only).
    const api = (await (await p.request.get(`/api${historyPath}/history`)).json()) as {
      jobs: { reference: string }[];
    };
    expect(heads).toEqual(api.jobs.map((j) => j.reference));
    expect(heads).toContain("TR-2026-0041");
    expect(await p.getByRole("link", { name: "heads register" }).count()).toBe(0);
    expect(await p.getByRole("img", { name: /ΔL: Pivot length error/ }).count()).toBe(1);
    expect(await seriousViolations(p)).toEqual([]);
    await p.screenshot({ path: screenshotPath("head-history-customer"), fullPage: true });
    await p.close();

    // Another company's buyer: not found, and nothing of this head's jobs in the page.
    await expectNotFound(ctx(), "buyer@tollan.example", historyPath, "TR-2026-0041");
    // The installer works on jobs on this head, so they read its history (what an after-crash
    // re-check needs).
    const inst = await pageAs(ctx(), "installer@halvard.example");
    expect((await inst.goto(historyPath))?.status()).toBe(200);
    expect(await inst.content()).toContain("TR-2026-0041");
    await inst.close();
    await ctx().clearCookies();
    const anon = await ctx().newPage();
    await anon.goto(historyPath);
    await anon.waitForURL(/\/login\?callbackUrl=/);
    await anon.close();
  });

  it("on a job the office moves to review through the checklist page, the engineer fits, is refused while measuring, then approves", async () => {
    // The seeded draft TR-2026-0057 (same head TH-2241): the administrator starts measuring on the
    // checklist page, as the office would for an unassigned job.
    const admin = await pageAs(ctx(), "admin@halvard.example");
    await admin.getByRole("link", { name: "TR-2026-0057" }).click();
    await admin
      .getByRole("navigation", { name: "Job sections" })
      .getByRole("link", { name: "Checklist" })
      .click();
    await admin.getByRole("button", { name: "Start measuring" }).click();
    await admin.getByRole("button", { name: "Submit for review" }).waitFor({ timeout: 15_000 });
    const checklistUrl = admin.url();
    await admin.close();

    const p = await pageAs(ctx(), "engineer@halvard.example");
    const href = await p.getByRole("link", { name: "TR-2026-0057" }).getAttribute("href");
    const jobId = href!.split("/").pop()!;
    // Invented sphere-probe data from geometry's synthesiser (demo only) for this job's own head, uploaded through the datasets API.
    const head = await uploadSyntheticProbe(p, jobId, {
      errors: { pivot_length_error_um: -25, secondary_tilt_arcsec: 12, tip_offset_n_um: 8 },
      seed: 48,
      filename: "probe-0057.csv",
    });
    await openAnalysis(p, "TR-2026-0057");
    const row = p.locator("li", { hasText: "probe-0057.csv" });
    await row.getByRole("button", { name: "Run fit" }).click();
    await expect
      .poll(() => p.getByRole("table", { name: "Fitted parameters" }).count(), { timeout: 20_000 })
      .toBe(1);
    await waitForPicture(p);
    const approve = p.getByRole("button", { name: "Approve these parameters" });
    expect(await approve.isDisabled()).toBe(true);
    expect(await p.locator("#approve-refusal").innerText()).toMatch(/measuring/);
    const analysisUrl = p.url();
    await p.close();

    // The office submits the job for review on the checklist page.
    const admin2 = await pageAs(ctx(), "admin@halvard.example");
    await admin2.goto(checklistUrl);
    await admin2.getByRole("button", { name: "Submit for review" }).click();
    // A summary first (steps not measured, FAILs, readings waiting on this device), then submit.
    await admin2.getByTestId("review-summary").waitFor();
    await admin2.getByRole("button", { name: "Submit now" }).click();
    await expect.poll(() => admin2.getByTestId("review-summary").count(), { timeout: 15_000 }).toBe(0);
    expect(await admin2.getByRole("button", { name: "Submit for review" }).count()).toBe(0);
    await admin2.close();

    const e = await pageAs(ctx(), "engineer@halvard.example");
    await e.goto(analysisUrl);
    const approve2 = e.getByRole("button", { name: "Approve these parameters" });
    await approve2.waitFor();
    expect(await approve2.isDisabled()).toBe(false);
    await approve2.click();
    // Approval is a signature: the form names what does not conform and asks for the password
    // again (21 CFR 11.200; ISO/IEC 17025:2017 §7.8.2.1 o).
    await signApproval(e);
    const values = e.getByRole("table", { name: "Values for the control" });
    await values.waitFor({ timeout: 20_000 });
    const v = await values.innerText();
    // Nominal − 25 µm, recovered to well within 1 µm (1 µm noise, 120 poses).
    const pivot = Number(/Pivot length\s+([\d.]+) mm/.exec(v)?.[1]);
    expect(Math.abs(pivot - (head.pivotLengthMm - 0.025))).toBeLessThan(0.001);
    expect(v).toContain("mm");
    expect(v).toContain("°");
    expect(await e.getByRole("note", { name: /Safety/ }).innerText()).toMatch(/machine builder/);
    await expect.poll(() => e.locator("main").innerText()).toContain("Approved");
    await e.evaluate(() => window.scrollTo(0, 0));
    await e.screenshot({ path: screenshotPath("analysis-approved"), fullPage: true });
    await e.close();
  });
});
