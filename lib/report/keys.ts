/** The server's report-signing key, created on first start in REPORT_KEY_DIR (outside the database). */
import "server-only";
import path from "node:path";
import { env } from "@/lib/env";
import { loadOrCreateSigningKey, type SigningKey } from "./signing";

let cached: SigningKey | undefined;

export function getSigningKey(): SigningKey {
  cached ??= loadOrCreateSigningKey(
    path.resolve(/*turbopackIgnore: true*/ process.cwd(), env.REPORT_KEY_DIR),
  );
  return cached;
}
