// Every kind of step on the tablet (820×1180) in Debian's Chromium against the built app. The
// office opens a job with the demo after-collision procedure (one step of each kind) and assigns
// the installer; the installer, OFFLINE, records a yes/no check, readings at four clock positions
// point by point (the TIR shown live), a value for the record and a photo; back online, each is
// stored exactly once and the photo is shown with its reading. Offline, the photo waiting on the
// tablet is drawn from its own file, and once stored its thumbnail is kept by the service worker
// and drawn after an offline reload. "Offline" is every request of the context aborted, as in
// offline.test.ts.
import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { screenshotPath, scrollsSideways, TABLET, pageAs, contextForFile } from "./browser";
import { attachPhoto, enterRunOutPoints, expectPhotoDrawn, offline, openStep } from "./steps";

const tablet = contextForFile(TABLET);
let jobId = "";
const TITLE = `Tablet kinds ${Date.now().toString(36)}`;

async function queuedCount(p: Page): Promise<string> {
  return (await p.getByTestId("queue-count").count()) ? p.getByTestId("queue-count").innerText() : "0";
}

describe("every kind of step on the tablet", () => {
  it("the office opens a job with the after-collision procedure for the installer", async () => {
    const admin = await pageAs(tablet(), "admin@halvard.example");
    await admin.goto("/registers/procedures");
    const card = admin.locator("section, article, div").filter({
      has: admin.getByRole("heading", { name: /Two-axis head check after a collision/ }),
    });
    const open = card.last().getByText("Open a job with this procedure");
    await open.click();
    const form = card
      .last()
      .locator("form")
      .filter({ has: admin.getByRole("button", { name: "Open the job" }) });
    await form.getByLabel("Title", { exact: true }).fill(TITLE);
    await form.getByLabel("Host machine").selectOption({ index: 1 });
    const machine = (await form.getByLabel("Host machine").locator("option:checked").innerText()).split(
      " — ",
    )[0]!;
    const head = form.getByLabel("Head", { exact: true });
    const heads = (await head.locator("option").allInnerTexts()).map((t) => t.trim());
    const mountedHere = heads.find((t) => t.endsWith(` on ${machine}`))!;
    const mountedElsewhere = heads.find((t) => t.includes(" on ") && !t.endsWith(` on ${machine}`))!;
    await form.getByLabel("Kind", { exact: true }).selectOption("after_crash");
    // The demo installer (invented name in the seed).
    await form.getByLabel("Installer", { exact: true }).selectOption({ label: "Iver Sandvik" });
    // A head mounted on another machine is refused with the reason, as on "New job"; nothing is opened.
    await head.selectOption({ label: mountedElsewhere });
    await form.getByRole("button", { name: "Open the job" }).click();
    await expect.poll(() => form.innerText()).toMatch(/mounted on another machine/);
    await head.selectOption({ label: mountedHere });
    await form.getByRole("button", { name: "Open the job" }).click();
    await expect
      .poll(
        async () => {
          const res = await admin.request.get("/api/jobs");
          const jobs = (await res.json()).jobs as { id: string; title: string }[];
          return jobs.find((j) => j.title === TITLE)?.id ?? "";
        },
        { timeout: 15_000 },
      )
      .not.toBe("");
    const jobs = (await (await admin.request.get("/api/jobs")).json()).jobs as {
      id: string;
      title: string;
    }[];
    jobId = jobs.find((j) => j.title === TITLE)!.id;
    await admin.close();
  });

  it("records a check, four points, a record value and a photo offline; online, each is stored once", async () => {
    expect(jobId).not.toBe("");
    const p = await pageAs(tablet(), "installer@halvard.example");
    await p.goto(`/jobs/${jobId}/checklist`);
    await expect.poll(() => p.getByRole("heading", { name: "Procedure checklist" }).isVisible()).toBe(true);
    await p.getByTestId("offline-ready").waitFor({ timeout: 30_000 });
    await tablet().route("**/*", offline);

    // Step 1: a yes/no check with two large buttons.
    const s1 = await openStep(p, 1);
    await s1.getByText("Yes", { exact: true }).click();
    await s1.screenshot({ path: screenshotPath("tablet-kinds-check-820") });
    await s1.getByRole("button", { name: "Save answer" }).click();
    await expect.poll(() => queuedCount(p)).toBe("1");

    // Step 2: the collar at 12, 3, 6 and 9 o'clock, point by point, the TIR live and judged.
    const s2 = await openStep(p, 2);
    await enterRunOutPoints(s2, 2);
    await expect.poll(() => s2.getByTestId("live-2").innerText()).toMatch(/Pass/);
    await p.screenshot({ path: screenshotPath("tablet-kinds-points-820"), fullPage: false });
    await s2.getByRole("button", { name: "Save reading" }).click();
    await expect.poll(() => queuedCount(p)).toBe("2");
    // A photo of the dial at the high point, taken with the reading (kept as a blob offline).
    await attachPhoto(s2, 2, 800, 600);
    await expect.poll(() => queuedCount(p)).toBe("3");

    // Step 3: the collar bolt torque, for the record, in its own unit.
    const s3 = await openStep(p, 3);
    await s3.getByLabel(/Collar bolt torque applied \(N·m\)/).fill("85");
    await s3.getByRole("button", { name: "Save reading" }).click();
    await expect.poll(() => queuedCount(p)).toBe("4");
    await expect.poll(() => s3.locator('tr[data-queued="waiting"]').innerText()).toMatch(/85 N·m/);
    // Reloaded without signal, the photo still on the tablet is drawn from its own file.
    await p.reload();
    await expect.poll(() => queuedCount(p), { timeout: 10_000 }).toBe("4");
    const kept = await openStep(p, 2);
    await expectPhotoDrawn(kept.getByTestId("queued-photos-2"));

    // Back online: everything goes in order, each once.
    await tablet().unroute("**/*", offline);
    await p.getByRole("button", { name: "Send now" }).click();
    await expect
      .poll(() => p.getByTestId("queue-status").innerText(), { timeout: 30_000 })
      .toMatch(/Every reading is stored on the server/);
    const readings = (await (await p.request.get(`/api/jobs/${jobId}/readings`)).json()).readings as Array<{
      id: string;
      kind: string;
      value: number;
      unit: string | null;
      textValue: string | null;
      inputs: { points?: Record<string, number> } | null;
    }>;
    expect(readings.map((r) => r.kind).sort()).toEqual(["check", "multi_point", "record"]);
    const mp = readings.find((r) => r.kind === "multi_point")!;
    expect(mp.value).toBeCloseTo(0.0005 * 25.4, 10); // in → mm, 1 in = 25.4 mm (NIST SP 811)
    expect(mp.inputs?.points).toEqual({ "12": 0, "3": 0.0002, "6": 0.0004, "9": -0.0001 });
    expect(readings.find((r) => r.kind === "check")).toMatchObject({ value: 1, textValue: "yes" });
    expect(readings.find((r) => r.kind === "record")).toMatchObject({ value: 85, unit: "N·m" });
    const photos = (await (await p.request.get(`/api/jobs/${jobId}/photos`)).json()).photos as Array<{
      readingId: string | null;
      width: number;
    }>;
    expect(photos).toHaveLength(1);
    expect(photos[0]).toMatchObject({ readingId: mp.id, width: 800 });

    // The photo is shown with the reading, and each kind reads as itself.
    await p.reload();
    const again = await openStep(p, 2);
    await expect.poll(() => again.getByTestId("photos-2").locator("img").count()).toBe(1);
    await expectPhotoDrawn(again.getByTestId("photos-2"));
    expect(await again.getByTestId("points").innerText()).toMatch(
      /12: 0 · 3: 0\.0002 · 6: 0\.0004 · 9: −0\.0001 in/,
    );
    // The thumbnail is kept on the tablet: offline again, the reloaded checklist still draws it.
    const thumb = (await again.getByTestId("photos-2").locator("img").getAttribute("src"))!;
    expect(thumb).toMatch(/^\/api\/photos\/[0-9a-f-]{36}\/thumb$/);
    await expect
      .poll(() => p.evaluate(async (u) => Boolean(await caches.match(u, { ignoreVary: true })), thumb))
      .toBe(true);
    await tablet().route("**/*", offline);
    await p.reload();
    const cached = await openStep(p, 2);
    await expectPhotoDrawn(cached.getByTestId("photos-2"), 10_000);
    await tablet().unroute("**/*", offline);
    const one = await openStep(p, 1);
    expect(await one.locator("tbody tr").first().innerText()).toMatch(/Yes/);
    expect(await one.locator("tbody tr").first().innerText()).not.toMatch(/mm|in\b/);
    await openStep(p, 2);
    await p.screenshot({ path: screenshotPath("tablet-kinds-820"), fullPage: true });
    expect(await scrollsSideways(p)).toBe(false);
    await p.setViewportSize({ width: 1440, height: 900 });
    await p.screenshot({ path: screenshotPath("tablet-kinds-1440"), fullPage: true });
    expect(await scrollsSideways(p)).toBe(false);
    await p.setViewportSize(TABLET);
    await p.close();
  });
});
