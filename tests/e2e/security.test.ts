// Journeys through the real pages for two of the probe's findings: the open redirect after
// sign-in (OWASP ASVS v4.0.3 5.1.5) and getting back in with a forgotten password through a
// single-use e-mailed link (2.5.1, 2.5.2, 2.5.4). The reset flow asks for one of the three reset
// e-mails an account may get per hour, so more than three runs an hour against one database fail.
import { describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { BASE_URL, DEMO_PASSWORD, signIn, contextForFile } from "./browser";

const ctx = contextForFile();

const MAIL_DIR = process.env.E2E_MAIL_DIR ?? "";
const mailFiles = () => new Set(existsSync(MAIL_DIR) ? readdirSync(MAIL_DIR) : []);

/** Like mailTo, but only a message that arrived after `before` was listed (reruns keep old mail). */
async function newMailTo(address: string, match: RegExp, before: Set<string>): Promise<string> {
  for (let i = 0; i < 60; i++) {
    for (const f of [...mailFiles()].filter((x) => x.endsWith(".eml") && !before.has(x))) {
      const raw = readFileSync(path.join(MAIL_DIR, f), "utf8");
      if (raw.includes(address) && match.test(raw)) return raw;
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`no new e-mail to ${address} matching ${match}`);
}

async function fresh(): Promise<Page> {
  await ctx().clearCookies();
  return ctx().newPage();
}

describe("after sign-in the browser stays on the app", () => {
  it("a backslash callbackUrl lands on the jobs list, through the form and when already signed in", async () => {
    const p = await fresh();
    await p.goto("/login?callbackUrl=/%5Cevil.example");
    await signIn(p, "inspector@halvard.example");
    await p.waitForURL("**/jobs");
    expect(new URL(p.url()).host).toBe(new URL(BASE_URL).host);
    for (const evil of ["/%5Cevil.example", "/%09/evil.example", "/%5C/evil.example"]) {
      await p.goto(`/login?callbackUrl=${evil}`);
      await p.waitForURL("**/jobs");
      expect(new URL(p.url()).host).toBe(new URL(BASE_URL).host);
    }
    await p.close();
  });
});

describe("forgot password", () => {
  it("asks for a link, gets it by e-mail, sets a password once and signs in with it", async () => {
    const email = "buyer@tollan.example";
    const p = await fresh();
    await p.goto("/login");
    await p.getByRole("link", { name: "Forgot your password?" }).click();
    await p.waitForURL("**/forgot-password");
    const before = mailFiles();
    await p.getByLabel("E-mail").fill(email);
    await p.getByRole("button", { name: "Send me a reset link" }).click();
    await expect.poll(() => p.getByRole("status").innerText()).toMatch(/If that address belongs/);
    const raw = (await newMailTo(email, /Reset your Trammel password/, before))
      .replace(/=\r?\n/g, "")
      .replace(/=3D/g, "=");
    const link = raw.match(/https?:\/\/\S+\/set-password\?token=[A-Za-z0-9_-]+/)?.[0];
    expect(link).toBeDefined();
    const target = new URL(link!).pathname + new URL(link!).search;
    await p.goto(target);
    // The demo password again, so the other browser tests still sign in as this customer.
    await p.getByLabel("New password (at least 10 characters)").fill(DEMO_PASSWORD);
    await p.getByLabel("Repeat it").fill(DEMO_PASSWORD);
    await p.getByRole("button", { name: "Set password" }).click();
    await expect.poll(() => p.getByRole("status").innerText()).toMatch(/Your password is set/);
    // The same link a second time is refused.
    await p.goto(target);
    await p.getByLabel("New password (at least 10 characters)").fill("another password 123");
    await p.getByLabel("Repeat it").fill("another password 123");
    await p.getByRole("button", { name: "Set password" }).click();
    await p.getByText(/expired or has already been used/).waitFor();
    await signIn(p, email);
    await p.waitForURL("**/jobs");
    await p.close();
  });
});
