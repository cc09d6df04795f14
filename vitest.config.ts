// Two projects: unit (pure code, no services) and integration (real PostgreSQL started by
// the test command; DATABASE_URL points at it).
import { defineConfig } from "vitest/config";

const alias = { "@": import.meta.dirname };

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
          setupFiles: ["tests/integration/setup.ts"],
        },
      },
    ],
  },
});
