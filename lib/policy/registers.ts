/**
 * Registers (customers, machines, heads, people, instruments, procedures, the outbox): who reads
 * each and who keeps it. The administrator keeps them all; engineers read the heads; the service
 * company's staff read the instruments and procedures.
 */
import type { Actor } from "@/lib/domain/roles";

export const REGISTERS = [
  "customers",
  "machines",
  "heads",
  "people",
  "instruments",
  "procedures",
  "outbox",
] as const;
export type Register = (typeof REGISTERS)[number];

const READ_REFUSAL: Record<Register, string> = {
  customers: "Registers are kept by the administrator.",
  machines: "Registers are kept by the administrator.",
  heads: "The heads register is kept by the service company.",
  people: "Registers are kept by the administrator.",
  instruments: "The instrument register is kept by the service company.",
  procedures: "Procedures are kept by the service company.",
  outbox: "The outbox is kept by the administrator.",
};

const EDIT_REFUSAL: Record<Register, string> = {
  customers: "Registers are kept by the administrator.",
  machines: "Registers are kept by the administrator.",
  heads: "Heads are moved in the register by the administrator.",
  people: "People are managed by the administrator.",
  instruments: "Instruments are registered by the administrator.",
  procedures: "Procedures are edited by the administrator.",
  outbox: "The outbox is kept by the administrator.",
};

/** May this actor read this register? */
export function registerReadRefusal(actor: Actor, register: Register): string | null {
  const role = actor.role;
  const may =
    role === "admin" ||
    (register === "heads" && role === "engineer") ||
    ((register === "instruments" || register === "procedures") && role !== "customer");
  return may ? null : READ_REFUSAL[register];
}

/** May this actor change this register? Only the administrator keeps registers. */
export function registerEditRefusal(actor: Actor, register: Register): string | null {
  return actor.role === "admin" ? null : EDIT_REFUSAL[register];
}
