/**
 * Report signatures: Ed25519 (node:crypto) over the canonical JSON of a manifest that binds the
 * report id and revision to the SHA-256 of the exact PDF bytes, the signer, the meaning of the
 * signature and the UTC time. The key pair lives outside the database (a folder of PEM files,
 * created on first use), so a database dump alone cannot forge a signature.
 */
import {
  createHash,
  createPrivateKey,
  createPublicKey,
  generateKeyPairSync,
  randomBytes,
  sign,
  verify,
  type KeyObject,
} from "node:crypto";
import { existsSync, linkSync, mkdirSync, readFileSync, unlinkSync, writeFileSync } from "node:fs";
import path from "node:path";
import { canonicalJson } from "@/lib/canonical-json";

import type { SignatureMeaningKey } from "@/lib/domain/signatures";

/** What a signature means (21 CFR 11.50: the meaning is part of every signature). */
export type SignatureMeaning = SignatureMeaningKey;

/**
 * What one signature binds. Signatures given before issue (performed, inspected) bind the job
 * and a hash of its recorded state; the approval at issue and the customer's acceptance or
 * rejection bind the issued revision and the SHA-256 of its exact PDF bytes.
 */
export interface SignatureManifest {
  jobId: string;
  jobReference: string;
  reportId: string | null;
  revision: number | null;
  pdfSha256: string | null;
  /** SHA-256 of the canonical JSON of the job's recorded state at signing (pre-issue signatures). */
  stateSha256: string | null;
  signer: { id: string; name: string; role: string; email: string };
  meaning: SignatureMeaning;
  /** "parameters approved": the fit approved, and its parameters judged FAIL or undecided that the signer confirmed. */
  analysis?: {
    id: string;
    inputSha256: string;
    geometryVersion: string;
    nonConforming: ReadonlyArray<{ key: string; decision: string }>;
  };
  /** ISO 8601 in UTC, e.g. 2026-12-02T07:15:00.000Z. */
  signedAtUtc: string;
  keyId: string;
}

export interface SigningKey {
  keyId: string;
  privateKey: KeyObject;
  publicKey: KeyObject;
  publicKeyPem: string;
}

export function sha256Hex(bytes: Uint8Array | string): string {
  return createHash("sha256").update(bytes).digest("hex");
}

/** Key id: the first 16 hex digits of the SHA-256 of the public key's SPKI DER encoding. */
export function keyIdOf(publicKey: KeyObject): string {
  return sha256Hex(publicKey.export({ type: "spki", format: "der" })).slice(0, 16);
}

/** Loads the key pair from `dir`, creating it on first use (private key file mode 0600). */
export function loadOrCreateSigningKey(dir: string): SigningKey {
  const privPath = path.join(dir, "report-signing-key.pem");
  const pubPath = path.join(dir, "report-signing-key.pub.pem");
  if (!existsSync(privPath)) {
    mkdirSync(dir, { recursive: true, mode: 0o700 });
    const { privateKey } = generateKeyPairSync("ed25519");
    // Written whole to a file of its own, then linked into place: link() fails if the name exists,
    // so when several instances start together on an empty folder exactly one key wins and the
    // others read it, never a half-written file.
    const tmp = path.join(dir, `.report-signing-key.${process.pid}.${randomBytes(6).toString("hex")}.pem`);
    writeFileSync(tmp, privateKey.export({ type: "pkcs8", format: "pem" }), { mode: 0o600, flag: "wx" });
    try {
      linkSync(tmp, privPath);
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== "EEXIST") throw e;
    } finally {
      unlinkSync(tmp);
    }
  }
  const privateKey = createPrivateKey(readFileSync(privPath));
  const publicKey = createPublicKey(privateKey);
  const publicKeyPem = publicKey.export({ type: "spki", format: "pem" }).toString();
  if (!existsSync(pubPath) || readFileSync(pubPath, "utf8") !== publicKeyPem)
    writeFileSync(pubPath, publicKeyPem, { mode: 0o644 });
  return { keyId: keyIdOf(publicKey), privateKey, publicKey, publicKeyPem };
}

/** The exact bytes that are signed. */
export function manifestBytes(m: SignatureManifest): Buffer {
  return Buffer.from(canonicalJson(m), "utf8");
}

/** Ed25519 signature (base64url). The algorithm argument must be null for Ed25519. */
export function signManifest(m: SignatureManifest, key: SigningKey): string {
  if (m.keyId !== key.keyId) throw new Error("manifest names another key");
  return sign(null, manifestBytes(m), key.privateKey).toString("base64url");
}

export function verifyManifest(m: SignatureManifest, signature: string, publicKey: KeyObject): boolean {
  try {
    if (keyIdOf(publicKey) !== m.keyId) return false;
    return verify(null, manifestBytes(m), publicKey, Buffer.from(signature, "base64url"));
  } catch {
    return false;
  }
}

/**
 * Verifies PDF bytes against a stored signature: the bytes must hash to the manifest's SHA-256
 * and the signature must verify over the manifest. Returns the reason when it does not.
 */
export function verifySignedPdf(
  pdf: Uint8Array,
  m: SignatureManifest,
  signature: string,
  publicKey: KeyObject,
): { ok: true } | { ok: false; reason: string } {
  if (!m.pdfSha256 || sha256Hex(pdf) !== m.pdfSha256)
    return {
      ok: false,
      reason: "The file's SHA-256 does not match the signed report: it was altered or is another file.",
    };
  if (!verifyManifest(m, signature, publicKey))
    return { ok: false, reason: "The signature does not verify against the published key." };
  return { ok: true };
}
