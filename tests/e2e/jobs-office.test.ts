// The office's jobs journey in the browser: the administrator opens a new job from the jobs board,
// schedules it in the machine's time zone and assigns the installer; the installer gets the
// e-mail (delivered through the outbox to the local SMTP fake) and finds the job under "To measure"
// on the tablet. Screenshots of the board and the form at 1440×900 and 820×1180.
import { describe, expect, it } from "vitest";
import { contextForFile, mailTo, screenshotPath, scrollsSideways, TABLET, pageAs } from "./browser";
import { pickFirst, startInstallationJob } from "./steps";

const OFFICE = { width: 1440, height: 900 };
const office = contextForFile(OFFICE);
const tablet = contextForFile(TABLET);
let reference = "";

describe("jobs office journey", () => {
  it("the administrator opens, schedules and assigns a new job", async () => {
    const p = await pageAs(office(), "admin@halvard.example");
    // The board shows the administrator's queue with its count.
    await expect.poll(() => p.getByRole("button", { name: /To schedule/ }).count()).toBe(1);
    await p.screenshot({ path: screenshotPath("jobs-board-admin-1440"), fullPage: true });

    await startInstallationJob(p, "Head installation, bay 2 (office journey)");
    await pickFirst(p, "Procedure");
    await p.getByLabel("Order reference").fill("PO-55120");
    await p.getByLabel("Contact name").fill("Dana Reyes");
    await p.getByLabel("Contact e-mail").fill("dana.reyes@marlowcreek.example");
    await p.getByLabel("Date", { exact: true }).fill("2027-07-14");
    await p.getByLabel("Time (24 h)").fill("07:30");
    await p.getByLabel("Time zone").fill("Europe/Berlin");
    await p.getByLabel("Installer", { exact: true }).selectOption({ label: "Iver Sandvik" });
    await p.screenshot({ path: screenshotPath("jobs-new-1440"), fullPage: true });

    // A bad e-mail is named beside its field before anything is sent.
    await p.getByLabel("Contact e-mail").fill("dana.reyes");
    await p.getByRole("button", { name: "Open the job" }).click();
    await expect.poll(() => p.locator('[data-error-for="customerContactEmail"]').innerText()).not.toBe("");
    await p.getByLabel("Contact e-mail").fill("dana.reyes@marlowcreek.example");
    await p.getByRole("button", { name: "Open the job" }).click();

    await p.waitForURL(/\/jobs\/[0-9a-f-]{36}$/);
    reference = (await p.locator("nav[aria-label=Breadcrumb] .num").innerText()).trim();
    expect(reference).toMatch(/^TR-\d{4}-\d{4}$/);
    const card = p.locator("section", { hasText: "Order and schedule" });
    // 07:30 in Berlin in July is CEST, UTC+2 (IANA tzdata).
    await expect
      .poll(() => card.innerText())
      .toMatch(/2027-07-14 07:30 GMT\+2 \(Europe\/Berlin at the machine\)/);
    expect(await card.innerText()).toMatch(/PO-55120/);
    expect(await card.innerText()).toMatch(/Iver Sandvik/);
    await p.screenshot({ path: screenshotPath("jobs-new-opened-1440"), fullPage: true });
    await p.close();
  });

  it("the installer is e-mailed the job with its time and zone", async () => {
    expect(reference).not.toBe("");
    const raw = await mailTo("installer@halvard.example", new RegExp(`${reference} is assigned to you`));
    const text = raw.replace(/=\r?\n/g, "");
    expect(text).toMatch(/2027-07-14 07:30 GMT\+2 \(Europe\/Berlin\)/);
    expect(text).toMatch(/Head installation, bay 2 \(office journey\)/);
  });

  it("the installer sees the job under To measure on the tablet", async () => {
    const p = await pageAs(tablet(), "installer@halvard.example");
    const chip = p.getByRole("button", { name: /To measure/ });
    await chip.click();
    await p.waitForURL(/queue=to_measure/);
    await expect.poll(() => p.getByRole("link", { name: reference }).count()).toBe(1);
    // The list is the queue's: as many jobs as the chip counts, once the answer is in.
    const waiting = Number((await chip.innerText()).match(/\d+/)![0]);
    await expect.poll(() => p.getByRole("link", { name: /^TR-\d{4}-\d{4}$/ }).count()).toBe(waiting);
    await expect.poll(() => p.locator("[aria-busy=true]").count()).toBe(0);
    expect(await scrollsSideways(p)).toBe(false);
    // The reference stays on one line at 820 px.
    const box = await p.getByRole("link", { name: reference }).boundingBox();
    expect(box!.height).toBeLessThan(30);
    await p.screenshot({ path: screenshotPath("jobs-board-installer-820"), fullPage: true });
    await p.close();
  });

  it("the new-job form fits the tablet width", async () => {
    const p = await pageAs(tablet(), "admin@halvard.example");
    await p.goto("/jobs/new");
    await expect.poll(() => p.getByRole("heading", { name: "New job" }).count()).toBe(1);
    expect(await scrollsSideways(p)).toBe(false);
    await p.screenshot({ path: screenshotPath("jobs-new-820"), fullPage: true });
    await p.goto("/jobs");
    await p.screenshot({ path: screenshotPath("jobs-board-admin-820"), fullPage: true });
    await p.close();
  });

  it("the office puts the job on hold, releases it and cancels it with a reason; it stays readable", async () => {
    const p = await pageAs(office(), "admin@halvard.example");
    await p.getByRole("link", { name: reference }).click();
    await p.waitForURL(/\/jobs\/[0-9a-f-]{36}$/);
    const status = () =>
      p
        .locator("main")
        .getByText(/^(Draft|On hold|Cancelled)$/)
        .first()
        .innerText();
    await p.getByRole("button", { name: "Put on hold…" }).click();
    await p.getByLabel("Why (optional)").fill("Crane out of service until Monday");
    await p.getByRole("button", { name: "Put on hold", exact: true }).click();
    await expect.poll(status).toBe("On hold");
    expect(await p.getByRole("status").first().innerText()).toMatch(/Crane out of service until Monday/);
    await p.getByRole("button", { name: "Release from hold" }).click();
    await expect.poll(status).toBe("Draft");
    await p.getByRole("button", { name: "Cancel the job…" }).click();
    await p.getByRole("button", { name: "Cancel the job", exact: true }).click();
    // The reason is required and named beside its field.
    await expect.poll(() => p.locator('[data-error-for="reason"]').innerText()).not.toBe("");
    await p.getByLabel("Reason (required)").fill("Customer postponed the machine move");
    await p.getByRole("button", { name: "Cancel the job", exact: true }).click();
    await expect.poll(status).toBe("Cancelled");
    expect(await p.locator("section", { hasText: "Order and schedule" }).innerText()).toMatch(
      /Cancelled: Customer postponed the machine move/,
    );
    // No more office controls on a cancelled job.
    expect(
      await p.getByRole("button", { name: /Put on hold|Cancel the job|Change the installer/ }).count(),
    ).toBe(0);
    await p.screenshot({ path: screenshotPath("jobs-cancelled-1440"), fullPage: true });
    await p.close();
  });
});
