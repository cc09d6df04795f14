// The control loop in Debian's Chromium, on the seeded after-crash job TR-2026-0059 (invented demo
// data; its head fit is approved by the seed, so the values to enter exist): the engineer records
// the control's values as found on the job's Control page and sees the values to enter change by
// the approved correction; records the values as left with one typed differently and sees that row
// flagged; the installer uploads a tool-centre-point check through the datasets API the upload
// page uses, and the page judges it Pass against the procedure's limits; the draft report (PDF,
// read back with poppler's pdftotext) prints all of it with the sign convention and the caution.
import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { headPoseGrid, synthesiseSphereProbe } from "@/geometry";
import { screenshotPath, seriousViolations, signIn, TABLET, pageAs, contextForFile } from "./browser";
import { expectPhrases, pdfFile, pdfPagesToPng, pdfText } from "../pdf-tools";
import { openJobSection } from "./steps";

const ctx = contextForFile({ width: 1440, height: 900 });
const tablet = contextForFile(TABLET);

async function openControl(p: Page) {
  await p.goto("/jobs");
  await openJobSection(p, "TR-2026-0059", "Control");
  await p.waitForURL(/\/control$/);
}

const rowOf = (p: Page, setting: string) =>
  p
    .getByRole("table", { name: "The control's kinematic values" })
    .getByRole("row", { name: new RegExp(setting) });

/** A TCP-check file from geometry's forward model: 2 µm of pivot error left after compensation. */
function tcpCsv(): string {
  const poses = headPoseGrid({ primarySteps: 8, secondaryDeg: [-90, -45, 0, 45, 90] });
  const d = synthesiseSphereProbe(
    { primary: "C", secondary: "A", pivotLengthMm: 152.4, toolDirection: [0, 0, -1] },
    { pivot_length_error_um: 2 },
    poses,
    { noiseUm: 0.3, seed: 7, centreMm: [612.5, -204, 388.25] },
  );
  const lines = ["primary_deg,secondary_deg,x,y,z"];
  for (let i = 0; i < d.rows; i++)
    lines.push(
      [
        d.primaryDeg[i],
        d.secondaryDeg[i],
        d.xMm[i]!.toFixed(5),
        d.yMm[i]!.toFixed(5),
        d.zMm[i]!.toFixed(5),
      ].join(","),
    );
  return lines.join("\n") + "\n";
}

describe("the control loop on an after-crash job", () => {
  it("records as found and as left, flags a difference, passes a TCP check, and prints it all", async () => {
    const p = await pageAs(ctx(), "engineer@halvard.example");
    await openControl(p);

    // The seeded loop: values to enter shown, the sign convention and the caution beside them.
    await expect.poll(() => rowOf(p, "Pivot length").innerText()).toMatch(/152\.4000 mm/);
    const seeded = await rowOf(p, "Pivot length").innerText();
    const correction = Number(seeded.match(/([+−-]\d+\.\d{4}) mm/)![1]!.replace("−", "-"));
    expect(Math.abs(correction)).toBeGreaterThan(0.01);
    await expect.poll(() => p.getByText("Value to enter = as found + correction").count()).toBeGreaterThan(0);
    expect(await p.getByRole("note", { name: /Entering values in the control/ }).innerText()).toContain(
      "control builder's manual",
    );

    // As found, typed again with a different pivot length: the value to enter moves with it.
    const found = p.getByRole("form", { name: "Record the values as found" });
    await found.getByLabel(/^Pivot length/).fill("152.3950");
    await found.getByRole("button", { name: "Record values as found" }).click();
    await expect
      .poll(() => rowOf(p, "Pivot length").innerText(), { timeout: 15_000 })
      .toContain("152.3950 mm");
    // The row reads: as found, correction, value to enter, as left.
    const mm = (t: string) =>
      [...t.matchAll(/([+−]?\d+\.\d{4}) mm/g)].map((m) => Number(m[1]!.replace("−", "-")));
    const pivot = mm(await rowOf(p, "Pivot length").innerText());
    expect(pivot[1]).toBeCloseTo(correction, 4);
    expect(pivot[2]).toBeCloseTo(152.395 + correction, 3);
    const toEnter = pivot[2]!.toFixed(4);

    // As left: the pivot as computed, the tilt-axis zero typed 0.01° off — that row is flagged.
    const left = p.getByRole("form", { name: "Record the values as left" });
    await left.getByLabel(/^Pivot length/).fill(toEnter);
    const zeroRow = await rowOf(p, "Tilt axis zero offset").innerText();
    const zeroToEnter = [...zeroRow.matchAll(/([+−]?\d+\.\d{5})°/g)].map((m) =>
      Number(m[1]!.replace("−", "-")),
    )[2]!;
    await left.getByLabel(/^Tilt axis zero offset/).fill((zeroToEnter + 0.01).toFixed(5));
    await left.getByRole("button", { name: "Record values as left" }).click();
    await expect
      .poll(() => rowOf(p, "Tilt axis zero offset").innerText(), { timeout: 15_000 })
      .toContain("Differs from the value to enter");
    expect(await rowOf(p, "Pivot length").innerText()).toContain("As computed");
    expect(await p.getByText(/values? left in the control (is|are) not the values? to enter/).count()).toBe(
      1,
    );
    await p.screenshot({ path: screenshotPath("control-loop-desktop"), fullPage: true });
    expect(await seriousViolations(p)).toEqual([]);

    // The installer uploads a TCP check (approved job: the one kind of data still taken).
    await ctx().clearCookies();
    await p.goto("/login");
    await signIn(p, "installer@halvard.example");
    await p.waitForURL("**/jobs");
    await openControl(p);
    const jobId = p.url().match(/\/jobs\/([0-9a-f-]{36})\//)![1]!;
    const up = await p.request.post(`/api/jobs/${jobId}/datasets`, {
      multipart: {
        kind: "tcp_check",
        phase: "post",
        units: "mm",
        file: { name: "tcp-e2e.csv", mimeType: "text/csv", buffer: Buffer.from(tcpCsv()) },
      },
    });
    expect(up.status()).toBe(201);
    await p.reload();
    const tcpCard = p
      .locator("section")
      .filter({ has: p.getByRole("heading", { name: "Tool-centre-point check after compensation" }) });
    await expect.poll(() => tcpCard.innerText()).toContain("tcp-e2e.csv");
    expect(await tcpCard.locator("[data-tcp-decision]").innerText()).toContain("Pass");
    // The card says where the limits it judged against come from, as the report does.
    expect(await tcpCard.locator("[data-tcp-limit-source]").innerText()).toContain(
      "source: Customer specification",
    );

    // The draft report prints the loop and the check (staff only; read back with pdftotext).
    await ctx().clearCookies();
    await p.goto("/login");
    await signIn(p, "engineer@halvard.example");
    await p.waitForURL("**/jobs");
    const pdf = await p.request.get(`/api/jobs/${jobId}/report/draft`);
    expect(pdf.status()).toBe(200);
    const file = pdfFile(await pdf.body());
    const text = pdfText(file, true);
    expectPhrases(text, [
      "5.1 Values for the control: as found, to enter, as left",
      `${toEnter} mm`,
      "Differs from the value to enter",
      "5.2 Tool-centre-point check after compensation",
      "tcp-e2e.csv",
      // Each judged TCP figure says the rule and where the procedure's limit comes from.
      "Rule: simple; limit: Customer specification",
      "Value to enter = as found + correction",
      "qualified people",
      // The approved fit's budget, with the demo's register inputs (probe 0.50 µm, presetter 2.00 µm).
      "5.3 Uncertainty budget of the head parameters (JCGM 100)",
      "tool-length presetter",
      "probe 0.50 µm",
    ]);
    pdfPagesToPng(file, screenshotPath("control-loop-draft").replace(/\.png$/, ""), 70);
  }, 120_000);

  it("reads on the tablet without sideways scrolling of the page", async () => {
    const p = await pageAs(tablet(), "inspector@halvard.example");
    await openControl(p);
    // Below 900 px the table's rows are cards: the setting is still read as text.
    await expect
      .poll(() => p.getByText("Pivot length (tilt axis to gauge point)").count())
      .toBeGreaterThan(0);
    // The inspector reads the loop; recording is the engineer's.
    expect(await p.getByText("Only an application engineer records the control's values.").count()).toBe(2);
    await p.screenshot({ path: screenshotPath("control-loop-tablet"), fullPage: true });
    const wide = await p.evaluate(() => document.documentElement.scrollWidth > window.innerWidth + 1);
    expect(wide).toBe(false);
  }, 60_000);
});
