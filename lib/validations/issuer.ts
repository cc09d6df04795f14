/** The issuer's details form (administrator, /registers/settings). Plain text; empty fields are allowed here and block issuing. */
import { z } from "zod";

const text = (max: number) => z.string().trim().max(max, `At most ${max} characters.`);

export const issuerSettingsSchema = z.object({
  name: text(160),
  address: text(400),
  contactEmail: z.union([z.literal(""), z.email({ message: "Enter an e-mail address or leave it empty." })]),
  contactPhone: text(60).regex(/^[0-9+()./ -]*$/, "Digits, spaces and + ( ) . / - only."),
  accreditation: text(400),
  reproductionStatement: text(400),
});
export type IssuerSettingsInput = z.infer<typeof issuerSettingsSchema>;

/** The statement set by `npm run setup` and offered when the field is empty (ISO/IEC 17025:2017 §7.8.2.1, reproduction in full). */
export const DEFAULT_REPRODUCTION_STATEMENT =
  "This report shall not be reproduced except in full without the written approval of the issuer.";
