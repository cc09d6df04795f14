/**
 * The software version printed on reports (ISO/IEC 17025:2017 §7.11.2: software used is
 * identified): package.json's version and, in a built app, the git commit it was built from
 * (lib/env.ts buildCommit, set by next.config.mjs at build time; null outside a git checkout).
 */
import pkg from "../package.json" with { type: "json" };
import { GEOMETRY_VERSION } from "@/geometry/version";
import { buildCommit } from "@/lib/env";

export const APP_VERSION: string = pkg.version;

export function softwareVersion(): { version: string; commit: string | null; computation: string } {
  return { version: APP_VERSION, commit: buildCommit, computation: GEOMETRY_VERSION };
}
