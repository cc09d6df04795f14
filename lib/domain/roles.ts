/**
 * The roles people sign in with, and the acting user as the server knows it. Pure values: the
 * database enum (db/schema.ts), the zod enums and every label are derived from ROLES. What each
 * role may do lives in lib/policy.
 */
import { closedSet } from "./closed-set";

export const { values: ROLES, labels: ROLE_LABELS } = closedSet({
  admin: "Administrator",
  installer: "Installer",
  inspector: "Inspector",
  engineer: "Application engineer",
  customer: "Customer",
});
export type Role = (typeof ROLES)[number];

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}

/** The acting user as the server knows it (fresh from the database on every request). */
export interface Actor {
  readonly id: string;
  readonly email: string;
  readonly name: string;
  readonly role: Role;
  /** Set for customer users only: the one company whose data they may see. */
  readonly customerId: string | null;
}
