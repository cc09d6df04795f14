// The sign-in delay arithmetic and the client address rule.
// OWASP ASVS v4.0.3 2.2.1 (anti-automation without a lock-out anyone can cause) and 1.4.x /
// 14.x deployment notes: X-Forwarded-For is believed only from configured proxies.
import { describe, expect, it } from "vitest";
import {
  BASE_DELAY_MS,
  clientAddressFrom,
  delayAfter,
  limitDecision,
  rateLimitMessage,
  waitText,
} from "@/lib/auth/throttle";

describe("delays", () => {
  it("none below the threshold, then 1, 2, 4, 8 minutes, capped by the window", () => {
    const cap = 15 * 60_000;
    expect(delayAfter(4, 5, cap)).toBe(0);
    expect([5, 6, 7, 8, 9, 30].map((n) => delayAfter(n, 5, cap) / BASE_DELAY_MS)).toEqual([
      1, 2, 4, 8, 15, 15,
    ]);
  });

  it("the longest wait of the keys counts, from each key's last failure", () => {
    const now = 1_000_000_000;
    const d = limitDecision(
      [
        { failures: 5, lastAt: now - 30_000, threshold: 5 }, // 30 s left
        { failures: 6, lastAt: now - 60_000, threshold: 5 }, // 60 s left
        { failures: 3, lastAt: now, threshold: 20 },
      ],
      now,
      900_000,
    );
    expect(d).toEqual({ limited: true, retryAfterS: 60 });
    expect(limitDecision([{ failures: 5, lastAt: now - 61_000, threshold: 5 }], now, 900_000).limited).toBe(
      false,
    );
  });

  it("the message names the wait in words and the way out", () => {
    expect(waitText(1)).toBe("1 second");
    expect(waitText(61)).toBe("2 minutes");
    expect(rateLimitMessage(240)).toMatch(/Try again in 4 minutes, or use "Forgot your password\?"/);
  });
});

describe("client address", () => {
  it("untrusted (unset): the rightmost entry, never a forged left-hand one", () => {
    expect(clientAddressFrom("6.6.6.6, 10.0.0.9", "")).toBe("10.0.0.9");
    expect(clientAddressFrom(null, "")).toBe("unknown");
  });

  it("a hop count: the entry that many from the right (what the outermost trusted proxy saw)", () => {
    expect(clientAddressFrom("6.6.6.6, 203.0.113.7", "1")).toBe("203.0.113.7");
    expect(clientAddressFrom("6.6.6.6, 203.0.113.7, 10.0.0.2", "2")).toBe("203.0.113.7");
    expect(clientAddressFrom("203.0.113.7", "3")).toBe("203.0.113.7");
  });

  it("a list of proxy addresses: skip them from the right", () => {
    expect(clientAddressFrom("6.6.6.6, 203.0.113.7, 10.0.0.2, 10.0.0.3", "10.0.0.2,10.0.0.3")).toBe(
      "203.0.113.7",
    );
  });
});
