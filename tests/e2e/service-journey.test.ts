// A service company's job from the procedure to the report, in Debian's Chromium against the built
// app. The administrator (1440×900) builds a procedure with a multi-point step, a yes/no step and
// a photo-required step, opens a job with it and assigns the installer; the installer gets the
// assignment e-mail (delivered through the outbox to the local SMTP fake), follows its link on the
// tablet (820×1180), records the four clock-position readings and the check, and attaches a photo;
// the engineer opens the job's report page and its draft preview, whose text (read back with
// pdftotext) prints the points behind the run-out and lists the photo in its appendix by SHA-256.
import { describe, expect, it } from "vitest";
import { contextForFile, mailTo, pageAs, screenshotPath, scrollsSideways, signIn, TABLET } from "./browser";
import {
  addBuilderStep,
  attachPhoto,
  buildCheckStep,
  builderStep,
  buildPhotoRecordStep,
  buildRunOutStep,
  enterRunOutPoints,
  expectPhotoDrawn,
  openStep,
  startInstallationJob,
} from "./steps";
import { pdfText } from "../pdf-tools";

const OFFICE = { width: 1440, height: 900 };
const TAG = Date.now().toString(36);
const PROCEDURE = `Head on its collar ${TAG}`;
const TITLE = `Head installation, bay 4 (${TAG})`;
const office = contextForFile(OFFICE);
const tablet = contextForFile(TABLET);
let jobId = "";
let reference = "";

describe("a service job from the procedure to the report", () => {
  it("the administrator builds the procedure", async () => {
    const p = await pageAs(office(), "admin@halvard.example");
    await p.goto("/registers/procedures/new");
    await p.getByLabel("Name").fill(PROCEDURE);
    await p.getByLabel("Installation").check();

    await buildRunOutStep(builderStep(p, 1));

    const s2 = await addBuilderStep(p, 2);
    await buildCheckStep(s2, "Motor plate home on its dowels");
    await s2.getByLabel("Where the limit comes from").selectOption("maker_manual");
    await s2.getByLabel("Source note").fill("Head maker's manual, mounting section.");
    await s2.getByLabel("Safety note").fill("Lock out the axis drives before hands go near the motor plate.");

    await buildPhotoRecordStep(await addBuilderStep(p, 3), "Shim stack under the collar", "mm");

    await p.getByRole("button", { name: "Create procedure" }).click();
    await p.waitForURL(/\/registers\/procedures\/[0-9a-f-]{36}$/);
    await expect.poll(() => p.getByRole("heading", { level: 1 }).innerText()).toContain(PROCEDURE);
    await expect.poll(() => p.locator("table").first().locator("tbody tr").count()).toBe(3);
    await p.screenshot({ path: screenshotPath("journey-procedure-1440"), fullPage: true });
    await p.close();
  });

  it("opens a job with it and assigns the installer", async () => {
    const p = await office().newPage();
    await p.goto("/jobs");
    await startInstallationJob(p, TITLE);
    await p.getByLabel("Procedure", { exact: true }).selectOption({ label: `${PROCEDURE} v1` });
    await p.getByLabel("Date", { exact: true }).fill("2027-09-06");
    await p.getByLabel("Time (24 h)").fill("08:00");
    await p.getByLabel("Time zone").fill("Europe/Berlin");
    await p.getByLabel("Installer", { exact: true }).selectOption({ label: "Iver Sandvik" });
    await p.getByRole("button", { name: "Open the job" }).click();
    await p.waitForURL(/\/jobs\/[0-9a-f-]{36}$/);
    jobId = p.url().split("/").pop()!;
    reference = (await p.locator("nav[aria-label=Breadcrumb] .num").innerText()).trim();
    expect(reference).toMatch(/^TR-\d{4}-\d{4}$/);
    await expect.poll(() => p.locator("main").innerText()).toMatch(/Iver Sandvik/);
    await p.screenshot({ path: screenshotPath("journey-job-1440"), fullPage: true });
    await p.close();
  });

  it("the installer follows the assignment e-mail and records the readings, the check and a photo on the tablet", async () => {
    expect(reference).not.toBe("");
    const raw = (
      await mailTo("installer@halvard.example", new RegExp(`${reference} is assigned to you`))
    ).replace(/=\r?\n/g, "");
    // 08:00 in Berlin in September is CEST, UTC+2 (IANA tzdata).
    expect(raw).toMatch(/2027-09-06 08:00 GMT\+2/);
    const link = raw.match(/https?:\/\/\S+\/jobs\/[0-9a-f-]{36}/)?.[0];
    expect(link, "the e-mail links to the job").toBeTruthy();
    expect(new URL(link!).pathname).toBe(`/jobs/${jobId}`);

    const p = await tablet().newPage();
    await p.goto(new URL(link!).pathname);
    await p.waitForURL(/\/login\?callbackUrl=/);
    await signIn(p, "installer@halvard.example");
    await p.waitForURL(`**/jobs/${jobId}`);
    await p.goto(`/jobs/${jobId}/checklist`);
    await expect.poll(() => p.getByRole("heading", { name: "Procedure checklist" }).isVisible()).toBe(true);

    // Step 1: the collar at 12, 3, 6 and 9 o'clock; TIR = largest − smallest = 0.0004 − (−0.0001)
    // = 0.0005 in (ASME B89.3.4 definition of run-out), on the limit, so it passes.
    const s1 = await openStep(p, 1);
    await enterRunOutPoints(s1, 1);
    await expect.poll(() => s1.getByTestId("live-1").innerText()).toMatch(/Pass/);
    await p.screenshot({ path: screenshotPath("journey-points-820") });
    await s1.getByRole("button", { name: "Save reading" }).click();

    // Step 2: the yes/no check.
    const s2 = await openStep(p, 2);
    await s2.getByText("Yes", { exact: true }).click();
    await s2.getByRole("button", { name: "Save answer" }).click();

    // Step 3: the shim stack for the record, and the photo the procedure asks for.
    const s3 = await openStep(p, 3);
    await s3.getByLabel(/Shim stack under the collar \(mm\)/).fill("0.15");
    await s3.getByRole("button", { name: "Save reading" }).click();
    await expect
      .poll(async () => {
        const r = await p.request.get(`/api/jobs/${jobId}/readings`);
        return ((await r.json()).readings as unknown[]).length;
      })
      .toBe(3);
    await attachPhoto(s3, 3, 640, 480);
    await expect
      .poll(async () => {
        const r = await p.request.get(`/api/jobs/${jobId}/photos`);
        return ((await r.json()).photos as unknown[]).length;
      })
      .toBe(1);
    await p.reload();
    const shown = await openStep(p, 3);
    await expectPhotoDrawn(shown.getByTestId("photos-3"));
    expect(await scrollsSideways(p)).toBe(false);
    await p.screenshot({ path: screenshotPath("journey-checklist-820"), fullPage: true });
    await p.close();
  });

  it("the job's report prints the points behind the run-out and lists the photo in its appendix", async () => {
    expect(jobId).not.toBe("");
    const p = await pageAs(office(), "engineer@halvard.example");
    await p.goto(`/jobs/${jobId}/report`);
    const draft = p.locator(`a[href="/api/jobs/${jobId}/report/draft"]`);
    await expect.poll(() => draft.count()).toBe(1);
    await p.screenshot({ path: screenshotPath("journey-report-1440"), fullPage: true });
    const res = await p.request.get(`/api/jobs/${jobId}/report/draft`);
    expect(res.status()).toBe(200);
    expect(res.headers()["content-type"]).toBe("application/pdf");
    const text = pdfText(await res.body(), true);
    expect(text).toContain(reference);
    expect(text).toContain("Collar run-out");
    // The derived value (0.0005 in = 0.0127 mm, 1 in = 25.4 mm exactly, NIST SP 811, printed to the
    // instrument's 0.001 mm), and under the step each point as the installer entered it.
    expect(text).toContain("0.013 mm TIR");
    expect(text).toContain("Before: 12: 0 · 3: 0.0002 · 6: 0.0004 · 9: −0.0001 in");
    // The check prints as Yes (its title wraps in its narrow cell).
    expect(text).toMatch(/Yes Motor plate home on its/);
    expect(text).toMatch(/Appendix: photos kept with the record/);
    const photo = (
      (await (await p.request.get(`/api/jobs/${jobId}/photos`)).json()).photos as { sha256: string }[]
    )[0]!;
    expect(text).toMatch(/Step 3 Shim stack under the collar, before adjustment/);
    expect(text).toContain(photo.sha256);
    await p.close();
  });
});
