/**
 * Signature meanings (21 CFR 11.50: the meaning is part of the signature), with their labels. Three
 * distinct words for three distinct acts: an engineer's "parameters approved" fixes a fit as the
 * head's parameter set; "approved and issued" releases the report; the customer "accepts" it.
 */
import { closedSet } from "./closed-set";

export const { values: SIGNATURE_MEANINGS, labels: SIGNATURE_LABELS } = closedSet({
  performed: "Work performed",
  inspected: "Inspected",
  parameters_approved: "Parameters approved",
  approved: "Approved and issued",
  accepted: "Accepted by the customer",
  rejected: "Rejected by the customer",
});
export type SignatureMeaningKey = (typeof SIGNATURE_MEANINGS)[number];

/**
 * What a signer reads before signing, one entry per signing act: the form's title, what the
 * signature means (shown beside the button, so the signer knows what they attest), the button's
 * label, and the comment the act asks for. Issuing an amendment signs "approved" again, with its
 * reason. One table, so the words for an act are the same wherever it is offered.
 */
export const SIGNING_WORDS = {
  performed: {
    title: "Sign as work performed",
    meaning: "You confirm you carried out the recorded work and readings on this machine and head.",
    submitLabel: "Sign",
  },
  inspected: {
    title: "Sign as inspected",
    meaning: "You confirm you inspected the recorded readings and measurements and they are complete.",
    submitLabel: "Sign",
  },
  parameters_approved: {
    title: "Sign: parameters approved",
    meaning:
      "You approve this fit as the head's parameter set for the job. The job moves to approved and no other fit can be run; the report is issued separately.",
    submitLabel: "Sign the approval",
  },
  approved: {
    title: "Approve and issue the report",
    meaning:
      "You approve the results and issue the report to the customer. The PDF is rendered once and its SHA-256 is signed; it can never change afterwards.",
    submitLabel: "Approve and issue",
  },
  amendment: {
    title: "Issue an amendment",
    meaning:
      "A new revision that supersedes the current one; the earlier revision stays on record, marked as superseded.",
    submitLabel: "Issue amendment",
    withComment: "amendmentReason",
    commentLabel: "What the amendment corrects",
    commentRequired: true,
  },
  accepted: {
    title: "Accept the report",
    meaning: "Your counter-signature: you accept the head as reported.",
    submitLabel: "Accept",
  },
  rejected: {
    title: "Reject the report",
    meaning: "Say what is wrong; the application engineer is told and can issue an amendment.",
    submitLabel: "Reject",
    withComment: "comment",
    commentLabel: "Why you reject it",
    commentRequired: true,
  },
} as const satisfies Record<
  SignatureMeaningKey | "amendment",
  {
    title: string;
    meaning: string;
    submitLabel: string;
    withComment?: "comment" | "amendmentReason";
    commentLabel?: string;
    commentRequired?: boolean;
  }
>;
