// The tablet at the machine with no signal, in Debian's Chromium at 820×1180 against the built
// app: readings and a correction typed offline are kept on the device (IndexedDB), survive a
// reload served by the service worker, and are stored exactly once each when the connection
// returns; the same when the server answers 503 for a while. "Offline" is every request of the
// context aborted (Playwright routes the service worker's own fetches too), because the browser's
// offline switch is not reliable once a service worker controls the page. Works on steps 2 and 3
// of TR-2026-0052, which no other browser test records on.
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Locator, Page } from "playwright-core";
import { newContext, screenshotPath, scrollsSideways, signIn, TABLET } from "./browser";
import { openStep } from "./steps";

let ctx: BrowserContext;
let jobPath = "";

beforeAll(async () => {
  ctx = await newContext(TABLET);
});
afterAll(async () => {
  await ctx?.close();
});
// A failed test must not leave the next one offline.
afterEach(async () => {
  await ctx?.unrouteAll({ behavior: "ignoreErrors" });
});

const offline = (r: { abort: (code: string) => Promise<void> }) => r.abort("internetdisconnected");

async function openChecklist(): Promise<Page> {
  await ctx.clearCookies();
  const p = await ctx.newPage();
  await signIn(p, "installer@halvard.example");
  await p.waitForURL("**/jobs");
  jobPath = (await p.getByRole("link", { name: "TR-2026-0052" }).getAttribute("href"))!;
  await p.goto(`${jobPath}/checklist`);
  await expect.poll(() => p.getByRole("heading", { name: "Procedure checklist" }).isVisible()).toBe(true);
  // The service worker controls the page and has kept this job's checklist.
  await p.waitForFunction(() => navigator.serviceWorker.controller !== null, null, { timeout: 20_000 });
  await p.getByTestId("offline-ready").waitFor({ timeout: 30_000 });
  expect(await p.evaluate(async () => Boolean(await caches.match(location.pathname)))).toBe(true);
  return p;
}

async function record(step: Locator, phase: string, value: string, serial: string, label: RegExp) {
  await step.getByLabel(phase).check();
  const select = step.getByLabel("Instrument");
  await select.selectOption({
    label: (await select.locator("option", { hasText: serial }).textContent())!.trim(),
  });
  await step.getByLabel(label).fill(value);
  await step.getByRole("button", { name: "Save reading" }).click();
}

/** The clientIds this tablet still holds for the job, read from IndexedDB as the app stored them. */
async function queuedIds(p: Page): Promise<string[]> {
  return p.evaluate(
    () =>
      new Promise<string[]>((resolve, reject) => {
        const open = indexedDB.open("trammel-tablet");
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const req = open.result.transaction("readings").objectStore("readings").getAllKeys();
          req.onsuccess = () => resolve(req.result as string[]);
          req.onerror = () => reject(req.error);
        };
      }),
  );
}

async function storedReadings(p: Page) {
  const id = jobPath.split("/").pop();
  const res = await p.request.get(`/api/jobs/${id}/readings`);
  expect(res.status()).toBe(200);
  return (await res.json()).readings as Array<{
    id: string;
    clientId: string | null;
    supersededById: string | null;
  }>;
}

const GAP = /Head-to-collar gap.*\(in\)/;
const PRIMARY = /Primary axis: indicator difference.*\(in\)/;

describe("offline capture on the tablet", () => {
  it("keeps three readings and a correction typed offline through a reload, then stores each once", async () => {
    const p = await openChecklist();
    await ctx.route("**/*", offline);

    const step2 = await openStep(p, 2);
    await record(step2, "Before adjustment", "0.0040", "FG-0031", GAP);
    await expect.poll(() => step2.getByRole("status").innerText()).toMatch(/waiting to send/);
    await record(step2, "After adjustment", "0.0010", "FG-0031", GAP);
    const step3 = await openStep(p, 3);
    await record(step3, "Before adjustment", "0.0009", "DTI-0112", PRIMARY);
    await expect.poll(() => p.getByTestId("queue-count").innerText()).toBe("3");
    // The third was misread: correct it while it is still on the tablet.
    await step3.locator('tr[data-queued="waiting"]').getByRole("button", { name: "Correct" }).click();
    await step3.getByLabel(PRIMARY).fill("0.0006");
    await step3.getByLabel(/^Note/).fill("misread the dial");
    await step3.getByRole("button", { name: "Save correction" }).click();
    await expect.poll(() => p.getByTestId("queue-count").innerText()).toBe("4");

    // Reload with no connection: the page comes from the service worker, the readings from IndexedDB.
    await p.reload();
    await expect
      .poll(() => p.getByRole("heading", { name: "Procedure checklist" }).isVisible(), { timeout: 10_000 })
      .toBe(true);
    await expect.poll(() => p.getByTestId("queue-count").innerText()).toBe("4");
    expect(await p.getByTestId("step-2").locator('tr[data-queued="waiting"]').count()).toBe(2);
    expect(await p.getByTestId("step-3").locator('tr[data-queued="waiting"]').count()).toBe(2);
    await p.screenshot({ path: screenshotPath("offline-queued-820"), fullPage: true });
    const ids = await queuedIds(p);
    expect(ids).toHaveLength(4);

    // The connection returns: the installer taps "Send now" and the queue empties.
    await ctx.unroute("**/*", offline);
    await p.getByRole("button", { name: "Send now" }).click();
    await expect
      .poll(() => p.getByTestId("queue-status").innerText(), { timeout: 20_000 })
      .toMatch(/Every reading is stored on the server/);
    const stored = await storedReadings(p);
    for (const id of ids) expect(stored.filter((r) => r.clientId === id)).toHaveLength(1);
    // The correction replaced the misread reading on the server too.
    const step3Rows = stored.filter((r) => ids.includes(r.clientId!));
    expect(step3Rows.filter((r) => r.supersededById !== null).length).toBeGreaterThanOrEqual(1);
    expect(await queuedIds(p)).toEqual([]);
    await p.close();
  });

  it("retries with backoff while the server answers 503, then stores the reading once", async () => {
    const p = await openChecklist();
    let refusedSends = 0;
    await ctx.route("**/api/jobs/*/readings", async (route) => {
      if (route.request().method() === "POST" && refusedSends < 2) {
        refusedSends++;
        await route.fulfill({
          status: 503,
          contentType: "application/json",
          body: JSON.stringify({ error: { code: "unavailable", message: "Busy" } }),
        });
      } else await route.fallback();
    });
    const step2 = await openStep(p, 2);
    await record(step2, "After adjustment", "0.0008", "FG-0031", GAP);
    await expect.poll(() => step2.getByRole("status").innerText()).toMatch(/waiting to send.*503/);
    const ids = await queuedIds(p);
    expect(ids).toHaveLength(1);
    // No tap needed: the queue tries again after 2 s, then 4 s.
    await expect
      .poll(() => p.getByTestId("queue-status").innerText(), { timeout: 30_000 })
      .toMatch(/Every reading is stored on the server/);
    expect(refusedSends).toBe(2);
    const stored = await storedReadings(p);
    expect(stored.filter((r) => r.clientId === ids[0])).toHaveLength(1);
    await ctx.unrouteAll();
    await p.close();
  });

  it("fits the tablet and the desktop: checklist and compare pages never scroll sideways", async () => {
    const p = await openChecklist();
    for (const [w, h] of [
      [820, 1180],
      [1440, 900],
    ] as const) {
      await p.setViewportSize({ width: w, height: h });
      for (const page of ["checklist", "compare"]) {
        await p.goto(`${jobPath}/${page}`);
        await p.waitForLoadState("load");
        expect(await scrollsSideways(p), `${page} at ${w}×${h}`).toBe(false);
        await p.screenshot({ path: screenshotPath(`tablet-${page}-${w}`), fullPage: true });
      }
    }
    await p.close();
  });
});
