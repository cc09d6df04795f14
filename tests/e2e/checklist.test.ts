// Journey 4 in Debian's Chromium against the built app: the installer records readings before and
// after shimming the collar on the tablet checklist, sees live pass/fail, is refused an instrument
// past its calibration date, corrects a reading, and compares before and after side by side.
// The demo values are invented (db/seed-checklists.ts). Does not change the job's status, so the
// other browser tests see the seeded statuses. The same journey on the tablet is in
// journeys-tablet.test.ts.
import { describe, expect, it } from "vitest";
import type { Locator, Page } from "playwright-core";
import { screenshotPath, signIn, contextForFile } from "./browser";
import { chooseInstrument, openStep } from "./steps";

const ctx = contextForFile();
let jobHref: string;

/** Presses a step's save button (for a reading or a correction) and waits until its status line says `said`. */
async function save(step: Locator, button: "Save reading" | "Save correction", said: RegExp) {
  await step.getByRole("button", { name: button }).click();
  await expect.poll(() => step.getByRole("status").innerText()).toMatch(said);
}

/** Waits until at least one of these table rows is shown. */
async function expectShown(rows: Locator) {
  await expect.poll(() => rows.count()).toBeGreaterThan(0);
}

async function openChecklist(p: Page) {
  await signIn(p, "installer@halvard.example");
  await p.waitForURL("**/jobs");
  jobHref = (await p.getByRole("link", { name: "TR-2026-0052" }).getAttribute("href"))!;
  await p.goto(`${jobHref}/checklist`);
  await expect.poll(() => p.getByRole("heading", { name: "Procedure checklist" }).isVisible()).toBe(true);
}

describe("journey 4: readings before and after an adjustment, compared side by side", () => {
  it("records, refuses an expired instrument, corrects, and compares", async () => {
    await ctx().clearCookies();
    const p = await ctx().newPage();
    await openChecklist(p);
    const step1 = await openStep(p, 1);
    // The limit is shown in the installer's inch units, with its source.
    expect(await step1.getByTestId("limits-1").innerText()).toBe("≤ 0.0005 in");
    expect(await step1.innerText()).toMatch(/Common practice/);
    expect(await step1.getByRole("note").innerText()).toMatch(/Lock out.*machine builder's manual/s);

    // After shimming: pick the phase, type the value and watch the live result.
    await step1.getByLabel("After adjustment").check();
    const value = step1.getByLabel(/Collar face flatness \(TIR\) \(in\)/);
    await value.fill("0.0009");
    await expect.poll(() => step1.getByTestId("live-1").innerText()).toMatch(/Fail/);
    await value.fill("0.0003");
    await expect.poll(() => step1.getByTestId("live-1").innerText()).toMatch(/Pass/);

    // An indicator past its calibration due date is listed with its due date but cannot be chosen
    // (the server refuses it too: tests/integration/readings-sync.test.ts).
    const expired = step1.getByLabel("Instrument").locator("option", { hasText: "DTI-0417" });
    expect(await expired.isDisabled()).toBe(true);
    expect(await expired.textContent()).toMatch(/past due since 2026-09-30/);
    await p.screenshot({ path: screenshotPath("checklist-expired-instrument") });

    // Checked as you type: not a number, or finer than the instrument reads; Save waits.
    await chooseInstrument(step1, "DTI-0112");
    const saveButton = step1.getByRole("button", { name: "Save reading" });
    await value.fill("abc");
    await expect.poll(() => step1.getByTestId("problem-1").innerText()).toMatch(/Not a number/);
    expect(await saveButton.isDisabled()).toBe(true);
    await value.fill("0.00031");
    await expect
      .poll(() => step1.getByTestId("problem-1").innerText())
      .toMatch(/More decimals than DTI-0112/);
    expect(await saveButton.isDisabled()).toBe(true);
    await value.fill("0.0003");
    await expect.poll(() => step1.getByTestId("problem-1").innerText()).toBe("");

    await step1.getByLabel(/^Note/).fill("after a 0.0004 in shim at 4 o'clock");
    await save(step1, "Save reading", /Reading saved: pass/);
    await expectShown(step1.locator("tbody tr").filter({ hasText: "0.0003 in" }));

    // Step 4 before and after setting the secondary zero; the post reading is first mistyped, then corrected.
    const step4 = await openStep(p, 4);
    const v4 = step4.getByLabel(/Secondary axis: indicator difference across the head \(in\)/);
    await step4.getByLabel("After adjustment").check();
    await chooseInstrument(step4, "DTI-0112");
    await v4.fill("0.0010");
    await save(step4, "Save reading", /Reading saved: fail/);
    const wrongRow = step4
      .locator("tbody tr:not([data-superseded])")
      .filter({ hasText: "0.0010 in" })
      .first();
    await wrongRow.getByRole("button", { name: "Correct" }).click();
    await v4.fill("0.0001");
    await step4.getByLabel(/^Note/).fill("misread the dial");
    await save(step4, "Save correction", /Correction saved: pass/);
    // The mistyped reading is kept and marked as corrected, not overwritten.
    await expectShown(step4.locator('tr[data-superseded="true"]').filter({ hasText: "0.0010 in" }));
    await p.screenshot({ path: screenshotPath("checklist-desktop"), fullPage: true });

    // Compare: every step with before, after, change, limits and result.
    await p.getByRole("link", { name: "Compare", exact: true }).click();
    await p.waitForURL(/\/compare$/);
    expect(await p.getByTestId("compare-pre-1").innerText()).toMatch(/0\.0007 in[\s\S]*Fail/);
    expect(await p.getByTestId("compare-post-1").innerText()).toMatch(/0\.0003 in[\s\S]*Pass/);
    expect(await p.getByTestId("compare-change-1").innerText()).toBe("−0.0004 in");
    expect(await p.getByTestId("compare-status-1").innerText()).toMatch(/Pass/);
    expect(await p.getByTestId("compare-pre-4").innerText()).toMatch(/0\.0005 in[\s\S]*Fail/);
    expect(await p.getByTestId("compare-post-4").innerText()).toMatch(/0\.0001 in[\s\S]*Pass/);
    expect(await p.getByTestId("compare-change-4").innerText()).toBe("−0.0004 in");
    expect(await p.getByTestId("compare-status-6").innerText()).toMatch(/Not measured/);
    expect(await p.getByTestId("band-chart").isVisible()).toBe(true);
    await p.screenshot({ path: screenshotPath("compare-desktop"), fullPage: true });

    // The same comparison in metric, by the user's choice; stored values are unchanged.
    await p.getByRole("button", { name: "Metric" }).click();
    await expect.poll(() => p.getByTestId("compare-post-1").innerText()).toMatch(/0\.008 mm/);
    await p.getByRole("button", { name: "Inch" }).click();
    await expect.poll(() => p.getByTestId("compare-post-1").innerText()).toMatch(/0\.0003 in/);
    await p.close();
  });
});
