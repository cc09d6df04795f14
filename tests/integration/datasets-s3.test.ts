// The S3 driver of lib/storage against s3rver started in-process (free port, temporary folder):
// put/get/delete by key through the AWS SDK, and an upload through the route stored there and
// downloaded byte-identical.
import { createHash } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import S3rver from "s3rver";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { setStorageForTests, type ObjectStorage } from "@/lib/storage";
import { createS3Storage } from "@/lib/storage/s3";
import { fileApi, fixture, upload } from "./dataset-helpers";
import { jobIdByReference, signInAs } from "./helpers";

let server: S3rver;
let dir: string;
let storage: ObjectStorage;

beforeAll(async () => {
  dir = mkdtempSync(path.join(process.env.TMPDIR ?? tmpdir(), "trammel-s3-"));
  server = new S3rver({
    port: 0,
    address: "127.0.0.1",
    directory: dir,
    silent: true,
    configureBuckets: [{ name: "trammel-test", configs: [] }],
  });
  const { port } = await server.run();
  storage = createS3Storage({
    endpoint: `http://127.0.0.1:${port}`,
    bucket: "trammel-test",
    region: "us-east-1",
    accessKeyId: "S3RVER",
    secretAccessKey: "S3RVER",
  });
  setStorageForTests(storage);
});

afterAll(async () => {
  setStorageForTests(null);
  await server?.close();
  rmSync(dir, { recursive: true, force: true });
});

describe("S3 driver (s3rver)", () => {
  it("puts, gets and deletes by key; a missing key is null", async () => {
    const data = Buffer.from([0xef, 0xbb, 0xbf, 0x61, 0x00, 0xff, 0x0d, 0x0a]);
    await storage.put("datasets/test/one", data, { contentType: "text/csv", sha256: "x" });
    expect(Buffer.compare((await storage.get("datasets/test/one"))!, data)).toBe(0);
    await storage.delete("datasets/test/one");
    expect(await storage.get("datasets/test/one")).toBeNull();
    await storage.delete("datasets/test/never-there");
  });

  it("an upload's original goes to the bucket, not the database, and downloads byte-identical", async () => {
    await signInAs("inspector@halvard.example");
    const job = await jobIdByReference("TR-2026-0052");
    const bytes = fixture("sphere-bom.csv");
    const res = await upload(
      job,
      bytes,
      { kind: "sphere_probe", phase: "post", units: "mm" },
      "../../evil\r\nname.csv",
    );
    expect(res.status).toBe(201);
    const { id, sha256 } = await res.json();
    expect(sha256).toBe(createHash("sha256").update(bytes).digest("hex"));
    const row = await db.execute<{ storage_key: string; original_filename: string }>(
      sql`select storage_key, original_filename from datasets where id = ${id}`,
    );
    const key = row.rows[0]!.storage_key;
    // The key is ours (job uuid / random uuid), never built from the file name.
    expect(key).toMatch(new RegExp(`^datasets/${job}/[0-9a-f-]{36}$`));
    // FormData percent-encodes the line break in the name; the path part is dropped.
    expect(row.rows[0]!.original_filename).toBe("evil%0D%0Aname.csv");
    expect((await db.execute(sql`select 1 from storage_objects where key = ${key}`)).rows).toHaveLength(0);
    expect(Buffer.compare((await storage.get(key))!, bytes)).toBe(0);
    const file = await fileApi(id);
    expect(Buffer.compare(Buffer.from(await file.arrayBuffer()), bytes)).toBe(0);
    expect(file.headers.get("content-disposition")).toBe(
      `attachment; filename="evil%0D%0Aname.csv"; filename*=UTF-8''evil%250D%250Aname.csv`,
    );
  });
});
