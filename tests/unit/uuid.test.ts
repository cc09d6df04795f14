// The one UUID check. OWASP ASVS v4.0.3 5.1.3: input validated against an allow list.
// Reference for the text form: RFC 9562 §4 (8-4-4-4-12 hexadecimal digits, case-insensitive).
import { randomUUID } from "node:crypto";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { isUuid, pageUuid, uuidOr404 } from "@/lib/domain/uuid";
import { AppError } from "@/lib/errors";

describe("isUuid", () => {
  it("accepts what node:crypto and fast-check make, in either case (RFC 9562 text form)", () => {
    expect(isUuid(randomUUID())).toBe(true);
    expect(isUuid(randomUUID().toUpperCase())).toBe(true);
    fc.assert(fc.property(fc.uuid(), (u) => isUuid(u)));
  });

  it("refuses the shapes the old loose pattern let through", () => {
    for (const s of ["-".repeat(36), "0".repeat(36), "0000000000000000000000000000000000-a", "a-b-c-d-e"])
      expect(isUuid(s)).toBe(false);
  });

  it("refuses anything added before or after, or a missing dash, or a non-string", () => {
    fc.assert(
      fc.property(fc.uuid(), fc.string({ minLength: 1, maxLength: 5 }), (u, extra) => {
        expect(isUuid(u + extra)).toBe(false);
        expect(isUuid(extra + u)).toBe(false);
        expect(isUuid(u.replace("-", ""))).toBe(false);
      }),
    );
    for (const v of [null, undefined, 42, {}, [randomUUID()]]) expect(isUuid(v)).toBe(false);
  });
});

describe("the 404 helpers", () => {
  it("uuidOr404 passes a UUID through and throws a 404 AppError naming the record otherwise", () => {
    const u = randomUUID();
    expect(uuidOr404(u)).toBe(u);
    try {
      uuidOr404("-".repeat(36), "job");
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(AppError);
      expect((e as AppError).status).toBe(404);
      expect((e as AppError).message).toBe("No such job.");
    }
  });

  it("pageUuid throws Next's not-found signal", () => {
    expect(pageUuid(randomUUID().toUpperCase())).toMatch(/^[0-9A-F-]{36}$/);
    expect(() => pageUuid("x")).toThrow(expect.objectContaining({ digest: expect.stringMatching(/;404$/) }));
  });
});
