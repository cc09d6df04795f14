/** Signature meanings (21 CFR 11.50: the meaning is part of the signature), with their labels. */
export const SIGNATURE_MEANINGS = ["performed", "inspected", "approved", "accepted", "rejected"] as const;
export type SignatureMeaningKey = (typeof SIGNATURE_MEANINGS)[number];

export const SIGNATURE_LABELS: Record<SignatureMeaningKey, string> = {
  performed: "Work performed",
  inspected: "Inspected",
  approved: "Approved and issued",
  accepted: "Accepted by the customer",
  rejected: "Rejected by the customer",
};
