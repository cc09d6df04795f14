/**
 * Runs once when the server starts. The e-mail outbox worker runs here, inside the app, on a
 * timer: the app is one process on one machine, so a separate worker service would only add a
 * thing to start and watch; rows are claimed with FOR UPDATE SKIP LOCKED, so a second instance
 * (or a second app process) never sends a message twice. OUTBOX_WORKER=0 turns it off.
 */
export async function register() {
  // Next.js sets NEXT_RUNTIME per bundle and inlines it, so the Node-only import below is dropped
  // from the edge bundle; it has to be read literally here, before lib/env can be loaded.
  // eslint-disable-next-line no-restricted-properties
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { env, building } = await import("@/lib/env");
  if (env.OUTBOX_WORKER === "0" || building) return;
  const { startOutboxWorker } = await import("@/lib/mail/worker");
  startOutboxWorker(env.OUTBOX_INTERVAL_MS);
}
