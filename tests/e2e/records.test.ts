// The report's records in Debian's Chromium on the built app (ISO/IEC 17025:2017 §7.8):
//  - the administrator keeps the issuer's details printed on every report (§7.8.2.1 b); other
//    staff have no such page;
//  - the engineer sees what stands before issue on the seeded job TR-2026-0052 and previews the
//    draft, which already carries the record details, saying "not recorded" where the job holds
//    nothing (§7.8.2.1), watermarked DRAFT and unsigned;
//  - the customer downloads the demo's issued report, which says the results relate only to the
//    item tested (§7.8.2.1 k), and the public page vouches for that very file by its SHA-256.
// Resolving blockers with a deviation and issuing are walked end to end in journeys-tablet.test.ts.
import { writeFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import {
  screenshotPath,
  scrollsSideways,
  seriousViolations,
  signIn,
  TABLET,
  pageAs,
  contextForFile,
} from "./browser";
import { expectPhrases, pdfText } from "../pdf-tools";
import { downloadSignedPdf, openJobSection, verifyAuthentic } from "./steps";

const ctx = contextForFile({ width: 1440, height: 900 });

describe("records on the report", () => {
  it("the administrator keeps the issuer's details; the engineer has no such page", async () => {
    const p = await pageAs(ctx(), "admin@halvard.example");
    await p.goto("/registers");
    await p
      .getByRole("navigation", { name: "Registers" })
      .getByRole("link", { name: "Issuer details" })
      .click();
    await p.waitForURL("**/registers/settings");
    const name = p.getByLabel("Company name");
    expect(await name.inputValue()).toBe("Halvard Field Service");
    const phone = p.getByLabel("Contact phone");
    const before = await phone.inputValue();
    await phone.fill("+44 1632 960 418");
    await p.getByRole("button", { name: "Save issuer details" }).click();
    await expect
      .poll(() => p.getByRole("status").allInnerTexts())
      .toContainEqual(expect.stringContaining("Reports issued from now on print these details"));
    await p.reload();
    expect(await p.getByLabel("Contact phone").inputValue()).toBe("+44 1632 960 418");
    expect(await seriousViolations(p)).toEqual([]);
    await p.screenshot({ path: screenshotPath("records-issuer-settings"), fullPage: true });
    await p.setViewportSize(TABLET);
    expect(await scrollsSideways(p)).toBe(false);
    await p.screenshot({ path: screenshotPath("records-issuer-settings-tablet"), fullPage: true });
    await p.getByLabel("Contact phone").fill(before);
    await p.getByRole("button", { name: "Save issuer details" }).click();
    await expect
      .poll(() => p.getByRole("status").allInnerTexts())
      .toContainEqual(expect.stringContaining("Reports issued from now on"));
    await p.close();

    const e = await pageAs(ctx(), "engineer@halvard.example");
    const res = await e.goto("/registers/settings");
    expect(res?.status()).toBe(404);
    await e.close();
  });

  it("the engineer sees the blockers and previews the draft with its record details", async () => {
    await ctx().clearCookies();
    const p = await ctx().newPage();
    await p.setViewportSize({ width: 1440, height: 900 });
    await signIn(p, "engineer@halvard.example");
    await p.waitForURL("**/jobs");
    await openJobSection(p, "TR-2026-0052", "Report");
    const blockers = p.getByRole("list", { name: "Before issue" });
    await blockers.waitFor();
    const codes = await blockers
      .locator("li")
      .evaluateAll((lis) => lis.map((li) => li.getAttribute("data-code")));
    expect(codes.length).toBeGreaterThan(0);
    expect(codes).not.toContain("issuer_details_missing");
    await p.screenshot({ path: screenshotPath("records-blockers"), fullPage: true });
    const href = await p.getByRole("link", { name: /Preview the draft/ }).getAttribute("href");
    const draft = await p.request.get(href!);
    expect(draft.status()).toBe(200);
    const file = screenshotPath("records-draft").replace(/\.png$/, ".pdf");
    writeFileSync(file, await draft.body());
    const text = pdfText(file, true);
    expectPhrases(text, [
      "DRAFT",
      "2a Record details and traceability",
      // pdftotext reads the label column and the value column of a block apart, so each is checked.
      "Halvard Field Service, 7 Tinker's Yard",
      "Date of issue",
      "not issued (draft)",
      // The seeded re-verification job holds no order reference nor customer contact: said, not left out.
      "Order reference",
      "not recorded",
      "The results relate only to the item tested",
    ]);
    expect(text).not.toContain("Approved and issued");
    await p.close();
  });

  it("the customer downloads the issued report and the public page vouches for that file", async () => {
    const p = await pageAs(ctx(), "buyer@marlowcreek.example");
    await openJobSection(p, "TR-2026-0041", "Report");
    const article = p.getByRole("article", { name: "Acceptance report" });
    await expect.poll(() => article.innerText()).toContain("2a Record details and traceability");
    expect(await article.innerText()).toContain("PO 4500-7781 (invented)");
    const file = await downloadSignedPdf(p, "records-issued");
    expect(pdfText(file, true)).toContain("The results relate only to the item tested");
    await p.close();

    const { page: v } = await verifyAuthentic(ctx(), file);
    await v.screenshot({ path: screenshotPath("records-verify"), fullPage: true });
    await v.close();
  });
});
