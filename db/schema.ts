/**
 * The database schema (Drizzle). Migrations in db/migrations are generated from this file by
 * `npm run db:generate` and committed. Lengths are stored in mm and angles in degrees (SI-based,
 * the unit in the column name); display units are a user preference.
 */
import { sql } from "drizzle-orm";
import {
  bigserial,
  boolean,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";

const timestamps = {
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true })
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date()),
};

export const roleEnum = pgEnum("role", ["admin", "installer", "inspector", "engineer", "customer"]);
export const jobKindEnum = pgEnum("job_kind", ["installation", "reverification", "after_crash"]);
export const jobStatusEnum = pgEnum("job_status", [
  "draft",
  "measuring",
  "in_review",
  "approved",
  "issued",
  "accepted",
  "rejected",
]);
export const axisLetterEnum = pgEnum("axis_letter", ["A", "B", "C"]);
export const decisionRuleEnum = pgEnum("decision_rule", ["simple", "guarded"]);
export const unitSystemEnum = pgEnum("unit_system", ["metric", "inch"]);

export const customers = pgTable("customers", {
  id: uuid("id").primaryKey().defaultRandom(),
  name: text("name").notNull().unique(),
  contactEmail: text("contact_email"),
  ...timestamps,
});
export type Customer = typeof customers.$inferSelect;

export const users = pgTable(
  "users",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    role: roleEnum("role").notNull(),
    /** Only customer users belong to a customer; staff of the service company have none. */
    customerId: uuid("customer_id").references(() => customers.id, { onDelete: "restrict" }),
    passwordHash: text("password_hash"),
    disabled: boolean("disabled").notNull().default(false),
    unitSystem: unitSystemEnum("unit_system").notNull().default("metric"),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("users_email_lower_idx").on(sql`lower(${t.email})`),
    index("users_customer_idx").on(t.customerId),
  ],
);
export type User = typeof users.$inferSelect;

export const sites = pgTable(
  "sites",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    customerId: uuid("customer_id")
      .notNull()
      .references(() => customers.id, { onDelete: "restrict" }),
    name: text("name").notNull(),
    address: text("address"),
    ...timestamps,
  },
  (t) => [index("sites_customer_idx").on(t.customerId)],
);
export type Site = typeof sites.$inferSelect;

/** Host machines: the CNC machine whose spindle carries the head. */
export const machines = pgTable(
  "machines",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    siteId: uuid("site_id")
      .notNull()
      .references(() => sites.id, { onDelete: "restrict" }),
    name: text("name").notNull(),
    builder: text("builder"),
    model: text("model"),
    serial: text("serial"),
    kind: text("kind").notNull().default("machining centre"),
    control: text("control"),
    ...timestamps,
  },
  (t) => [index("machines_site_idx").on(t.siteId)],
);
export type Machine = typeof machines.$inferSelect;

/** Two-axis heads. Axis letters say which machine axes the primary and secondary axes are. */
export const heads = pgTable(
  "heads",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    serial: text("serial").notNull().unique(),
    maker: text("maker"),
    model: text("model"),
    primaryAxis: axisLetterEnum("primary_axis").notNull(),
    secondaryAxis: axisLetterEnum("secondary_axis").notNull(),
    /** Tool direction at zero, unit vector; default −Z. */
    toolDirection: jsonb("tool_direction").$type<[number, number, number]>().notNull().default([0, 0, -1]),
    nominalPivotLengthMm: doublePrecision("nominal_pivot_length_mm").notNull(),
    toolAxisOffsetMm: doublePrecision("tool_axis_offset_mm").notNull().default(0),
    massKg: doublePrecision("mass_kg"),
    /** Where the head is mounted now (null: in the shop or in transit). */
    machineId: uuid("machine_id").references(() => machines.id, { onDelete: "set null" }),
    ...timestamps,
  },
  (t) => [index("heads_machine_idx").on(t.machineId)],
);
export type Head = typeof heads.$inferSelect;

export const jobs = pgTable(
  "jobs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    /** Human reference, e.g. TR-2026-0007; unique. */
    reference: text("reference").notNull().unique(),
    title: text("title").notNull(),
    kind: jobKindEnum("kind").notNull(),
    status: jobStatusEnum("status").notNull().default("draft"),
    /** Denormalised from machine → site → customer so every tenant check is one column. */
    customerId: uuid("customer_id")
      .notNull()
      .references(() => customers.id, { onDelete: "restrict" }),
    machineId: uuid("machine_id")
      .notNull()
      .references(() => machines.id, { onDelete: "restrict" }),
    headId: uuid("head_id")
      .notNull()
      .references(() => heads.id, { onDelete: "restrict" }),
    assignedInstallerId: uuid("assigned_installer_id").references(() => users.id, { onDelete: "set null" }),
    decisionRule: decisionRuleEnum("decision_rule").notNull().default("simple"),
    scheduledFor: timestamp("scheduled_for", { withTimezone: true }),
    airTempC: doublePrecision("air_temp_c"),
    notes: text("notes"),
    createdById: uuid("created_by_id").references(() => users.id, { onDelete: "set null" }),
    ...timestamps,
  },
  (t) => [
    index("jobs_customer_idx").on(t.customerId),
    index("jobs_status_idx").on(t.status),
    index("jobs_installer_idx").on(t.assignedInstallerId),
  ],
);
export type Job = typeof jobs.$inferSelect;

/**
 * Append-only audit trail. Rows are hash-chained (hash = SHA-256 over the previous hash and the
 * canonical JSON of this row); a trigger in the migrations refuses UPDATE and DELETE.
 */
export const auditEvents = pgTable(
  "audit_events",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    actorId: uuid("actor_id"),
    actorEmail: text("actor_email"),
    action: text("action").notNull(),
    entityType: text("entity_type").notNull(),
    entityId: text("entity_id").notNull(),
    jobId: uuid("job_id"),
    oldValues: jsonb("old_values"),
    newValues: jsonb("new_values"),
    prevHash: text("prev_hash").notNull(),
    hash: text("hash").notNull(),
  },
  (t) => [index("audit_events_job_idx").on(t.jobId), index("audit_events_entity_idx").on(t.entityType, t.entityId)],
);
export type AuditEvent = typeof auditEvents.$inferSelect;

/** Failed sign-ins, for rate limiting per account and per address (kept short-lived). */
export const signInFailures = pgTable(
  "sign_in_failures",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    emailKey: text("email_key").notNull(),
    address: text("address").notNull(),
    attempts: integer("attempts").notNull().default(1),
  },
  (t) => [index("sign_in_failures_email_idx").on(t.emailKey, t.at), index("sign_in_failures_address_idx").on(t.address, t.at)],
);
