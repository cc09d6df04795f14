/**
 * The software version printed on reports (ISO/IEC 17025:2017 §7.11.2: software used is
 * identified): package.json's version and, in a built app, the git commit it was built from
 * (next.config.mjs puts it into TRAMMEL_BUILD_COMMIT at build time; empty outside a git checkout).
 */
import pkg from "../package.json" with { type: "json" };
import { GEOMETRY_VERSION } from "@/geometry/version";

export const APP_VERSION: string = pkg.version;

export function softwareVersion(): { version: string; commit: string | null; computation: string } {
  // Not lib/env.ts: Next replaces this literal at build time (next.config.mjs `env`), so the
  // running app reports the commit it was built from rather than whatever its shell has set.
  // eslint-disable-next-line no-restricted-properties
  const commit = process.env.TRAMMEL_BUILD_COMMIT?.trim();
  return { version: APP_VERSION, commit: commit || null, computation: GEOMETRY_VERSION };
}
