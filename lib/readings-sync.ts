/**
 * The tablet's rules for sending queued readings, kept free of the browser so they are tested on
 * their own: what an answer from the server means for a queued reading, and how long to wait
 * before trying again.
 */

/** What became of one send. */
export type SendOutcome =
  | { kind: "sent"; decision: string | null }
  | { kind: "refused"; reason: string }
  | { kind: "retry"; reason: string }
  | { kind: "signed_out"; reason: string };

/**
 * The meaning of an HTTP answer to `POST /api/jobs/{id}/readings`: 200 (already stored) and 201
 * are sent; 401 waits for a new sign-in; 408, 429 and 5xx (and no answer at all) are tried again
 * later; any other 4xx is a refusal the installer must correct or discard.
 */
export function classifyAnswer(
  status: number,
  message: string | null,
  decision: string | null = null,
): SendOutcome {
  if (status === 200 || status === 201) return { kind: "sent", decision };
  if (status === 401)
    return { kind: "signed_out", reason: "Signed out: sign in again and the readings will be sent." };
  if (status === 408 || status === 429 || status >= 500)
    return {
      kind: "retry",
      reason: `The server could not take it just now (${status}); trying again.`,
    };
  return { kind: "refused", reason: message ?? `The server refused this reading (${status}).` };
}

export const NO_CONNECTION = "No connection to the server; kept on this tablet.";

/** Wait before the next try after `attempts` failed ones: 2 s doubling to at most a minute. */
export function backoffMs(attempts: number): number {
  return Math.min(60_000, 2_000 * 2 ** Math.max(0, attempts - 1));
}

/** A UUID for a reading made on the device (crypto.randomUUID needs a secure context; this does not). */
export function newClientId(): string {
  const b = crypto.getRandomValues(new Uint8Array(16));
  b[6] = (b[6]! & 0x0f) | 0x40;
  b[8] = (b[8]! & 0x3f) | 0x80;
  const h = Array.from(b, (x) => x.toString(16).padStart(2, "0")).join("");
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}
