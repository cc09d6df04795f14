/**
 * Signature meanings (21 CFR 11.50: the meaning is part of the signature), with their labels. Three
 * distinct words for three distinct acts: an engineer's "parameters approved" fixes a fit as the
 * head's parameter set; "approved and issued" releases the report; the customer "accepts" it.
 */
export const SIGNATURE_MEANINGS = [
  "performed",
  "inspected",
  "parameters_approved",
  "approved",
  "accepted",
  "rejected",
] as const;
export type SignatureMeaningKey = (typeof SIGNATURE_MEANINGS)[number];

export const SIGNATURE_LABELS: Record<SignatureMeaningKey, string> = {
  performed: "Work performed",
  inspected: "Inspected",
  parameters_approved: "Parameters approved",
  approved: "Approved and issued",
  accepted: "Accepted by the customer",
  rejected: "Rejected by the customer",
};
