// The administrator builds a procedure in the browser: a multi-point step at 12/3/6/9, a yes/no
// step whose missing limit source is named beside its field, a photo-required record step, a TCP
// check with its limits and their source, one fitted-parameter limit and one ISO 230-2 positioning
// limit of the primary axis (its missing source named beside it, then given);
// moves a step with the keyboard (focus follows it), creates the procedure, saves the version,
// retires it and brings it back. Screenshots at 1440×900 and on the tablet (820×1180).
import { describe, expect, it } from "vitest";
import {
  newContext,
  screenshotPath,
  seriousViolations,
  signIn,
  TABLET,
  contextForFile,
  pageAs,
} from "./browser";
import { addBuilderStep, buildCheckStep, builderStep, buildPhotoRecordStep, buildRunOutStep } from "./steps";

const ctx = contextForFile({ width: 1440, height: 900 });

describe("procedure builder (administrator)", () => {
  it("builds, reorders, creates, saves, retires and brings back a procedure", async () => {
    const p = await pageAs(ctx(), "admin@halvard.example");
    await p.goto("/registers/procedures");
    await p.getByRole("link", { name: "New procedure" }).click();
    await p.waitForURL("**/registers/procedures/new");
    const name = `Collar and dowels ${Date.now().toString(36)}`;
    await p.getByLabel("Name").fill(name);
    await p.getByLabel("Installation").check();
    await p.getByLabel("Head model").fill("HX-40");

    // Step 1: readings at four clock positions, judged by their TIR.
    const s1 = builderStep(p, 1);
    await buildRunOutStep(s1);

    // Step 2: a yes/no check, first without its limit source.
    const s2 = await addBuilderStep(p, 2);
    await buildCheckStep(s2, "Motor plate on its dowels");

    // Step 3: a value for the record that needs a photo.
    const s3 = await addBuilderStep(p, 3);
    await buildPhotoRecordStep(s3, "Shims under the collar", "mm");
    await s3.getByLabel("Safety note").fill("Lock out before hands go near the spindle nose.");

    // The head as a whole: a TCP check with limits (their source still missing), and one
    // fitted-parameter limit with its source.
    await p.getByLabel("Ask for a TCP check after compensation before the report is issued").check();
    await p.getByLabel("Range of the centre in X, Y and Z, each (µm)").fill("15");
    await p.getByLabel("Largest distance from the mean centre (µm)").fill("10");
    const tilt = "Squareness of the tilt axis to the primary axis";
    await p.getByLabel(`${tilt}: lower limit`).fill("-12");
    await p.getByLabel(`${tilt}: upper limit`).fill("12");
    await p.getByLabel(`${tilt}: limit source`).selectOption("common_practice");
    const accuracy = "Primary (rotary) axis, A";
    await p.getByLabel(`${accuracy}: upper limit in arc seconds`).fill("20");

    await p.getByRole("button", { name: "Create procedure" }).click();
    // The server names the missing source beside step 2's field, and the TCP limits' too.
    await expect
      .poll(() => p.locator('[data-error-for="steps.1.limitSource"]').innerText())
      .toMatch(/where the limit comes from/i);
    expect(await p.locator('[data-error-for="tcpLimitSource"]').innerText()).toMatch(
      /where the limit comes from/i,
    );
    expect(await p.locator('[data-error-for="positioningLimits.0.limitSource"]').innerText()).toMatch(
      /where the limit comes from/i,
    );
    await p.getByLabel(`${accuracy}: limit source`).selectOption("standard");
    await p.getByLabel(`${accuracy}: note on the source`).fill("Customer acceptance, C axis");
    await p.getByLabel("Where the TCP limits come from").selectOption("customer_spec");
    await p.getByLabel("TCP source note").fill("Acceptance sheet 3");
    expect(await p.getByRole("alert").first().innerText()).toMatch(/where the limit comes from|attention/i);
    await s2.getByLabel("Where the limit comes from").selectOption("maker_manual");
    await s2.getByLabel("Source note").fill("Head maker's manual, mounting section.");

    // Move step 3 up with the keyboard; focus stays on the moved step's button.
    await s3.getByRole("button", { name: "Move step 3 up" }).focus();
    await p.keyboard.press("Enter");
    await expect
      .poll(() => builderStep(p, 2).getByLabel("Title").inputValue())
      .toBe("Shims under the collar");
    await expect
      .poll(() => p.evaluate(() => document.activeElement?.getAttribute("aria-label")))
      .toBe("Move step 2 up");
    // Moved to the top, its Up button is disabled, so focus goes to the step's title; then back down.
    await p.keyboard.press("Enter");
    await expect.poll(() => p.evaluate(() => document.activeElement?.id)).toBe("step-0-title");
    expect(await builderStep(p, 1).getByLabel("Title").inputValue()).toBe("Shims under the collar");
    await builderStep(p, 1).getByRole("button", { name: "Move step 1 down" }).click();
    await expect
      .poll(() => builderStep(p, 2).getByLabel("Title").inputValue())
      .toBe("Shims under the collar");
    expect(await seriousViolations(p)).toEqual([]);
    await p.screenshot({ path: screenshotPath("procedure-builder"), fullPage: true });

    await p.getByRole("button", { name: "Create procedure" }).click();
    await p.waitForURL(/\/registers\/procedures\/[0-9a-f-]{36}$/);
    await expect.poll(() => p.getByRole("heading", { level: 1 }).innerText()).toContain(name);
    const rows = p.locator("table").first().locator("tbody tr");
    await expect.poll(() => rows.count()).toBe(3);
    expect(await rows.nth(0).innerText()).toMatch(/Collar run-out[\s\S]*12 · 3 · 6 · 9[\s\S]*≤ 0.0005 in/);
    expect(await rows.nth(1).innerText()).toMatch(/Shims under the collar[\s\S]*photo/);
    expect(await rows.nth(2).innerText()).toMatch(/Motor plate on its dowels[\s\S]*Maker's manual/);
    expect(await p.getByText("0 jobs follow this version").count()).toBe(1);
    const judging = p
      .getByRole("heading", { name: "Judging the head as a whole" })
      .first()
      .locator("xpath=../..");
    await expect
      .poll(() => judging.innerText())
      .toMatch(
        /required[\s\S]*≤ 15 µm in X, Y and Z[\s\S]*≤ 10 µm[\s\S]*Acceptance sheet 3[\s\S]*1 fitted head parameter has a limit[\s\S]*primary \(rotary\) axis A ≤ 20″ \(Standard: Customer acceptance, C axis\)/,
      );
    // The builder below reads them back.
    expect(await p.getByLabel("Range of the centre in X, Y and Z, each (µm)").inputValue()).toBe("15");
    expect(await p.getByLabel(`${tilt}: upper limit`).inputValue()).toBe("12");
    expect(await p.getByLabel(`${accuracy}: upper limit in arc seconds`).inputValue()).toBe("20");
    expect(await p.getByLabel(`${accuracy}: limit source`).inputValue()).toBe("standard");
    // For a head model in the register, the axes are named by its heads' letters (demo CA-40: C and A).
    await p.getByLabel("Head model").fill("CA-40");
    await expect
      .poll(() => p.getByRole("heading", { name: /^Primary \(rotary\) axis/ }).innerText())
      .toBe("Primary (rotary) axis C");
    expect(await p.getByRole("heading", { name: /^Secondary \(tilt\) axis/ }).innerText()).toBe(
      "Secondary (tilt) axis A",
    );
    await p.getByLabel("Head model").fill("HX-40");
    await expect
      .poll(() => p.getByRole("heading", { name: /^Primary \(rotary\) axis/ }).innerText())
      .toBe("Primary (rotary) axis");

    // No job follows version 1 yet: saving changes it in place.
    await builderStep(p, 3).getByLabel("Title").fill("Motor plate home on its dowels");
    await p.getByRole("button", { name: "Save version 1" }).click();
    await expect
      .poll(() => p.locator("table").first().locator("tbody tr").nth(2).innerText())
      .toMatch(/Motor plate home on its dowels/);
    expect(await p.getByRole("heading", { level: 1 }).innerText()).toMatch(/version 1/);

    await p.getByRole("button", { name: "Retire this procedure" }).click();
    await expect.poll(() => p.getByRole("button", { name: "Bring back into use" }).count()).toBe(1);
    await p.getByRole("button", { name: "Bring back into use" }).click();
    await expect.poll(() => p.getByRole("button", { name: "Retire this procedure" }).count()).toBe(1);
    await p.screenshot({ path: screenshotPath("procedure-detail"), fullPage: true });
    const url = p.url();
    await p.close();

    const tablet = await newContext(TABLET);
    try {
      const t = await tablet.newPage();
      await signIn(t, "admin@halvard.example");
      await t.waitForURL("**/jobs");
      await t.goto(url);
      await expect.poll(() => t.getByRole("heading", { level: 1 }).innerText()).toContain(name);
      await t.screenshot({ path: screenshotPath("procedure-detail-tablet"), fullPage: true });
      await t.goto("/registers/procedures/new");
      await t.screenshot({ path: screenshotPath("procedure-builder-tablet"), fullPage: true });
    } finally {
      await tablet.close();
    }
  }, 180_000);
});
