/**
 * The arithmetic of the sign-in limits, pure so it can be tested on its own. Each counted key
 * (an account from one address, an address, an account from anywhere) has a threshold; past it,
 * every further try waits BASE_DELAY_MS doubled for each failure beyond the threshold, counted
 * from the key's last failure, at most the counting window. A delay, not a lock: it runs out by
 * itself, and the right password from elsewhere is not refused unless that place is also over.
 */
export const BASE_DELAY_MS = 60_000;

export interface KeyCount {
  failures: number;
  /** Milliseconds since the epoch of the latest counted failure (0 for none). */
  lastAt: number;
  threshold: number;
}

export interface LimitDecision {
  limited: boolean;
  /** Whole seconds until a try is taken again (0 when not limited). */
  retryAfterS: number;
}

/** The wait a key imposes after `failures` failures: 0 below the threshold, then 1, 2, 4 … minutes, capped. */
export function delayAfter(failures: number, threshold: number, capMs: number): number {
  if (failures < threshold) return 0;
  return Math.min(BASE_DELAY_MS * 2 ** Math.min(failures - threshold, 20), capMs);
}

export function limitDecision(keys: readonly KeyCount[], now: number, capMs: number): LimitDecision {
  let until = 0;
  for (const k of keys) {
    const d = delayAfter(k.failures, k.threshold, capMs);
    if (d > 0) until = Math.max(until, k.lastAt + d);
  }
  const wait = until - now;
  return wait > 0
    ? { limited: true, retryAfterS: Math.ceil(wait / 1000) }
    : { limited: false, retryAfterS: 0 };
}

/** "3 minutes", "1 minute", "40 seconds": how long to wait, in the 429's words. */
export function waitText(seconds: number): string {
  if (seconds < 60) return `${seconds} second${seconds === 1 ? "" : "s"}`;
  const m = Math.ceil(seconds / 60);
  return `${m} minute${m === 1 ? "" : "s"}`;
}

/** The truthful 429 text: what was counted, how long to wait, and what else can be done. */
export function rateLimitMessage(retryAfterS: number): string {
  return `Too many failed sign-ins for this account or from your network. Try again in ${waitText(retryAfterS)}, or use "Forgot your password?" to get a reset link by e-mail; an administrator can also clear the delay.`;
}

/**
 * The client's address for counting. X-Forwarded-For is believed only as far as TRUSTED_PROXIES
 * says: a number N means N proxies in front each append the address they saw, so the client is
 * the N-th entry from the right; a comma-separated list of proxy addresses means entries from the
 * right are skipped while they are one of those. With neither, the header is not trusted and the
 * rightmost entry (the one the server itself adds from the socket when the client sent none) is
 * used, and the per-account backstop bounds what forging it can gain.
 */
export function clientAddressFrom(forwardedFor: string | null | undefined, trustedProxies = ""): string {
  const hops = (forwardedFor ?? "")
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean);
  if (hops.length === 0) return "unknown";
  const trusted = trustedProxies.trim();
  if (/^\d+$/.test(trusted)) {
    const n = Number(trusted);
    if (n === 0) return hops[hops.length - 1]!;
    return hops[Math.max(0, hops.length - n)]!;
  }
  if (trusted) {
    const list = new Set(
      trusted
        .split(",")
        .map((s) => s.trim())
        .filter(Boolean),
    );
    for (let i = hops.length - 1; i >= 0; i--) if (!list.has(hops[i]!)) return hops[i]!;
    return hops[0]!;
  }
  return hops[hops.length - 1]!;
}
