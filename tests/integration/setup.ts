// Per-file setup: the session is whatever the test says it is (next-auth's cookie handling is
// exercised by the browser tests); everything after the session — the user's role and company
// read from the database, the access checks, the queries — is the real code.
import { afterAll, beforeAll, vi } from "vitest";

const state = globalThis as unknown as { __testSessionUserId?: string | null; __testSignedInAt?: number };

vi.mock("next-auth", async (importOriginal) => {
  const actual = await importOriginal<typeof import("next-auth")>();
  return {
    ...actual,
    getServerSession: vi.fn(async () => (state.__testSessionUserId ? { user: { id: state.__testSessionUserId, signedInAt: state.__testSignedInAt ?? Date.now() } } : null)),
  };
});

beforeAll(async () => {
  const { seed } = await import("@/db/seed");
  await seed();
});

afterAll(async () => {
  const { pool } = await import("@/db");
  await pool.end();
});
