// Bad input from the outside probe, through the real route handlers and the real database:
// a NUL byte in a test-part cell (was 500), garbage multipart to /api/verify (was 500), a chunked
// body past the limit (was read whole), over-long cells and over-wide files (were stored), and a
// dataset page that drew every row (42 MB of HTML).
// OWASP ASVS v4.0.3: 5.1.4 (structured data validated), 12.1.1 (files the app cannot process
// refused), 13.1.5 (requests with unexpected content types rejected), 7.4.1 (no fault as a 500).
import { sql } from "drizzle-orm";
import { renderToStaticMarkup } from "react-dom/server";
import { beforeAll, describe, expect, it, vi } from "vitest";
import DatasetPage from "@/app/(app)/jobs/[id]/data/[datasetId]/page";
import { POST as saveViewRoute } from "@/app/api/analyses/[id]/views/route";
import { POST as verifyRoute } from "@/app/api/verify/route";
import { db } from "@/db";
import { fixture, storedState, upload, uploadRoute } from "./dataset-helpers";
import { jobIdByReference, request, signInAs } from "./helpers";

// The page's client parts (the delete button) ask for the router; a server render has none mounted.
vi.mock("next/navigation", async (importOriginal) => ({
  ...(await importOriginal<typeof import("next/navigation")>()),
  useRouter: () => ({ refresh() {}, push() {}, replace() {} }),
}));

const TEST_PART = { kind: "test_part", phase: "post" };
let measuring: string;

beforeAll(async () => {
  measuring = await jobIdByReference("TR-2026-0052");
});

/** A multipart body whose declared boundary never appears properly: what a broken client sends. */
function garbageMultipart(path: string): Request {
  return request(path, {
    method: "POST",
    headers: { "content-type": "multipart/form-data; boundary=XYZ" },
    body: '--XYZ\r\nContent-Disposition: form-data; name="file"; filename="a.pdf"\r\n\r\n%PDF-1.7 no end',
  });
}

/** A body sent in chunks with no Content-Length (Transfer-Encoding: chunked on the wire). */
function chunked(path: string, totalBytes: number, contentType = "application/pdf"): Request {
  const chunk = new Uint8Array(1024 * 1024).fill(0x41);
  let sent = 0;
  const body = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (sent >= totalBytes) return controller.close();
      controller.enqueue(chunk);
      sent += chunk.length;
    },
  });
  return request(path, {
    method: "POST",
    headers: { "content-type": contentType },
    body,
    duplex: "half",
  } as RequestInit);
}

describe("CSV cells and shapes", () => {
  it("a NUL byte in a test-part cell is 422 naming row and column, and nothing is stored", async () => {
    await signInAs("inspector@halvard.example");
    const before = await storedState();
    const text = fixture("test-part-good.csv").toString("utf8").replace("Bore A", "Bore\u0000A");
    const res = await upload(measuring, Buffer.from(text), TEST_PART);
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(body.error.issues[0]).toMatchObject({ row: 2, column: "feature" });
    expect(await storedState()).toEqual(before);
  });

  it("a cell over 1000 characters and a file over 200 columns are 422, nothing stored", async () => {
    await signInAs("inspector@halvard.example");
    const before = await storedState();
    const good = fixture("test-part-good.csv").toString("utf8");
    const long = await upload(measuring, Buffer.from(good.replace("Bore A", "b".repeat(5000))), TEST_PART);
    expect(long.status).toBe(422);
    expect((await long.json()).error.issues[0]).toMatchObject({ row: 2, column: "feature" });
    const wide = await upload(measuring, Buffer.from(`${",".repeat(100_000)}\n1\n`), TEST_PART);
    expect(wide.status).toBe(422);
    expect((await wide.json()).error.message).toMatch(/more than 200 columns/);
    expect(await storedState()).toEqual(before);
  });
});

describe("malformed multipart and unbounded bodies", () => {
  it("garbage multipart to /api/verify is 422 (was 500)", async () => {
    const res = await verifyRoute(garbageMultipart("/api/verify"), undefined);
    expect(res.status).toBe(422);
    expect((await res.json()).error.code).toBe("invalid");
  });

  it("garbage multipart to the dataset upload and the view save is 422", async () => {
    await signInAs("engineer@halvard.example");
    const up = await uploadRoute(garbageMultipart(`/api/jobs/${measuring}/datasets`), {
      params: Promise.resolve({ id: measuring }),
    });
    expect(up.status).toBe(422);
    const [a] = (
      await db.execute<{ id: string }>(sql`select id from analyses where job_id = ${measuring} limit 1`)
    ).rows;
    const save = await saveViewRoute(garbageMultipart(`/api/analyses/${a!.id}/views`), {
      params: Promise.resolve({ id: a!.id }),
    });
    expect(save.status).toBe(422);
  });

  it("a chunked body to /api/verify past 20 MB is 413, raw or multipart, without reading it all", async () => {
    const raw = await verifyRoute(chunked("/api/verify", 40 * 1024 * 1024), undefined);
    expect(raw.status).toBe(413);
    const multi = await verifyRoute(
      chunked("/api/verify", 40 * 1024 * 1024, "multipart/form-data; boundary=XYZ"),
      undefined,
    );
    expect(multi.status).toBe(413);
  });
});

describe("dataset pages", () => {
  it("a test-part dataset of 250 rows shows 100 rows per page with links to the others", async () => {
    await signInAs("inspector@halvard.example");
    const header = "feature,characteristic,nominal,measured,lower_tol,upper_tol,unit";
    const rows = Array.from({ length: 250 }, (_, i) => `bore ${i + 1},diameter,25,25.004,0,0.021,mm`);
    const res = await upload(measuring, Buffer.from([header, ...rows].join("\n")), TEST_PART);
    expect(res.status).toBe(201);
    const { id } = await res.json();
    const render = async (page?: string) =>
      renderToStaticMarkup(
        (await DatasetPage({
          params: Promise.resolve({ id: measuring, datasetId: id }),
          searchParams: Promise.resolve(page ? { page } : {}),
        })) as React.ReactElement,
      );
    const first = await render();
    expect(first).toContain(">bore 1<");
    expect(first).toContain(">bore 100<");
    expect(first).not.toContain(">bore 101<");
    expect(first).toMatch(/Rows 1–100 of 250/);
    const third = await render("3");
    expect(third).toContain(">bore 250<");
    expect(third).not.toContain(">bore 200<");
    // A page number out of range shows the nearest page, not an error.
    expect(await render("99")).toContain(">bore 250<");
  });
});

describe("headers on routes the proxy does not see", () => {
  it("the upload route answers with CSP, frame, referrer and nosniff headers, refused or not", async () => {
    await signInAs("inspector@halvard.example");
    const res = await uploadRoute(garbageMultipart(`/api/jobs/${measuring}/datasets`), {
      params: Promise.resolve({ id: measuring }),
    });
    expect(res.headers.get("content-security-policy")).toContain("frame-ancestors 'none'");
    expect(res.headers.get("x-frame-options")).toBe("DENY");
    expect(res.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    const ok = await upload(measuring, fixture("test-part-good.csv"), TEST_PART);
    expect(ok.status).toBe(201);
    expect(ok.headers.get("x-frame-options")).toBe("DENY");
  });
});
