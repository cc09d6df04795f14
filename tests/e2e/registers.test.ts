// The administrator's registers in the browser: instruments with their calibration state (and
// adding one), procedures with versioned limits, inviting a person (the e-mail goes through the
// outbox and the app's worker), and the outbox page.
import { describe, expect, it } from "vitest";
import { screenshotPath, contextForFile, pageAs } from "./browser";

const ctx = contextForFile();

describe("registers (administrator)", () => {
  it("instruments show their calibration state; a new one is added with a clear error first", async () => {
    const p = await pageAs(ctx(), "admin@halvard.example");
    await p.goto("/registers/instruments");
    const past = p.locator("tr", { hasText: "DTI-0417" });
    expect(await past.innerText()).toMatch(/Past due — refused/);
    const serial = `DTI-E2E-${Date.now().toString(36)}`;
    await p.getByLabel("Kind").fill("Dial test indicator");
    await p.getByLabel("Serial").fill(serial);
    await p.getByLabel("Resolution").fill("0.0001");
    await p.getByLabel("Standard uncertainty (k = 1)").fill("0.00005");
    await p.getByLabel("Unit of these numbers").selectOption("in");
    await p.getByRole("button", { name: "Add instrument" }).click();
    await expect.poll(() => p.locator('[data-error-for="calibrationDueOn"]').innerText()).not.toBe("");
    await p.getByLabel("Calibration due").fill("2027-11-30");
    await p.getByRole("button", { name: "Add instrument" }).click();
    await expect.poll(() => p.locator("tr", { hasText: serial }).count()).toBe(1);
    expect(await p.locator("tr", { hasText: serial }).innerText()).toMatch(/In calibration/);
    await p.screenshot({ path: screenshotPath("registers-instruments"), fullPage: true });
    await p.goto("/registers/procedures");
    expect(await p.getByText(/Two-axis head installation · version \d+ \(current\)/).count()).toBe(1);
    await p.screenshot({ path: screenshotPath("registers-procedures"), fullPage: true });
    await p.close();
  });

  it("invites a person by e-mail; the message is queued and sent by the app's worker", async () => {
    const p = await ctx().newPage();
    await p.goto("/registers/people");
    const email = `new.${Date.now().toString(36)}@halvard.example`;
    await p.getByLabel("Name").fill("Nadia Field");
    await p.getByLabel("E-mail").fill(email);
    await p.getByRole("button", { name: "Send invitation" }).click();
    await expect.poll(() => p.getByRole("status").first().innerText()).toMatch(/Invitation queued/);
    await expect.poll(() => p.locator("tr", { hasText: email }).count()).toBe(1);
    await p.screenshot({ path: screenshotPath("registers-people"), fullPage: true });
    await p.goto("/registers/outbox");
    const item = p.locator("li", { hasText: `to ${email}` });
    expect(await item.innerText()).toMatch(/You are invited to Trammel/);
    // The token never appears on the page.
    await item.locator("summary").click();
    expect(await item.innerText()).toMatch(/token=…/);
    await p.screenshot({ path: screenshotPath("registers-outbox"), fullPage: true });
    await p.close();
  });
});
