/**
 * The issuer's details (the company that issues the reports): who reads and who keeps them. The
 * administrator keeps them at /registers/settings; every signed-in person sees them printed on
 * the reports, which is where they are read.
 */
import type { Actor } from "@/lib/domain/roles";

/** May this actor open and change the issuer's details? Only the administrator. */
export function issuerSettingsRefusal(actor: Actor): string | null {
  return actor.role === "admin" ? null : "The issuer's details are kept by the administrator.";
}

/** The issuer's details a report needs before it may be issued: its name and address (ISO/IEC 17025:2017 §7.8.2.1 b). */
export function issuerDetailsMissing(issuer: { name: string; address: string }): string[] {
  return [...(issuer.name.trim() ? [] : ["name"]), ...(issuer.address.trim() ? [] : ["address"])];
}
