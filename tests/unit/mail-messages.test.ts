// The e-mail texts (lib/mail/messages.ts): each names the person, the record and the one link they
// need, and a customer's comment reaches the engineers word for word. Product rules, by hand.
import { describe, expect, it } from "vitest";
import {
  assignmentMessage,
  invitationMessage,
  reportIssuedMessage,
  reportResponseMessage,
  reviewRequestMessage,
  unassignmentMessage,
} from "@/lib/mail/messages";

const baseUrl = "https://trammel.example";
const job = { id: "j-1", reference: "TR-2026-0048", title: "Head install, bay 3" };

/**
 * Each message as its builder writes it: the subject, the lines its text holds, and for some a
 * second message without an optional part and the line that says so.
 */
const MESSAGES: {
  title: string;
  build: () => { subject: string; text: string };
  subject: string;
  contains: string[];
  variant?: [() => { text: string }, string];
}[] = [
  {
    title: "an invitation names the role and carries the one-time link",
    build: () =>
      invitationMessage({ baseUrl, name: "Ada", role: "engineer", invitedBy: "Office", token: "t0k" }),
    subject: "You are invited to Trammel",
    contains: [
      "Hello Ada,",
      "Office invited you to Trammel as application engineer.",
      "within 72 hours",
      "https://trammel.example/set-password?token=t0k\n",
    ],
  },
  {
    title: "a review request links to the before/after comparison",
    build: () =>
      reviewRequestMessage({
        baseUrl,
        recipientName: "Eve",
        submittedBy: "Ian",
        job,
        customerName: "Tollan Mold Works",
      }),
    subject: "TR-2026-0048 is ready for review",
    contains: [
      "Ian submitted Head install, bay 3 (TR-2026-0048, Tollan Mold Works) for review.",
      "https://trammel.example/jobs/j-1/compare\n",
    ],
  },
  {
    title: "an issued report links to the report and to its public verification",
    build: () => reportIssuedMessage({ baseUrl, recipientName: "Cy", job, reportId: "r-9", revision: 2 }),
    subject: "Acceptance report TR-2026-0048 revision 2 is ready for you",
    contains: ["https://trammel.example/jobs/j-1/report\n", "https://trammel.example/verify/r-9."],
  },
  {
    title:
      "an assignment names the job, where and when (with its zone), links to it and defers to the manuals",
    build: () =>
      assignmentMessage({
        baseUrl,
        recipientName: "Iver",
        assignedBy: "Ada",
        job,
        customerName: "Tollan Mold Works",
        siteName: "Main shop",
        machineName: "Bridge mill B-2",
        scheduled: "2027-07-14 07:30 GMT+2 (Europe/Berlin)",
      }),
    subject: "TR-2026-0048 is assigned to you",
    contains: [
      "Ada assigned Head install, bay 3 (TR-2026-0048) to you.",
      "Where: Bridge mill B-2, Main shop, Tollan Mold Works",
      "When: 2027-07-14 07:30 GMT+2 (Europe/Berlin)",
      "https://trammel.example/jobs/j-1\n",
      "machine builder's manual",
    ],
    variant: [
      () =>
        assignmentMessage({
          ...{ baseUrl, recipientName: "I", assignedBy: "A", job },
          customerName: "C",
          siteName: "S",
          machineName: "M",
          scheduled: null,
        }),
      "When: not scheduled yet",
    ],
  },
  {
    title: "the installer a job is taken from is told, with who has it now",
    build: () =>
      unassignmentMessage({
        baseUrl,
        recipientName: "Iver",
        changedBy: "Ada",
        job,
        newInstallerName: "Sofie",
      }),
    subject: "TR-2026-0048 is no longer assigned to you",
    contains: ["Ada took Head install, bay 3 (TR-2026-0048) off your list and assigned it to Sofie."],
    variant: [
      () => unassignmentMessage({ baseUrl, recipientName: "I", changedBy: "A", job, newInstallerName: null }),
      "off your list.\n",
    ],
  },
];

describe("e-mail texts", () => {
  for (const { title, build, subject, contains, variant } of MESSAGES)
    it(title, () => {
      const m = build();
      expect(m.subject).toBe(subject);
      for (const line of contains) expect(m.text).toContain(line);
      if (variant) expect(variant[0]().text).toContain(variant[1]);
    });

  it("a response states the decision and time in UTC, with the comment only when there is one", () => {
    const common = {
      baseUrl,
      signerName: "Cy",
      customerName: "Tollan Mold Works",
      job,
      revision: 1,
      signedAt: new Date("2026-12-03T14:05:00Z"),
    };
    const rejected = reportResponseMessage({
      ...common,
      decision: "rejected",
      comment: "Pivot value looks off",
    });
    expect(rejected.subject).toBe("Tollan Mold Works rejected report TR-2026-0048 revision 1");
    expect(rejected.text).toContain("at 2026-12-03 14:05 UTC.");
    expect(rejected.text).toContain("\n\nComment: Pivot value looks off\n");
    const accepted = reportResponseMessage({ ...common, decision: "accepted", comment: null });
    expect(accepted.text).not.toContain("Comment:");
  });
});
