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
