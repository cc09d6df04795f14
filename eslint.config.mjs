// Lint rules that guard the architecture. The important one: geometry/ stays pure, so the
// numbers the product signs can be tested and re-run anywhere.
import tseslint from "typescript-eslint";

export default tseslint.config(
  { ignores: [".next/**", ".next-*/**", "node_modules/**", ".data/**", "next-env.d.ts"] },
  ...tseslint.configs.recommended,
  {
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
  {
    files: ["geometry/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: ["next", "next/*", "react", "react-dom", "react/*"],
              message: "geometry/ is pure: no framework code.",
            },
            {
              group: [
                "@/db",
                "@/db/*",
                "@/lib",
                "@/lib/*",
                "@/app/*",
                "@/components/*",
                "drizzle-orm",
                "drizzle-orm/*",
                "pg",
              ],
              message: "geometry/ is pure: no app or database code.",
            },
            {
              group: ["zod", "fs", "node:*", "path"],
              message: "geometry/ is pure: no validation library, file system or Node built-ins.",
            },
          ],
        },
      ],
    },
  },
);
