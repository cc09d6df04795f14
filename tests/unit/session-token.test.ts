// The session cookie reader against next-auth's own token encoder (an outside implementation):
// what it accepts is exactly a token next-auth issued with the same secret and not yet expired.
import { encode, getToken } from "next-auth/jwt";
import { describe, expect, it, vi } from "vitest";
import { identityFromCookies, MAX_CACHED_TOKENS } from "@/lib/auth/session-token";

// next-auth's own reader, counted: how many times a cookie was really decrypted.
vi.mock("next-auth/jwt", async (importOriginal) => {
  const actual = await importOriginal<typeof import("next-auth/jwt")>();
  return { ...actual, getToken: vi.fn(actual.getToken) };
});
const decodes = () => vi.mocked(getToken).mock.calls.length;

const secret = "unit-test-secret-0123456789abcdef";
const id = "5b0c7d8e-1f2a-4b3c-8d4e-5f6a7b8c9d0e";
const signedInAt = 1_764_000_000_000;

describe("session cookie reader", () => {
  it("reads the id and sign-in time from a token next-auth encoded", async () => {
    const token = await encode({ token: { sub: id, role: "engineer", signedInAt }, secret });
    expect(await identityFromCookies({ "next-auth.session-token": token }, secret)).toEqual({
      id,
      signedInAt,
    });
  });

  it("refuses a token made with another secret, a tampered one and an expired one", async () => {
    const other = await encode({ token: { sub: id, signedInAt }, secret: "another-secret-0123456789abcdef" });
    expect(await identityFromCookies({ "next-auth.session-token": other }, secret)).toBeNull();
    const good = await encode({ token: { sub: id, signedInAt }, secret });
    const parts = good.split(".");
    const flipped = parts[3]!.startsWith("A") ? `B${parts[3]!.slice(1)}` : `A${parts[3]!.slice(1)}`;
    const tampered = [...parts.slice(0, 3), flipped, parts[4]].join(".");
    expect(await identityFromCookies({ "next-auth.session-token": tampered }, secret)).toBeNull();
    // maxAge −60 s: past jose's 15 s clock tolerance.
    const expired = await encode({ token: { sub: id, signedInAt }, secret, maxAge: -60 });
    expect(await identityFromCookies({ "next-auth.session-token": expired }, secret)).toBeNull();
  });

  it("has no session without the cookie, without a subject, or from other cookies", async () => {
    expect(await identityFromCookies({}, secret)).toBeNull();
    const noSub = await encode({ token: { signedInAt }, secret });
    expect(await identityFromCookies({ "next-auth.session-token": noSub }, secret)).toBeNull();
    const token = await encode({ token: { sub: id, signedInAt }, secret });
    expect(await identityFromCookies({ "next-auth.csrf-token": token }, secret)).toBeNull();
  });

  it("joins a cookie next-auth split into numbered chunks", async () => {
    const token = await encode({ token: { sub: id, signedInAt }, secret });
    const half = Math.floor(token.length / 2);
    const jar = {
      "next-auth.session-token.1": token.slice(half),
      "next-auth.session-token.0": token.slice(0, half),
    };
    expect(await identityFromCookies(jar, secret)).toEqual({ id, signedInAt });
  });

  it("a token without a sign-in time counts as signed in at 0, so any revocation ends it", async () => {
    const token = await encode({ token: { sub: id }, secret });
    expect(await identityFromCookies({ "next-auth.session-token": token }, secret)).toEqual({
      id,
      signedInAt: 0,
    });
  });
});

describe("decoded tokens are remembered by their text", () => {
  it("decodes a cookie once, then answers the same identity without decrypting again", async () => {
    const token = await encode({ token: { sub: id, signedInAt }, secret });
    const jar = { "next-auth.session-token": token };
    const before = decodes();
    expect(await identityFromCookies(jar, secret)).toEqual({ id, signedInAt });
    expect(await identityFromCookies(jar, secret)).toEqual({ id, signedInAt });
    expect(await identityFromCookies(jar, secret)).toEqual({ id, signedInAt });
    expect(decodes() - before).toBe(1);
  });

  it("a remembered token is refused once past its own expiry (with jose's 15 s tolerance)", async () => {
    const token = await encode({ token: { sub: id, signedInAt }, secret, maxAge: 60 });
    const jar = { "next-auth.session-token": token };
    const now = Date.now();
    expect(await identityFromCookies(jar, secret, now)).toEqual({ id, signedInAt });
    expect(await identityFromCookies(jar, secret, now + 70_000)).toEqual({ id, signedInAt });
    expect(await identityFromCookies(jar, secret, now + 80_000)).toBeNull();
  });

  it("does not remember what failed: the same forged cookie is decrypted, and refused, every time", async () => {
    const forged = await encode({
      token: { sub: id, signedInAt },
      secret: "another-secret-0123456789abcdef",
    });
    const jar = { "next-auth.session-token": forged };
    const before = decodes();
    expect(await identityFromCookies(jar, secret)).toBeNull();
    expect(await identityFromCookies(jar, secret)).toBeNull();
    expect(decodes() - before).toBe(2);
  });

  it("a token remembered under one secret is not accepted under another", async () => {
    const token = await encode({ token: { sub: id, signedInAt }, secret });
    const jar = { "next-auth.session-token": token };
    expect(await identityFromCookies(jar, secret)).toEqual({ id, signedInAt });
    expect(await identityFromCookies(jar, "rotated-secret-0123456789abcdef0")).toBeNull();
  });

  it("keeps at most MAX_CACHED_TOKENS: the oldest is decoded again after that many others", async () => {
    const first = { "next-auth.session-token": await encode({ token: { sub: id, signedInAt }, secret }) };
    await identityFromCookies(first, secret);
    for (let i = 0; i < MAX_CACHED_TOKENS; i++) {
      await identityFromCookies(
        { "next-auth.session-token": await encode({ token: { sub: id, signedInAt: i }, secret }) },
        secret,
      );
    }
    const before = decodes();
    expect(await identityFromCookies(first, secret)).toEqual({ id, signedInAt });
    expect(decodes() - before).toBe(1);
  });
});
