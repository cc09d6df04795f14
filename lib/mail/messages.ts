/**
 * The text of every e-mail Trammel sends, as pure functions of what the message is about: the
 * queries that queue a message (in the same transaction as the change it reports) call these and
 * store the result in the outbox. Plain text, with the link the person needs; `baseUrl` is the
 * public address (lib/env.ts publicUrl). Unit-tested in tests/unit/mail-messages.test.ts.
 */
import { formatDateTimeUtc } from "@/lib/format";
import { ROLE_LABELS, type Role } from "@/lib/domain/roles";

export interface MailText {
  readonly subject: string;
  readonly text: string;
}

/** An administrator invites a person; the link sets their password once, within 72 hours. */
export function invitationMessage(m: {
  baseUrl: string;
  name: string;
  role: Role;
  invitedBy: string;
  token: string;
}): MailText {
  return {
    subject: "You are invited to Trammel",
    text: `Hello ${m.name},\n\n${m.invitedBy} invited you to Trammel as ${ROLE_LABELS[m.role].toLowerCase()}.\nSet your password here within 72 hours (the link works once):\n${m.baseUrl}/set-password?token=${m.token}\n`,
  };
}

interface JobRef {
  readonly id: string;
  readonly reference: string;
  readonly title: string;
}

/** An installer submits a job for review; each engineer and inspector is told where to look. */
export function reviewRequestMessage(m: {
  baseUrl: string;
  recipientName: string;
  submittedBy: string;
  job: JobRef;
  customerName: string;
}): MailText {
  return {
    subject: `${m.job.reference} is ready for review`,
    text: `Hello ${m.recipientName},\n\n${m.submittedBy} submitted ${m.job.title} (${m.job.reference}, ${m.customerName}) for review.\nThe readings and the before/after comparison are here:\n${m.baseUrl}/jobs/${m.job.id}/compare\n`,
  };
}

/** A report (or an amendment) is issued; each of the customer's users is asked to read and answer. */
export function reportIssuedMessage(m: {
  baseUrl: string;
  recipientName: string;
  job: JobRef;
  reportId: string;
  revision: number;
}): MailText {
  return {
    subject: `Acceptance report ${m.job.reference} revision ${m.revision} is ready for you`,
    text: `Hello ${m.recipientName},\n\nThe acceptance report for ${m.job.title} (${m.job.reference}, revision ${m.revision}) has been issued.\nRead it, download the signed PDF and accept or reject it here:\n${m.baseUrl}/jobs/${m.job.id}/report\n\nAnyone holding the PDF can check it at ${m.baseUrl}/verify/${m.reportId}.\n`,
  };
}

/** The customer accepts or rejects a report; each engineer is told, with the comment if any. */
export function reportResponseMessage(m: {
  baseUrl: string;
  signerName: string;
  customerName: string;
  decision: "accepted" | "rejected";
  job: JobRef;
  revision: number;
  signedAt: Date;
  comment: string | null;
}): MailText {
  return {
    subject: `${m.customerName} ${m.decision} report ${m.job.reference} revision ${m.revision}`,
    text: `${m.signerName} (${m.customerName}) ${m.decision} the acceptance report ${m.job.reference} revision ${m.revision} at ${formatDateTimeUtc(m.signedAt)}.${m.comment ? `\n\nComment: ${m.comment}` : ""}\n\n${m.baseUrl}/jobs/${m.job.id}/report\n`,
  };
}
