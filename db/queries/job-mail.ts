import "server-only";
import { eq } from "drizzle-orm";
import type { NodePgDatabase } from "drizzle-orm/node-postgres";
import { db } from "@/db";
import { enqueueMail } from "@/db/queries/outbox";
import { personColumns } from "@/db/queries/users";
import { users } from "@/db/schema";
import type * as schema from "@/db/schema";
import { invalid } from "@/lib/errors";
import type { Actor } from "@/lib/domain/roles";
import { publicUrl } from "@/lib/env";
import { formatDateTime } from "@/lib/format";
import { assignmentMessage, unassignmentMessage, type MailText } from "@/lib/mail/messages";

type Executor = NodePgDatabase<typeof schema>;
type Person = { id: string; name: string; email: string };

/** The installer a job is being given to: an active installer, or 422 naming `assignedInstallerId`. */
export async function activeInstaller(id: string): Promise<Person> {
  const [u] = await db.select(personColumns).from(users).where(eq(users.id, id));
  if (!u || u.role !== "installer" || u.disabled)
    throw invalid("Assign an active installer.", [
      { field: "assignedInstallerId", message: "Not an active installer." },
    ]);
  return u;
}

/**
 * Queues, in the caller's transaction, the e-mails an assignment change sends: the new installer
 * is told the job, place and time; the one it was taken from is told it is no longer theirs.
 */
export async function queueAssignmentMails(
  tx: Executor,
  actor: Actor,
  m: {
    job: { id: string; reference: string; title: string };
    where: { customerName: string; siteName: string; machineName: string };
    scheduledFor: Date | null;
    timeZone: string | null;
    from: Person | null;
    to: Person | null;
    at: Date;
  },
): Promise<void> {
  if (m.from?.id === m.to?.id) return;
  const stamp = m.at.getTime();
  // The outbox keeps one message per key: one per job, change and person.
  const send = (kind: "assign" | "unassign", person: Person, message: MailText) =>
    enqueueMail(tx, {
      dedupeKey: `${kind}:${m.job.id}:${stamp}:${person.id}`,
      to: person.email,
      ...message,
      jobId: m.job.id,
    });
  if (m.to)
    await send(
      "assign",
      m.to,
      assignmentMessage({
        baseUrl: publicUrl,
        recipientName: m.to.name,
        assignedBy: actor.name,
        job: m.job,
        ...m.where,
        scheduled: m.scheduledFor
          ? `${formatDateTime(m.scheduledFor, m.timeZone ?? "UTC")} (${m.timeZone ?? "UTC"})`
          : null,
      }),
    );
  if (m.from)
    await send(
      "unassign",
      m.from,
      unassignmentMessage({
        baseUrl: publicUrl,
        recipientName: m.from.name,
        changedBy: actor.name,
        job: m.job,
        newInstallerName: m.to?.name ?? null,
      }),
    );
}
