// ISO 230-2 positioning of a rotary axis in Debian's Chromium, on the seeded job TR-2026-0059
// (invented demo data; its procedure limits A and R of the primary axis): the installer uploads a
// tilt-axis (A) test through the Data page's form, choosing the axis and the U of the reference,
// and the dataset page shows the standard's quantities both ways and per direction and the chart
// of the means ± 2s; the seeded C-axis test is judged Pass against the procedure's limits; the
// draft report (PDF, read back with poppler's pdftotext) prints section 5.4 for both axes. On the
// tablet the page does not scroll sideways.
import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { demoRotaryPositioningCsv } from "@/db/seed-positioning";
import { choose, contextForFile, pageAs, screenshotPath, seriousViolations, TABLET } from "./browser";
import { expectPhrases, pdfPagesToPng, pdfText } from "../pdf-tools";
import { openJobSection } from "./steps";

const ctx = contextForFile({ width: 1440, height: 900 });
const tablet = contextForFile(TABLET);
let datasetUrl = "";

async function openData(p: Page) {
  await p.goto("/jobs");
  await openJobSection(p, "TR-2026-0059", "Data");
  await p.waitForURL(/\/data$/);
}

describe("rotary positioning on the demo job", () => {
  it("uploads a tilt-axis test through the form and shows its quantities and chart", async () => {
    const p = await pageAs(ctx(), "installer@halvard.example");
    await openData(p);
    await choose(p, "Rotary positioning (ISO 230-2)");
    await choose(p, "secondary (tilt) axis");
    await p.getByLabel(/Expanded uncertainty U \(k = 2\) of the angle measurement/).fill("0.5");
    const csv = Buffer.from(demoRotaryPositioningCsv({ axis: "A", seed: 7, scale: 0.5 }));
    await p
      .getByLabel("CSV file")
      .setInputFiles({ name: "a-axis-e2e.csv", mimeType: "text/csv", buffer: csv });
    await expect.poll(() => p.getByText("No problems found in the browser").count()).toBe(1);
    await p.getByRole("button", { name: "Upload and check" }).click();
    await p.waitForURL(/\/data\/[0-9a-f-]{36}$/);
    datasetUrl = p.url();

    await p
      .getByRole("heading", { name: "Positioning of the secondary (tilt) axis A (ISO 230-2)" })
      .waitFor();
    const table = p.getByRole("table").filter({ hasText: "Accuracy of positioning" });
    const row = (name: string) => table.getByRole("row").filter({ hasText: new RegExp(`^${name}`) });
    // Every quantity with its value both ways; A, E and R per direction too; no limit for this axis.
    for (const q of [
      "Accuracy of positioning",
      "Systematic positioning error",
      "Mean bidirectional positioning error",
      "Repeatability of positioning",
      "Reversal value",
      "Mean reversal value",
    ])
      expect(await row(q).innerText()).toMatch(/\d+\.\d\d″/);
    expect(await row("Accuracy of positioning").innerText()).toMatch(/(\d+\.\d\d″[\s\S]*){3}/);
    expect(await row("Accuracy of positioning").innerText()).toContain("Recorded");
    expect(await p.locator("[data-positioning-decision]").innerText()).toContain("Recorded");
    // The chart: 12 targets, each direction a bar and a marker per target.
    const chart = p.getByTestId("positioning-chart");
    expect(
      await chart.getByRole("img", { name: /Positioning of the secondary \(tilt\) axis A/ }).count(),
    ).toBe(1);
    expect(await chart.locator("svg[role=img] circle").count()).toBe(12);
    expect(await chart.locator("svg[role=img] rect[fill='#ffffff']").count()).toBe(12);
    expect(await p.getByText("U = 0.5″ (k = 2)").count()).toBe(1);
    expect(await seriousViolations(p)).toEqual([]);
    await p.screenshot({ path: screenshotPath("rotary-positioning-dataset"), fullPage: true });

    // The seeded C-axis test passes the procedure's A ≤ 20″ and R ≤ 6″.
    await openData(p);
    await p.getByRole("link", { name: "Rotary positioning (ISO 230-2)" }).last().click();
    await p.waitForURL(/\/data\/[0-9a-f-]{36}$/);
    await p
      .getByRole("heading", { name: "Positioning of the primary (rotary) axis C (ISO 230-2)" })
      .waitFor();
    expect(await p.locator("[data-positioning-decision]").innerText()).toContain("Pass");
    const seeded = p.getByRole("table").filter({ hasText: "Accuracy of positioning" });
    expect(await seeded.getByRole("row").filter({ hasText: "Accuracy of positioning" }).innerText()).toMatch(
      /≤ 20\.00″[\s\S]*customer specification[\s\S]*Pass/,
    );
    await p.screenshot({ path: screenshotPath("rotary-positioning-seeded"), fullPage: true });
    await p.close();
  }, 120_000);

  it("prints 5.4 for both axes in the draft report", async () => {
    const p = await pageAs(ctx(), "engineer@halvard.example");
    const jobId = datasetUrl.match(/\/jobs\/([0-9a-f-]{36})\//)![1]!;
    const pdf = await p.request.get(`/api/jobs/${jobId}/report/draft`);
    expect(pdf.status()).toBe(200);
    const body = await pdf.body();
    expectPhrases(pdfText(body, true), [
      "5.4 Positioning of the rotary axes (ISO 230-2)",
      "Primary (rotary) axis C: Pass",
      "Secondary (tilt) axis A: Recorded",
      "a-axis-e2e.csv",
    ]);
    pdfPagesToPng(body, screenshotPath("rotary-positioning-draft").replace(/\.png$/, ""), 80);
    await p.close();
  }, 120_000);

  it("reads on the tablet without sideways scrolling of the page", async () => {
    const p = await pageAs(tablet(), "inspector@halvard.example");
    await p.goto(datasetUrl);
    await p.getByTestId("positioning-chart").waitFor();
    expect(await p.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth)).toBe(true);
    await p.screenshot({ path: screenshotPath("rotary-positioning-tablet"), fullPage: true });
    await p.close();
  }, 60_000);
});
