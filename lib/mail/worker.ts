/**
 * The outbox worker: claims due messages (disjoint per worker, see claimDueMessages), sends
 * each through SMTP and records the outcome. Safe to run in several processes at once.
 */
import "server-only";
import { hostname } from "node:os";
import type { Transporter } from "nodemailer";
import { claimDueMessages, markFailed, markSent } from "@/db/queries/outbox";
import { MAIL_FROM, mailTransport } from "./transport";

/** Which process sent a message (host/pid), so a duplicate could be traced to its sender. */
const SENDER = `${hostname()}/${process.pid}`;

export interface OutboxRunResult {
  claimed: number;
  sent: number;
  failed: number;
}

export async function processOutbox(
  options: { transport?: Transporter; limit?: number } = {},
): Promise<OutboxRunResult> {
  const transport = options.transport ?? mailTransport();
  const rows = await claimDueMessages(options.limit ?? 20);
  let sent = 0;
  let failed = 0;
  for (const m of rows) {
    try {
      await transport.sendMail({
        from: MAIL_FROM,
        to: m.toAddress,
        subject: m.subject,
        text: m.textBody,
        ...(m.htmlBody ? { html: m.htmlBody } : {}),
        headers: { "X-Trammel-Outbox-Id": m.id, "X-Trammel-Sender": SENDER },
      });
      await markSent(m.id);
      sent++;
    } catch (err) {
      await markFailed(m.id, m.attempts, err instanceof Error ? err.message : String(err));
      failed++;
    }
  }
  return { claimed: rows.length, sent, failed };
}

let timer: ReturnType<typeof setInterval> | undefined;
let running = false;

/** Runs the worker every `intervalMs` in this process (started from instrumentation.ts). */
export function startOutboxWorker(intervalMs = 5_000): void {
  if (timer) return;
  timer = setInterval(() => {
    if (running) return;
    running = true;
    processOutbox()
      .catch((err) => console.error("[outbox] run failed:", err instanceof Error ? err.message : err))
      .finally(() => {
        running = false;
      });
  }, intervalMs);
  timer.unref?.();
}
