// Per-file setup: the session is whatever the test says it is (next-auth's cookie handling is
// exercised by the browser tests); everything after the session — the user's role and company
// read from the database, the access checks, the queries — is the real code.
import { afterAll, beforeAll, vi } from "vitest";

const state = globalThis as unknown as { __testSessionUserId?: string | null; __testSignedInAt?: number };

// The cookie decoding itself is checked in tests/unit/session-token.test.ts against next-auth's encoder.
vi.mock("@/lib/auth/session-token", async (importOriginal) => {
  const actual = await importOriginal<typeof import("@/lib/auth/session-token")>();
  return {
    ...actual,
    readSessionIdentity: vi.fn(async () =>
      state.__testSessionUserId
        ? { id: state.__testSessionUserId, signedInAt: state.__testSignedInAt ?? Date.now() }
        : null,
    ),
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
