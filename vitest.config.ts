// Four projects: unit (pure code, no services), integration (real PostgreSQL started by the
// test command; DATABASE_URL points at it), e2e (Debian's Chromium against the built app at
// E2E_BASE_URL), and faults (the built app, two instances, PostgreSQL restarted). tests/run-all.sh
// starts what each needs.
import { defineConfig } from "vitest/config";

const alias = {
  "@": import.meta.dirname,
  "server-only": `${import.meta.dirname}/tests/stubs/server-only.ts`,
};

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: { name: "unit", include: ["tests/unit/**/*.test.ts"], environment: "node" },
      },
      {
        resolve: { alias },
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
          globalSetup: ["tests/integration/global-setup.ts"],
          setupFiles: ["tests/integration/setup.ts"],
        },
      },
      {
        resolve: { alias },
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          environment: "node",
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 60_000,
          // A server action and the page's refresh take more than vitest's 1 s default on a busy
          // two-core machine; a poll still fails, with its message, when the page never gets there.
          expect: { poll: { timeout: 10_000 } },
        },
      },
      {
        // Faults and scale-out against the built app (tests/faults/harness.ts lists what it needs).
        resolve: { alias },
        test: {
          name: "faults",
          include: ["tests/faults/**/*.test.ts"],
          environment: "node",
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
