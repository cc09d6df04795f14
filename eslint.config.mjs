// Lint rules that guard the architecture. geometry/ stays pure, so the numbers the product signs
// can be tested and re-run anywhere; pages and components read data only through db/queries;
// settings are read only in lib/env.ts. tests/unit/lint-rules.test.ts plants a violation of each.
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import nextPlugin from "@next/eslint-plugin-next";
import prettier from "eslint-config-prettier/flat";

/** The database client, the schema and the query builder: only db/queries may use them directly. */
const databaseInternals = {
  regex: "^(@/db(/index|/schema)?|drizzle-orm(/.*)?)$",
  message: "Pages and components read and write through db/queries, never the client, schema or drizzle.",
};

export default tseslint.config(
  { ignores: [".next/**", ".next-*/**", "node_modules/**", ".data/**", "next-env.d.ts"] },
  ...tseslint.configs.recommended,
  reactHooks.configs.flat.recommended,
  nextPlugin.configs["core-web-vitals"],
  {
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      // The DOM's window globals (status, name, …) type-check anywhere, so a lost local of the same
      // name compiles and fails only at run time on the server. Refuse the common ones.
      "no-restricted-globals": [
        "error",
        ...["status", "name", "length", "event", "origin", "parent", "top", "closed"].map((name) => ({
          name,
          message: `'${name}' here is the browser's window.${name}; declare a local or use window.${name}.`,
        })),
      ],
    },
  },
  {
    // Settings come from the validated env module; config files, scripts and tests are outside the app.
    files: ["**/*.{ts,tsx,mjs,js}"],
    ignores: [
      "lib/env.ts",
      "*.config.{ts,mjs,js}",
      "lib/scripts/**",
      "lib/cli/**",
      "tests/**",
      "db/audit-verify.ts",
    ],
    rules: {
      "no-restricted-properties": [
        "error",
        { object: "process", property: "env", message: "Read settings through lib/env.ts." },
      ],
    },
  },
  {
    // Pages, layouts and their private pieces (route handlers and actions call db/queries too).
    files: ["app/**/*.{ts,tsx}"],
    ignores: ["app/**/route.ts", "app/**/actions.ts"],
    rules: { "no-restricted-imports": ["error", { patterns: [databaseInternals] }] },
  },
  {
    files: ["components/**/*.{ts,tsx}"],
    rules: {
      // A component longer than this does more than one job: split it along its seams.
      "max-lines": ["error", { max: 250 }],
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              regex: "^(@/db(/.*)?|drizzle-orm(/.*)?)$",
              message:
                "Components take their types from lib/domain and their data from props, never from db/.",
            },
          ],
        },
      ],
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
  prettier,
);
