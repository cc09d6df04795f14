/**
 * Debian's Chromium driven by playwright-core (no downloaded browser). Flags: no sandbox as root,
 * no background networking on a closed network, software WebGL for the 3D view.
 */
import AxeBuilder from "@axe-core/playwright";
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Locator, type Page } from "playwright-core";
import { afterAll, afterEach, beforeAll, expect } from "vitest";
import { CHROMIUM_ARGS } from "./chromium-args";

export const BASE_URL = process.env.E2E_BASE_URL ?? "http://127.0.0.1:3100";
export const DEMO_PASSWORD = "trammel-demo";

/** The two devices every journey runs on: an office desktop and the installer's tablet (portrait). */
export const DESKTOP = { width: 1366, height: 900 };
export const TABLET = { width: 820, height: 1180 };

export async function newContext(viewport = DESKTOP): Promise<BrowserContext> {
  const dir = mkdtempSync(path.join(process.env.TMPDIR ?? tmpdir(), "trammel-chromium-"));
  const ctx = await chromium.launchPersistentContext(dir, {
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: CHROMIUM_ARGS,
    viewport,
    baseURL: BASE_URL,
  });
  // The profile folder goes once the browser has exited (close() waits for that), so repeated
  // runs do not fill the temp folder; a folder that cannot be removed is left, never a failure.
  const close = ctx.close.bind(ctx);
  ctx.close = async (options) => {
    await close(options);
    try {
      rmSync(dir, { recursive: true, force: true, maxRetries: 3 });
    } catch {
      /* left for the next clean checkout */
    }
  };
  return ctx;
}

/**
 * A browser context for a test file, at this viewport: opened before the file's tests and closed
 * after them. The routes a test set (a tablet going offline) are removed after each test, so a
 * failed test never leaves the next one offline. Returns the context.
 */
export function contextForFile(viewport = DESKTOP): () => BrowserContext {
  let ctx: BrowserContext | undefined;
  beforeAll(async () => {
    ctx = await newContext(viewport);
  });
  afterAll(async () => {
    await ctx?.close();
  });
  afterEach(async () => {
    await ctx?.unrouteAll({ behavior: "ignoreErrors" });
  });
  return () => ctx!;
}

/**
 * A new page of the context, signed in as `email` through the sign-in page (the cookies of whoever
 * used the context before cleared), on the jobs list it lands on.
 */
export async function pageAs(ctx: BrowserContext, email: string): Promise<Page> {
  await ctx.clearCookies();
  const p = await ctx.newPage();
  await signIn(p, email);
  await p.waitForURL("**/jobs");
  return p;
}

/** Signs in through the real sign-in page, as a person would. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  if (!new URL(page.url(), "http://x").pathname.startsWith("/login")) await page.goto("/login");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

export function screenshotPath(name: string): string {
  return path.join(process.cwd(), ".data", "screenshots", `${name}.png`);
}

/**
 * Serious or critical WCAG 2 A/AA violations on the page as it is now (axe-core), one line each.
 * Next streams a page's metadata after its body, and a server action's refresh sends it again, so the
 * check first gives the <title> a few seconds to arrive; a page that never gets one is still reported.
 */
export async function seriousViolations(page: Page): Promise<string[]> {
  await page
    .waitForFunction(() => document.title.trim() !== "", undefined, { timeout: 5_000 })
    .catch(() => undefined);
  const result = await new AxeBuilder({ page })
    .withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"])
    .analyze();
  return result.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map(
      (v) =>
        `${v.id} (${v.impact}): ${v.help} — ${v.nodes
          .slice(0, 3)
          .map((n) => n.target.join(" "))
          .join(", ")}`,
    );
}

/** Does the page scroll sideways? (Wide tables scroll inside their own region, never the page.) */
export async function scrollsSideways(page: Page): Promise<boolean> {
  return page.evaluate(() => document.documentElement.scrollWidth > window.innerWidth + 1);
}

/** Pixels of the 3D view's WebGL canvas that differ from its clear colour (#f3f4f6), and a digest of the picture. */
export async function canvasPixels(page: Page): Promise<{ drawn: number; total: number; digest: string }> {
  return page.evaluate(async () => {
    const c = document.querySelector<HTMLCanvasElement>('[data-testid="head-viewer"] canvas');
    if (!c) return { drawn: 0, total: 0, digest: "" };
    const url = c.toDataURL("image/png");
    const img = new Image();
    await new Promise<void>((res, rej) => {
      img.onload = () => res();
      img.onerror = () => rej(new Error("image"));
      img.src = url;
    });
    const off = document.createElement("canvas");
    off.width = img.width;
    off.height = img.height;
    const g = off.getContext("2d")!;
    g.drawImage(img, 0, 0);
    const d = g.getImageData(0, 0, off.width, off.height).data;
    let drawn = 0;
    let h = 0;
    for (let i = 0; i < d.length; i += 4) {
      if (Math.abs(d[i]! - 243) + Math.abs(d[i + 1]! - 244) + Math.abs(d[i + 2]! - 246) > 24) drawn++;
      h = (h * 31 + d[i]! + 7 * d[i + 1]! + 13 * d[i + 2]!) >>> 0;
    }
    return { drawn, total: d.length / 4, digest: `${h}` };
  });
}

/** Waits until the 3D view says it is ready and has drawn something. */
export async function waitForPicture(page: Page): Promise<void> {
  await page.locator('[data-testid="head-viewer"][data-ready="true"]').waitFor({ timeout: 30_000 });
  await expect.poll(async () => (await canvasPixels(page)).drawn, { timeout: 15_000 }).toBeGreaterThan(5000);
}

/** The raw message to this address whose text matches, as delivered to the local SMTP fake the test command runs. */
export async function mailTo(address: string, match: RegExp): Promise<string> {
  const dir = process.env.E2E_MAIL_DIR ?? path.join(process.cwd(), ".data", "test-mail");
  for (let i = 0; i < 60; i++) {
    if (existsSync(dir)) {
      for (const f of readdirSync(dir).filter((x) => x.endsWith(".eml"))) {
        const raw = readFileSync(path.join(dir, f), "utf8");
        if (raw.includes(address) && match.test(raw)) return raw;
      }
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`no e-mail to ${address} matching ${match} in ${dir}`);
}

/** The link to a job's report page in a quoted-printable e-mail. */
export function reportLink(raw: string): string | undefined {
  return raw.replace(/=\r?\n/g, "").match(/https?:\/\/[^\s]+\/jobs\/[0-9a-f-]{36}\/report/)?.[0];
}

/**
 * Journey 3's start: the customer opens the report link in their issue e-mail, is sent to the
 * sign-in page (`atSignIn` may look at it), signs in and lands on the report. Returns that page.
 */
export async function followReportMail(
  ctx: BrowserContext,
  email: string,
  reference: string,
  atSignIn?: (p: Page) => Promise<void>,
): Promise<Page> {
  const link = reportLink(await mailTo(email, new RegExp(`Acceptance report ${reference}`)));
  expect(link, "the e-mail links to the report page").toBeTruthy();
  await ctx.clearCookies();
  const p = await ctx.newPage();
  await p.goto(new URL(link!).pathname);
  await p.waitForURL(/\/login\?callbackUrl=/);
  await atSignIn?.(p);
  await signIn(p, email);
  await p.waitForURL(/\/report$/);
  return p;
}

/**
 * Chooses a visually hidden radio or checkbox whose label is drawn as a tile. Forcing the check
 * skips Playwright's visibility wait, so first wait until the streamed page has revealed it: a
 * section behind a loading skeleton arrives in a hidden container that React swaps in shortly
 * after the load event.
 */
export async function choose(scope: Page | Locator, label: string | RegExp): Promise<void> {
  const input = scope.getByLabel(label);
  await expect
    .poll(() => input.evaluate((el) => el.closest("[hidden]") === null), { timeout: 15_000 })
    .toBe(true);
  await input.check({ force: true });
}

/**
 * Signs an open "parameters approved" form: when the fit has parameters that do not conform, the
 * form names them and the server refuses until the engineer ticks that they were read (the
 * signing button does nothing before, as the box is required). Returns how many were named.
 */
export async function signApproval(page: Page): Promise<number> {
  const sign = page.getByRole("form", { name: "Sign: parameters approved" });
  const named = sign.getByRole("note", { name: "Results that do not conform" }).getByRole("listitem");
  const count = await named.count();
  if (count > 0) await sign.getByRole("checkbox", { name: /I have read/ }).check();
  await sign.getByLabel("Your password").fill(DEMO_PASSWORD);
  await sign.getByRole("button", { name: "Sign the approval" }).click();
  return count;
}
