// Journey 1 of README.md ("Journeys") up to the evaluation table, in Debian's Chromium against the built
// app: the inspector opens a job's Data page, picks a bad test-part CSV and sees its row errors
// before anything is sent, then a good one: preview, upload with progress, and the per-feature
// pass/fail table with the job's decision rule stated; then signs the job as inspected.
import { readFileSync } from "node:fs";
import { beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { screenshotPath, signIn, choose, pageAs, contextForFile } from "./browser";
import { decisionsOf, testPartEvaluation, jobSection, expectNotFound } from "./steps";
import { GOOD_TEST_PART_DECISIONS, GOOD_TEST_PART_TOTALS } from "../fixtures/test-part-decisions";

const ctx = contextForFile();
let page: Page;

beforeAll(async () => {
  page = await ctx().newPage();
});

const BAD = Buffer.from(
  [
    "feature,characteristic,nominal,measured,lower_tol,upper_tol,unit",
    "Bore A,diameter,20.000,20.0018,-0.005,0.005,mm",
    "Bore B,diameter,20.000,twenty,-0.005,0.005,mm",
    "Face 1,flatness,0,0.0035,,0.004",
    "",
  ].join("\n"),
);

describe("inspector: test-part data to a judged table", () => {
  it("signs in and opens the Data section of job TR-2026-0052", async () => {
    await signIn(page, "inspector@halvard.example");
    await page.waitForURL("**/jobs");
    await page.getByRole("link", { name: "TR-2026-0052" }).click();
    await page.waitForURL(/\/jobs\/[0-9a-f-]{36}$/);
    await jobSection(page, "Data");
    await page.waitForURL(/\/data$/);
    await expect
      .poll(() => page.getByRole("heading", { name: "Add measurement data" }).isVisible())
      .toBe(true);
  });

  it("a bad file shows its row errors in the browser and cannot be sent", async () => {
    await choose(page, "Test-part measurements");
    await page
      .getByLabel("CSV file")
      .setInputFiles({ name: "part-with-typos.csv", mimeType: "text/csv", buffer: BAD });
    const errors = page.getByTestId("row-errors");
    await errors.waitFor();
    const text = await errors.innerText();
    expect(text).toContain("'twenty' is not a number");
    expect(text).toContain("has 6 fields, the header has 7");
    expect(await page.getByRole("button", { name: "Upload and check" }).isDisabled()).toBe(true);
    await page.screenshot({ path: screenshotPath("datasets-row-errors"), fullPage: true });
  });

  it("a good file shows the preview, uploads with progress and opens the evaluation", async () => {
    await page.getByLabel("CSV file").setInputFiles({
      name: "test part 7.csv",
      mimeType: "text/csv",
      buffer: readFileSync("tests/fixtures/uploads/test-part-good.csv"),
    });
    await page.getByTestId("chosen-file").filter({ hasText: "test part 7.csv" }).waitFor();
    const preview = page.getByRole("table", { name: "Preview of the first rows" });
    await preview.waitFor();
    expect(await preview.locator("tbody tr").count()).toBe(6);
    expect(await page.getByTestId("row-errors").count()).toBe(0);
    await page.getByLabel(/Expanded uncertainty U/).fill("0.002");
    await page.screenshot({ path: screenshotPath("datasets-preview"), fullPage: true });
    await page.getByRole("button", { name: "Upload and check" }).click();
    await page.waitForURL(/\/data\/[0-9a-f-]{36}$/);
    await testPartEvaluation(page).waitFor();
    const rule = await page.getByTestId("decision-rule").innerText();
    expect(rule).toContain("guarded acceptance");
    expect(rule).toContain("ISO 14253-1");
    // The decisions worked by hand from ISO 14253-1 guarded acceptance, U = 0.002 mm (the working is
    // beside the values), as the upload route gives them too.
    const rows = await decisionsOf(testPartEvaluation(page));
    expect(rows).toEqual(GOOD_TEST_PART_DECISIONS);
    expect(await page.getByTestId("total-pass").innerText()).toBe(String(GOOD_TEST_PART_TOTALS.pass));
    expect(await page.getByTestId("total-fail").innerText()).toBe(String(GOOD_TEST_PART_TOTALS.fail));
    expect(await page.getByTestId("total-undecided").innerText()).toBe(
      String(GOOD_TEST_PART_TOTALS.undecided),
    );
    await page.screenshot({ path: screenshotPath("datasets-evaluation"), fullPage: true });
  });

  it("the original downloads byte-identical from the dataset page", async () => {
    const href = await page.getByRole("link", { name: "Download the original" }).getAttribute("href");
    const res = await page.request.get(href!);
    expect(res.status()).toBe(200);
    expect(Buffer.compare(await res.body(), readFileSync("tests/fixtures/uploads/test-part-good.csv"))).toBe(
      0,
    );
    expect(res.headers()["x-content-type-options"]).toBe("nosniff");
  });
});

describe("inspector: signs the job as inspected", () => {
  it("a wrong password is refused, then the signature is listed with name, role and UTC time", async () => {
    await page.goto(page.url().replace(/\/data\/[0-9a-f-]{36}$/, "/report"));
    const form = page.getByRole("form", { name: "Sign as inspected" });
    expect(await form.innerText()).toContain(
      "You confirm you inspected the recorded readings and measurements",
    );
    await form.getByLabel("Your password").fill("not-my-password");
    await form.getByRole("button", { name: "Sign" }).click();
    await expect.poll(() => form.getByRole("alert").innerText()).toContain("password");
    await form.getByLabel("Your password").fill("trammel-demo");
    await form.getByRole("button", { name: "Sign" }).click();
    const sigs = page.getByRole("complementary", { name: "Signatures" });
    await expect
      .poll(() => sigs.innerText(), { timeout: 15_000 })
      .toMatch(/Inspected\s+Ines Okafor — Inspector\s+\d{4}-\d{2}-\d{2} \d{2}:\d{2}.*UTC/);
    // Signed once: the form is gone for this inspector.
    await expect.poll(() => page.getByRole("form", { name: "Sign as inspected" }).count()).toBe(0);
    await page.goto(page.url().replace(/\/report$/, "/data"));
  });
});

describe("column mapping chosen by hand", () => {
  it("unmatched columns are listed, matched by hand, and the file is stored unchanged", async () => {
    const csv = Buffer.from("rot,tilt,X,Y,Z\n0,0,812.5,1460.25,-305\n90,45,812.501,1460.249,-305.002\n");
    await page.goto(page.url().replace(/\/data\/[0-9a-f-]{36}$/, "/data"));
    await choose(page, "Sphere probing");
    await choose(page, "inch");
    await page.getByLabel("CSV file").setInputFiles({ name: "probe.csv", mimeType: "text/csv", buffer: csv });
    const errors = page.getByTestId("row-errors");
    await errors.waitFor();
    expect(await errors.innerText()).toContain("the required column 'primary_deg' is not mapped");
    await page.getByLabel("File column for primary_deg").selectOption({ label: "rot" });
    await page.getByLabel("File column for secondary_deg").selectOption({ label: "tilt" });
    await expect.poll(() => page.getByTestId("row-errors").count()).toBe(0);
    await page.screenshot({ path: screenshotPath("datasets-mapping"), fullPage: true });
    await page.getByRole("button", { name: "Upload and check" }).click();
    await page.waitForURL(/\/data\/[0-9a-f-]{36}$/);
    // Inch coordinates stored in mm: 812.5 in × 25.4 = 20637.5 mm (1 in = 25.4 mm exactly, NIST SP 811).
    await expect.poll(() => page.getByText("20637.5000").count()).toBeGreaterThan(0);
    const href = await page.getByRole("link", { name: "Download the original" }).getAttribute("href");
    expect(Buffer.compare(await (await page.request.get(href!)).body(), csv)).toBe(0);
  });
});

describe("customer: their own company's data only", () => {
  it("the Marlow Creek buyer lists and opens the seeded test-part data of TR-2026-0041 but may not upload", async () => {
    const p = await pageAs(ctx(), "buyer@marlowcreek.example");
    const href = await p.getByRole("link", { name: "TR-2026-0041" }).getAttribute("href");
    await p.goto(`${href}/data`);
    await p.getByRole("link", { name: "Test-part measurements" }).first().click();
    await p.waitForURL(/\/data\/[0-9a-f-]{36}$/);
    await testPartEvaluation(p).waitFor();
    expect(await p.getByTestId("decision-rule").innerText()).toContain("simple acceptance");
    const dataUrl = p.url();
    await p.goto(`${href}/data`);
    expect(await p.getByRole("heading", { name: "Add measurement data" }).count()).toBe(0);
    await p.screenshot({ path: screenshotPath("datasets-customer-list"), fullPage: true });
    await p.close();

    await expectNotFound(ctx(), "buyer@tollan.example", dataUrl, "Bore A");
  });
});
