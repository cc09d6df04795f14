// Start-up settings (lib/env.ts): in production the public address must be set, because it is
// printed on every report and encoded in its QR code (ISO/IEC 17025:2017 §7.8.2.1 a/c: the report
// identifies the laboratory and where it can be reached; a localhost link would point nowhere).
import { afterEach, describe, expect, it, vi } from "vitest";

const saved = { ...process.env };

async function load(vars: Record<string, string | undefined>) {
  vi.resetModules();
  for (const k of ["NODE_ENV", "NEXTAUTH_SECRET", "NEXTAUTH_URL", "PUBLIC_URL", "NEXT_PHASE"])
    delete process.env[k];
  Object.assign(process.env, vars);
  return import("@/lib/env");
}

afterEach(() => {
  for (const k of Object.keys(process.env)) if (!(k in saved)) delete process.env[k];
  Object.assign(process.env, saved);
  vi.resetModules();
});

describe("PUBLIC_URL", () => {
  const secret = "a-secret-of-more-than-sixteen-characters";
  it("is required in production: start-up refuses without it", async () => {
    await expect(load({ NODE_ENV: "production", NEXTAUTH_SECRET: secret })).rejects.toThrow(
      /PUBLIC_URL: required in production/,
    );
    // NEXTAUTH_URL alone does not stand in for it.
    await expect(
      load({ NODE_ENV: "production", NEXTAUTH_SECRET: secret, NEXTAUTH_URL: "https://trammel.example" }),
    ).rejects.toThrow(/PUBLIC_URL/);
  });
  it("drives the printed address (no trailing slash) when set", async () => {
    const m = await load({
      NODE_ENV: "production",
      NEXTAUTH_SECRET: secret,
      PUBLIC_URL: "https://trammel.example/",
    });
    expect(m.publicUrl).toBe("https://trammel.example");
  });
  it("is not needed while the app is built, nor in development", async () => {
    await expect(
      load({ NODE_ENV: "production", NEXT_PHASE: "phase-production-build" }),
    ).resolves.toBeTruthy();
    const dev = await load({ NODE_ENV: "development" });
    expect(dev.publicUrl).toBe("http://localhost:3000");
  });
  it("ALLOW_SAME_SIGNER is off unless set to 1 or true", async () => {
    expect((await load({ NODE_ENV: "development" })).env.ALLOW_SAME_SIGNER).toBe(false);
    expect((await load({ NODE_ENV: "development", ALLOW_SAME_SIGNER: "1" })).env.ALLOW_SAME_SIGNER).toBe(
      true,
    );
    await expect(load({ NODE_ENV: "development", ALLOW_SAME_SIGNER: "yes" })).rejects.toThrow(
      /ALLOW_SAME_SIGNER/,
    );
  });
});
