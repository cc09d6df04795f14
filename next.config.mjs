// Next.js configuration. Kept small: the app runs on one machine with its own PostgreSQL.
import { execFileSync } from "node:child_process";

/** The commit the app is built from, printed on reports (lib/version.ts); empty outside a git checkout. */
function buildCommit() {
  if (process.env.TRAMMEL_BUILD_COMMIT) return process.env.TRAMMEL_BUILD_COMMIT;
  try {
    return execFileSync("git", ["rev-parse", "HEAD"], { stdio: ["ignore", "pipe", "ignore"] })
      .toString()
      .trim();
  } catch {
    return "";
  }
}

/** @type {import('next').NextConfig} */
const nextConfig = {
  poweredByHeader: false,
  // The test command type-checks the whole project first (tsc --noEmit); its build skips the repeat.
  typescript: { ignoreBuildErrors: process.env.NEXT_SKIP_TYPECHECK === "1" },
  // The test command builds into its own folder so a running demo keeps its build.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  reactStrictMode: true,
  env: { TRAMMEL_BUILD_COMMIT: buildCommit() },
  // fonts/ is read at run time by the PDF renderer.
  outputFileTracingIncludes: { "/api/**": ["./fonts/**"] },
};
export default nextConfig;
