// Accessibility scan (axe-core, WCAG 2 A/AA rules) of every page each role reaches, on desktop
// and tablet viewports. Fails on serious or critical violations.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { newContext, seriousViolations, pageAs } from "./browser";

let desktop: BrowserContext;
let tablet: BrowserContext;

beforeAll(async () => {
  desktop = await newContext({ width: 1366, height: 900 });
  tablet = await newContext({ width: 820, height: 1180 });
});
afterAll(async () => {
  await desktop?.close();
  await tablet?.close();
});

/** The job pages under /jobs/{id} reachable from the tabs, for one job. */
async function jobPages(page: Page, reference: string): Promise<string[]> {
  await page.goto("/jobs");
  const href = await page.getByRole("link", { name: reference }).getAttribute("href");
  await page.goto(href!);
  const tabs = await page
    .getByRole("navigation", { name: "Job sections" })
    .getByRole("link")
    .evaluateAll((els) => els.map((e) => (e as HTMLAnchorElement).getAttribute("href")!));
  return tabs;
}

const PEOPLE = [
  { email: "admin@halvard.example", extra: ["/registers"] },
  { email: "installer@halvard.example", extra: [] },
  { email: "engineer@halvard.example", extra: ["/registers/heads"] },
  { email: "buyer@marlowcreek.example", extra: [] },
];

for (const [name, get] of [
  ["desktop", () => desktop],
  ["tablet", () => tablet],
] as const) {
  describe(`accessibility on ${name}`, () => {
    it("public pages: sign-in and report verification", async () => {
      const ctx = get();
      await ctx.clearCookies();
      const p = await ctx.newPage();
      for (const path of ["/login", "/verify"]) {
        await p.goto(path);
        expect(await seriousViolations(p), path).toEqual([]);
      }
      await p.close();
    });

    // The tablet is the installer's device on the shop floor; desktops serve everyone.
    for (const person of name === "tablet" ? PEOPLE.filter((x) => x.email.startsWith("installer")) : PEOPLE) {
      it(`${person.email}: jobs, every job section and their own pages`, async () => {
        const ctx = get();
        const p = await pageAs(ctx, person.email);
        expect(await seriousViolations(p), "/jobs").toEqual([]);
        const pages = [
          ...(await jobPages(p, person.email.includes("installer") ? "TR-2026-0052" : "TR-2026-0041")),
          ...person.extra,
        ];
        for (const path of pages) {
          await p.goto(path);
          await p.waitForLoadState("load");
          expect(await seriousViolations(p), path).toEqual([]);
        }
        await p.close();
      });
    }
  });
}
