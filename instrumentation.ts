/**
 * Runs once when the server starts. The e-mail outbox worker runs here, inside the app, on a
 * timer: the app is one process on one machine, so a separate worker service would only add a
 * thing to start and watch; rows are claimed with FOR UPDATE SKIP LOCKED, so a second instance
 * (or a second app process) never sends a message twice. OUTBOX_WORKER=0 turns it off.
 */
export async function register() {
  if (
    process.env.NEXT_RUNTIME !== "nodejs" ||
    process.env.OUTBOX_WORKER === "0" ||
    process.env.NEXT_PHASE === "phase-production-build"
  )
    return;
  const { startOutboxWorker } = await import("@/lib/mail/worker");
  startOutboxWorker(Number(process.env.OUTBOX_INTERVAL_MS ?? 5_000));
}
