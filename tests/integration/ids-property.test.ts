// Every route and page with an id in its path, fed random strings that are not UUIDs: the answer
// is 404 (JSON `not_found` from the API, Next's not-found page from pages), never a 500.
// OWASP ASVS v4.0.3 5.1.3 (input validated against an allow list at the trusted boundary) and
// 7.4.1 (a generic message on an unexpected error, never a fault surfacing as 500).
import { readdirSync, statSync } from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { isUuid } from "@/lib/domain/uuid";
import { request, signInAs } from "./helpers";

const ROOT = path.resolve(import.meta.dirname, "../..");

function files(dir: string, name: RegExp): string[] {
  return readdirSync(dir).flatMap((entry) => {
    const p = path.join(dir, entry);
    return statSync(p).isDirectory() ? files(p, name) : name.test(entry) ? [p] : [];
  });
}

/** Path segments that hold ids: `[id]`, `[reportId]`, `[datasetId]` (not `[...nextauth]`). */
const ID_SEGMENT = /\[(id|\w+Id)\]/g;
const withIds = (file: string) =>
  (path.relative(ROOT, file).match(ID_SEGMENT) ?? []).map((s) => s.slice(1, -1));

const ROUTES = files(path.join(ROOT, "app/api"), /^route\.ts$/).filter((f) => withIds(f).length > 0);
const PAGES = files(path.join(ROOT, "app"), /^(page|layout)\.tsx$/).filter((f) => withIds(f).length > 0);

/** Strings a probe would try: anything, the loose `[0-9a-f-]{36}` shape (36 dashes…), near-misses. */
const notUuid = fc
  .oneof(
    fc.string({ maxLength: 80 }),
    fc.stringMatching(/^[0-9a-f-]{36}$/),
    fc.uuid().map((u) => `${u}x`),
    fc.uuid().map((u) => u.replace(/-/g, "")),
    fc.uuid().map((u) => ` ${u}`),
    fc.constantFrom("-".repeat(36), "00000000-0000-0000-0000-00000000000g", "' or 1=1 --", "%00", "..", ""),
  )
  .filter((s) => !isUuid(s));

describe("ids that are not UUIDs are 404 at every boundary", () => {
  it("finds the routes and pages with ids (the list cannot silently become empty)", () => {
    expect(ROUTES.length).toBeGreaterThanOrEqual(15);
    expect(PAGES.length).toBeGreaterThanOrEqual(10);
    expect(ROUTES.map((f) => path.relative(ROOT, f))).toContain("app/api/verify/[reportId]/route.ts");
  });

  for (const file of ROUTES) {
    const rel = path.relative(ROOT, file);
    it(`${rel}: every method answers 404 JSON`, async () => {
      await signInAs("admin@halvard.example");
      const mod = (await import(/* @vite-ignore */ file)) as Record<string, unknown>;
      const methods = ["GET", "POST", "PUT", "PATCH", "DELETE"].filter((m) => typeof mod[m] === "function");
      expect(methods.length).toBeGreaterThan(0);
      await fc.assert(
        fc.asyncProperty(notUuid, fc.constantFrom(...methods), async (bad, method) => {
          const params = Object.fromEntries(withIds(file).map((name) => [name, bad]));
          const handler = mod[method] as (req: Request, ctx: unknown) => Promise<Response>;
          const res = await handler(request("/api/x", { method }), { params: Promise.resolve(params) });
          expect(res.status).toBe(404);
          expect((await res.json()).error.code).toBe("not_found");
        }),
        { numRuns: 40 },
      );
    });
  }

  for (const file of PAGES) {
    const rel = path.relative(ROOT, file);
    it(`${rel}: renders Next's not-found page`, async () => {
      await signInAs("admin@halvard.example");
      const mod = (await import(/* @vite-ignore */ file)) as {
        default: (props: unknown) => Promise<unknown>;
      };
      await fc.assert(
        fc.asyncProperty(notUuid, async (bad) => {
          const params = Object.fromEntries(withIds(file).map((name) => [name, bad]));
          const err = await mod
            .default({ params: Promise.resolve(params), searchParams: Promise.resolve({}), children: null })
            .then(
              () => null,
              (e: unknown) => e,
            );
          // next/navigation's notFound() throws an error whose digest ends in ";404".
          expect(String((err as { digest?: string } | null)?.digest)).toMatch(/;404$/);
        }),
        { numRuns: 25 },
      );
    });
  }
});
