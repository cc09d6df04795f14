/** The e-mail outbox: where each queued message stands, as the outbox register names it. */
import { closedSet } from "./closed-set";

export const { values: OUTBOX_STATUSES, labels: OUTBOX_STATUS_LABELS } = closedSet({
  pending: "Waiting to send",
  sent: "Sent",
  failed: "Gave up",
});
export type OutboxStatus = (typeof OUTBOX_STATUSES)[number];
