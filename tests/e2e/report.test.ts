// Journey 3 of the product brief in Debian's Chromium: the customer reads the issued report
// online, downloads the signed PDF and accepts it with a counter-signature; the engineer sees
// the acceptance; anyone holding the PDF verifies it on the public page, and a tampered copy fails.
import { readFileSync, writeFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { followReportMail, screenshotPath, pageAs, contextForFile } from "./browser";
import { pdfText } from "../pdf-tools";
import { jobSection, downloadSignedPdf, openJobSection, verifyAuthentic } from "./steps";

const ctx = contextForFile();
let pdfPath = "";

describe("journey 3: the customer accepts the signed report", () => {
  it("gets the e-mail, follows its link, reads the report online and downloads the signed PDF", async () => {
    const p = await followReportMail(ctx(), "buyer@marlowcreek.example", "TR-2026-0041");
    const article = p.getByRole("article", { name: "Acceptance report" });
    await expect.poll(() => article.innerText()).toContain("END OF REPORT");
    expect(await article.innerText()).toContain("Marlow Creek Aerostructures");
    expect(await article.innerText()).toMatch(/Approved and issued[\s\S]*Emil Haraldsen[\s\S]*UTC/);
    pdfPath = await downloadSignedPdf(p, "downloaded-report");
    expect(readFileSync(pdfPath).subarray(0, 5).toString()).toBe("%PDF-");
    // The page and the signed file say the same: the same figures with the same captions, and
    // each parameter's limit and result (pdftotext, poppler's reader, for the file).
    const fileText = pdfText(pdfPath, true);
    const captions = (await article.locator("figcaption").allInnerTexts()).map((t) =>
      t.replace(/\s+/g, " ").trim(),
    );
    expect(captions.length, "the online report has figures").toBeGreaterThanOrEqual(2);
    for (const c of captions) expect(fileText, c).toContain(c.slice(0, 60));
    expect(fileText.match(/Figure \d+\./g)?.length).toBe(captions.length);
    const paramRows = await article
      .getByRole("table")
      .filter({ hasText: "ISO 230-1" })
      .locator("tbody tr")
      .allInnerTexts();
    expect(paramRows.length).toBe(10);
    for (const r of paramRows) {
      const [name, symbol, , , tolerance] = r.split("\t").map((x) => x.trim());
      expect(fileText).toContain(symbol!);
      expect(fileText).toContain(name!.slice(0, 20));
      if (tolerance && tolerance !== "—") expect(fileText).toContain(tolerance);
    }
    await p.screenshot({ path: screenshotPath("report-customer"), fullPage: true });
    await p.close();
  });

  it("refuses to sign without the password, then accepts with it", async () => {
    const p = await pageAs(ctx(), "buyer@marlowcreek.example");
    await openJobSection(p, "TR-2026-0041", "Report");
    const accept = p.getByRole("form", { name: "Accept the report" });
    await accept.getByLabel("Your password").fill("not-my-password");
    await accept.getByRole("button", { name: "Accept" }).click();
    await expect.poll(() => accept.getByRole("alert").innerText()).toContain("password");
    await accept.getByLabel("Your password").fill("trammel-demo");
    await accept.getByRole("button", { name: "Accept" }).click();
    await expect
      .poll(() => p.getByRole("complementary", { name: "Signatures" }).innerText(), { timeout: 15_000 })
      .toContain("Accepted by the customer");
    await expect.poll(() => p.locator("main").innerText()).toContain("Accepted");
    await p.close();
  });

  it("the engineer sees the acceptance", async () => {
    const p = await pageAs(ctx(), "engineer@halvard.example");
    const row = p.locator("tr", { hasText: "TR-2026-0041" });
    await expect.poll(() => row.innerText()).toContain("Accepted");
    await row.getByRole("link", { name: "TR-2026-0041" }).click();
    await jobSection(p, "Report");
    const sigs = await p.getByRole("complementary", { name: "Signatures" }).innerText();
    expect(sigs).toMatch(/Accepted by the customer[\s\S]*Morgan Tate — Customer[\s\S]*UTC/);
    await p.close();
  });

  it("anyone holding the PDF verifies it on the public page; a changed byte fails", async () => {
    // Only a checked file is vouched for, and the page names that file by its SHA-256.
    const { page: p, result } = await verifyAuthentic(ctx(), pdfPath);
    expect(await result.innerText()).toMatch(/TR-2026-0041, revision 1/);
    await p.screenshot({ path: screenshotPath("verify-authentic"), fullPage: true });
    const bytes = readFileSync(pdfPath);
    const mid = Math.floor(bytes.length / 2);
    bytes[mid] = bytes[mid]! ^ 0x20;
    const tampered = pdfPath.replace(/\.pdf$/, "-tampered.pdf");
    writeFileSync(tampered, bytes);
    await p.getByLabel("Report PDF").setInputFiles(tampered);
    await expect.poll(() => result.innerText()).toContain("Not verified");
    // The QR code's page states what the service holds and vouches for no file by itself; the
    // customer's comments are not part of the public answer.
    const text = pdfText(pdfPath);
    const id = /\/verify\/([0-9a-f-]{36})/.exec(text.replace(/\s+/g, ""))![1]!;
    await p.goto(`/verify/${id}`);
    const held = p.getByTestId("verification-result");
    await held.waitFor();
    expect(await held.innerText()).toContain("Record held by the service. No file has been checked.");
    expect(await held.innerText()).not.toContain("Authentic");
    expect(await held.innerText()).toContain("Accepted by the customer");
    await p.close();
  });
});
