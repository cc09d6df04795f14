// Report signing: Ed25519 through node:crypto, checked against the RFC 8032 §7.1 test vectors
// (an outside reference), then the tamper cases the product must catch.
import { createPrivateKey, createPublicKey, sign as edSign } from "node:crypto";
import { execFile } from "node:child_process";
import { mkdtempSync, readdirSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  keyIdOf,
  loadOrCreateSigningKey,
  sha256Hex,
  signManifest,
  verifyManifest,
  verifySignedPdf,
  type SignatureManifest,
} from "@/lib/report/signing";

const PKCS8_ED25519_PREFIX = "302e020100300506032b657004220420";
const SPKI_ED25519_PREFIX = "302a300506032b6570032100";

describe("Ed25519 (RFC 8032 §7.1)", () => {
  it("TEST 1: empty message gives the published signature and public key", () => {
    const secret = "9d61b19deffd5a60ba844af492ec2cc44449c5697b326919703bac031cae7f60";
    const key = createPrivateKey({
      key: Buffer.from(PKCS8_ED25519_PREFIX + secret, "hex"),
      format: "der",
      type: "pkcs8",
    });
    const pub = createPublicKey(key).export({ type: "spki", format: "der" }).toString("hex");
    expect(pub).toBe(
      SPKI_ED25519_PREFIX + "d75a980182b10ab7d54bfed3c964073a0ee172f3daa62325af021a68f707511a",
    );
    expect(edSign(null, Buffer.alloc(0), key).toString("hex")).toBe(
      "e5564300c360ac729086e2cc806e828a84877f1eb8e5d974d873e065224901555fb8821590a33bacc61e39701cf9b46bd25bf5f0595bbe24655141438e7a100b",
    );
  });
});

describe("SHA-256 (FIPS 180-4 example)", () => {
  it('"abc" hashes to the published digest', () => {
    expect(sha256Hex("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });
});

const dir = mkdtempSync(path.join(process.env.TMPDIR ?? tmpdir(), "trammel-keys-"));
const key = loadOrCreateSigningKey(dir);
const pdf = Buffer.from("%PDF-1.4\n% a stand-in for rendered bytes\n%%EOF\n");
const manifest: SignatureManifest = {
  jobId: "7d9e1b2c-1111-4222-8333-444455556666",
  jobReference: "TR-2026-0041",
  stateSha256: null,
  reportId: "3f1c9a4e-1111-4222-8333-444455556666",
  revision: 1,
  pdfSha256: sha256Hex(pdf),
  signer: { id: "u-1", name: "Emil Haraldsen", role: "engineer", email: "engineer@halvard.example" },
  meaning: "approved",
  signedAtUtc: "2026-12-02T07:15:00.000Z",
  keyId: key.keyId,
};
const signature = signManifest(manifest, key);

describe("signing keys", () => {
  it("are created once, kept private, and reloaded identically", () => {
    const again = loadOrCreateSigningKey(dir);
    expect(again.keyId).toBe(key.keyId);
    expect(statSync(path.join(dir, "report-signing-key.pem")).mode & 0o077).toBe(0);
    expect(keyIdOf(again.publicKey)).toMatch(/^[0-9a-f]{16}$/);
  });

  it("several processes starting together on an empty folder end up with one and the same key", async () => {
    const shared = mkdtempSync(path.join(process.env.TMPDIR ?? tmpdir(), "trammel-keys-race-"));
    const script = path.join(shared, "..", `start-${path.basename(shared)}.ts`);
    writeFileSync(
      script,
      `import { loadOrCreateSigningKey } from ${JSON.stringify(path.resolve("lib/report/signing.ts"))};\nprocess.stdout.write(loadOrCreateSigningKey(${JSON.stringify(shared)}).keyId);\n`,
    );
    const run = () =>
      new Promise<string>((resolve, reject) =>
        execFile("npx", ["tsx", "--tsconfig", "tsconfig.json", script], { cwd: process.cwd() }, (err, out) =>
          err ? reject(err) : resolve(out.trim()),
        ),
      );
    const ids = await Promise.all([run(), run(), run(), run()]);
    expect(new Set(ids).size).toBe(1);
    expect(ids[0]).toBe(keyIdOf(loadOrCreateSigningKey(shared).publicKey));
    // Nothing half-made is left beside the key.
    expect(readdirSync(shared).sort()).toEqual(["report-signing-key.pem", "report-signing-key.pub.pem"]);
  }, 60_000);
});

describe("signed report verification", () => {
  it("verifies the untouched PDF", () => {
    expect(verifySignedPdf(pdf, manifest, signature, key.publicKey)).toEqual({ ok: true });
  });

  it("fails when any single byte of the PDF is flipped (property)", () => {
    fc.assert(
      fc.property(fc.nat({ max: pdf.length - 1 }), fc.integer({ min: 1, max: 255 }), (i, x) => {
        const copy = Buffer.from(pdf);
        copy[i] = copy[i]! ^ x;
        expect(verifySignedPdf(copy, manifest, signature, key.publicKey).ok).toBe(false);
      }),
    );
  });

  it("fails when the PDF is truncated or appended to", () => {
    expect(verifySignedPdf(pdf.subarray(0, pdf.length - 1), manifest, signature, key.publicKey).ok).toBe(
      false,
    );
    expect(
      verifySignedPdf(Buffer.concat([pdf, Buffer.from("\n")]), manifest, signature, key.publicKey).ok,
    ).toBe(false);
  });

  it("fails when any manifest field is edited", () => {
    const edits: Array<Partial<SignatureManifest>> = [
      { reportId: "3f1c9a4e-1111-4222-8333-444455556667" },
      { jobId: "7d9e1b2c-1111-4222-8333-444455556667" },
      { jobReference: "TR-2026-0042" },
      { stateSha256: sha256Hex("state") },
      { revision: 2 },
      { pdfSha256: sha256Hex("other") },
      { signer: { ...manifest.signer, name: "Someone Else" } },
      { signer: { ...manifest.signer, role: "admin" } },
      { meaning: "inspected" },
      { signedAtUtc: "2026-12-02T07:15:01.000Z" },
    ];
    for (const e of edits)
      expect(verifyManifest({ ...manifest, ...e }, signature, key.publicKey)).toBe(false);
  });

  it("fails when signatures are swapped between reports", () => {
    const other: SignatureManifest = { ...manifest, reportId: "99999999-1111-4222-8333-444455556666" };
    const otherSig = signManifest(other, key);
    expect(verifyManifest(manifest, otherSig, key.publicKey)).toBe(false);
    expect(verifyManifest(other, signature, key.publicKey)).toBe(false);
  });

  it("fails against another key pair", () => {
    const stranger = loadOrCreateSigningKey(
      mkdtempSync(path.join(process.env.TMPDIR ?? tmpdir(), "trammel-keys-")),
    );
    expect(verifyManifest({ ...manifest, keyId: stranger.keyId }, signature, stranger.publicKey)).toBe(false);
    expect(verifyManifest(manifest, signature, stranger.publicKey)).toBe(false);
  });

  it("rejects a malformed signature without throwing", () => {
    expect(verifyManifest(manifest, "not base64url!!", key.publicKey)).toBe(false);
    expect(verifyManifest(manifest, "", key.publicKey)).toBe(false);
  });
});
