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

describe("e-mail texts", () => {
  it("an invitation names the role and carries the one-time link", () => {
    const m = invitationMessage({
      baseUrl,
      name: "Ada",
      role: "engineer",
      invitedBy: "Office",
      token: "t0k",
    });
    expect(m.subject).toBe("You are invited to Trammel");
    expect(m.text).toContain("Hello Ada,");
    expect(m.text).toContain("Office invited you to Trammel as application engineer.");
    expect(m.text).toContain("within 72 hours");
    expect(m.text).toContain("https://trammel.example/set-password?token=t0k\n");
  });

  it("a review request links to the before/after comparison", () => {
    const m = reviewRequestMessage({
      baseUrl,
      recipientName: "Eve",
      submittedBy: "Ian",
      job,
      customerName: "Tollan Mold Works",
    });
    expect(m.subject).toBe("TR-2026-0048 is ready for review");
    expect(m.text).toContain(
      "Ian submitted Head install, bay 3 (TR-2026-0048, Tollan Mold Works) for review.",
    );
    expect(m.text).toContain("https://trammel.example/jobs/j-1/compare\n");
  });

  it("an issued report links to the report and to its public verification", () => {
    const m = reportIssuedMessage({ baseUrl, recipientName: "Cy", job, reportId: "r-9", revision: 2 });
    expect(m.subject).toBe("Acceptance report TR-2026-0048 revision 2 is ready for you");
    expect(m.text).toContain("https://trammel.example/jobs/j-1/report\n");
    expect(m.text).toContain("https://trammel.example/verify/r-9.");
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

  it("an assignment names the job, where and when (with its zone), links to it and defers to the manuals", () => {
    const m = assignmentMessage({
      baseUrl,
      recipientName: "Iver",
      assignedBy: "Ada",
      job,
      customerName: "Tollan Mold Works",
      siteName: "Main shop",
      machineName: "Bridge mill B-2",
      scheduled: "2027-07-14 07:30 GMT+2 (Europe/Berlin)",
    });
    expect(m.subject).toBe("TR-2026-0048 is assigned to you");
    expect(m.text).toContain("Ada assigned Head install, bay 3 (TR-2026-0048) to you.");
    expect(m.text).toContain("Where: Bridge mill B-2, Main shop, Tollan Mold Works");
    expect(m.text).toContain("When: 2027-07-14 07:30 GMT+2 (Europe/Berlin)");
    expect(m.text).toContain("https://trammel.example/jobs/j-1\n");
    expect(m.text).toMatch(/machine builder's manual/);
    expect(
      assignmentMessage({
        ...{ baseUrl, recipientName: "I", assignedBy: "A", job },
        customerName: "C",
        siteName: "S",
        machineName: "M",
        scheduled: null,
      }).text,
    ).toContain("When: not scheduled yet");
  });

  it("the installer a job is taken from is told, with who has it now", () => {
    const m = unassignmentMessage({
      baseUrl,
      recipientName: "Iver",
      changedBy: "Ada",
      job,
      newInstallerName: "Sofie",
    });
    expect(m.subject).toBe("TR-2026-0048 is no longer assigned to you");
    expect(m.text).toContain(
      "Ada took Head install, bay 3 (TR-2026-0048) off your list and assigned it to Sofie.",
    );
    expect(
      unassignmentMessage({ baseUrl, recipientName: "I", changedBy: "A", job, newInstallerName: null }).text,
    ).toContain("off your list.\n");
  });
});
