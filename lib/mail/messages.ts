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

/**
 * The office assigns a job to an installer (or moves it to another one): the new installer gets
 * the job, where and when, and the link; the installer it was taken from is told it is no longer theirs.
 */
export function assignmentMessage(m: {
  baseUrl: string;
  recipientName: string;
  assignedBy: string;
  job: JobRef;
  customerName: string;
  siteName: string;
  machineName: string;
  /** The schedule as the reader should see it (with its zone), or null when not yet scheduled. */
  scheduled: string | null;
}): MailText {
  return {
    subject: `${m.job.reference} is assigned to you`,
    text: `Hello ${m.recipientName},\n\n${m.assignedBy} assigned ${m.job.title} (${m.job.reference}) to you.\nWhere: ${m.machineName}, ${m.siteName}, ${m.customerName}\nWhen: ${m.scheduled ?? "not scheduled yet"}\n\nThe procedure and its safety notes are here:\n${m.baseUrl}/jobs/${m.job.id}\n\nFollow the machine builder's manual and your site's lock-out rules before working on the head.\n`,
  };
}

export function unassignmentMessage(m: {
  baseUrl: string;
  recipientName: string;
  changedBy: string;
  job: JobRef;
  newInstallerName: string | null;
}): MailText {
  return {
    subject: `${m.job.reference} is no longer assigned to you`,
    text: `Hello ${m.recipientName},\n\n${m.changedBy} took ${m.job.title} (${m.job.reference}) off your list${m.newInstallerName ? ` and assigned it to ${m.newInstallerName}` : ""}.\nReadings you already recorded stay with the job under your name. Nothing else is needed from you.\n`,
  };
}
