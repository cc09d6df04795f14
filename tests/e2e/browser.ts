/**
 * Debian's Chromium driven by playwright-core (no downloaded browser). Flags: no sandbox as root,
 * no background networking on a closed network, software WebGL for the 3D view.
 */
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";

export const BASE_URL = process.env.E2E_BASE_URL ?? "http://127.0.0.1:3100";
export const DEMO_PASSWORD = "trammel-demo";

export const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--disable-dev-shm-usage",
  "--use-angle=swiftshader",
  "--enable-unsafe-swiftshader",
];

export async function newContext(viewport = { width: 1366, height: 900 }): Promise<BrowserContext> {
  const dir = mkdtempSync(path.join(process.env.TMPDIR ?? tmpdir(), "trammel-chromium-"));
  return chromium.launchPersistentContext(dir, {
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: CHROMIUM_ARGS,
    viewport,
    baseURL: BASE_URL,
  });
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
