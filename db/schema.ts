/**
 * The database schema (Drizzle). Migrations in db/migrations are generated from this file by
 * `npm run db:generate` and committed. Units: a column with a fixed unit says it in its name
 * (`nominal_pivot_length_mm`, `mass_kg`, `air_temp_c`, `distance_mm`); checklist values, step
 * limits and instrument figures are stored in the canonical unit of their quantity, mm for a
 * length and arc seconds for an angle (`quantity_kind`); head-parameter limits in µm or arc
 * seconds by the parameter key's suffix. Display units are a user preference (lib/units.ts).
 */
import { sql } from "drizzle-orm";
import {
  bigserial,
  check,
  customType,
  date,
  boolean,
  doublePrecision,
  index,
  integer,
  type AnyPgColumn,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  type UpdateDeleteAction,
  uuid,
} from "drizzle-orm/pg-core";
// Relative imports: drizzle-kit loads this file without the app's path alias.
import { ANALYSIS_KINDS, DATASET_KINDS, DATASET_STATUSES, PHASES } from "../lib/domain/datasets";
import { DECISION_RULES } from "../lib/domain/decisions";
import { CONTROL_VALUE_STAGES, type ControlValueSet } from "../lib/domain/control-values";
import { AXIS_LETTERS } from "../lib/domain/heads";
import { HEAD_AXIS_ROLES } from "../lib/domain/positioning";
import { JOB_KINDS, JOB_STATUSES } from "../lib/domain/jobs";
import { LIMIT_SOURCES, MULTI_POINT_RESULTS, STEP_KINDS } from "../lib/domain/procedures";
import { ROLES } from "../lib/domain/roles";
import { OUTBOX_STATUSES } from "../lib/domain/outbox";
import { SIGNATURE_MEANINGS } from "../lib/domain/signatures";
import { QUANTITY_KINDS, UNIT_SYSTEMS } from "../lib/domain/units";

/** Every instant is stored with its time zone (timestamptz). */
const instant = (name: string) => timestamp(name, { withTimezone: true });
/** An instant that defaults to when the row is written. */
const instantNow = (name: string) => instant(name).notNull().defaultNow();
/** The random UUID that identifies most rows. */
const primaryId = () => uuid("id").primaryKey().defaultRandom();
/** A reference to another row; by default that row cannot be deleted while this one names it. */
const ref = (name: string, target: () => AnyPgColumn, onDelete: UpdateDeleteAction = "restrict") =>
  uuid(name).references(target, { onDelete });
/** The same, for a row this one cannot exist without. */
const requiredRef = (name: string, target: () => AnyPgColumn, onDelete: UpdateDeleteAction = "restrict") =>
  ref(name, target, onDelete).notNull();
/** The job a record belongs to. */
const jobRef = () => requiredRef("job_id", () => jobs.id);
/** The user who did something; the record keeps its row (with null here) if the user row goes. */
const byUser = (name: string) => ref(name, () => users.id, "set null");
/** Retired rows stay readable on the jobs that name them and are left out of pickers for new work. */
const retiredAt = () => instant("retired_at");

const timestamps = {
  createdAt: instantNow("created_at"),
  updatedAt: instant("updated_at")
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date()),
};

// Closed sets come from lib/domain, so the database, the zod schemas and the labels agree.
export const roleEnum = pgEnum("role", ROLES);
export const jobKindEnum = pgEnum("job_kind", JOB_KINDS);
export const jobStatusEnum = pgEnum("job_status", JOB_STATUSES);
export const axisLetterEnum = pgEnum("axis_letter", AXIS_LETTERS);
export const decisionRuleEnum = pgEnum("decision_rule", DECISION_RULES);
export const unitSystemEnum = pgEnum("unit_system", UNIT_SYSTEMS);
export const phaseEnum = pgEnum("phase", PHASES);
/** What a checklist step measures; fixes the canonical unit its values are stored in. */
export const quantityKindEnum = pgEnum("quantity_kind", QUANTITY_KINDS);
/** How a step's value is obtained: read directly, or derived by geometry/ from the inputs. */
export const stepDerivationEnum = pgEnum("step_derivation", STEP_KINDS);
export const multiPointResultEnum = pgEnum("multi_point_result", MULTI_POINT_RESULTS);
export const limitSourceEnum = pgEnum("limit_source", LIMIT_SOURCES);
export const datasetKindEnum = pgEnum("dataset_kind", DATASET_KINDS);
export const datasetStatusEnum = pgEnum("dataset_status", DATASET_STATUSES);
export const outboxStatusEnum = pgEnum("outbox_status", OUTBOX_STATUSES);
export const signatureMeaningEnum = pgEnum("signature_meaning", SIGNATURE_MEANINGS);
export const analysisKindEnum = pgEnum("analysis_kind", ANALYSIS_KINDS);

/** bytea: drizzle 0.45 has no built-in type for it. Buffers round-trip exactly. */
export const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => "bytea" });

export const customers = pgTable("customers", {
  id: primaryId(),
  name: text("name").notNull().unique(),
  contactEmail: text("contact_email"),
  retiredAt: retiredAt(),
  ...timestamps,
});
export type Customer = typeof customers.$inferSelect;

export const users = pgTable(
  "users",
  {
    id: primaryId(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    role: roleEnum("role").notNull(),
    /** Only customer users belong to a customer; staff of the service company have none. */
    customerId: ref("customer_id", () => customers.id),
    passwordHash: text("password_hash"),
    disabled: boolean("disabled").notNull().default(false),
    unitSystem: unitSystemEnum("unit_system").notNull().default("metric"),
    /** Session tokens issued before this instant are refused (sign-out everywhere, disable, role change). */
    sessionsValidAfter: instant("sessions_valid_after"),
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
    id: primaryId(),
    customerId: requiredRef("customer_id", () => customers.id),
    name: text("name").notNull(),
    address: text("address"),
    retiredAt: retiredAt(),
    ...timestamps,
  },
  (t) => [index("sites_customer_idx").on(t.customerId)],
);
export type Site = typeof sites.$inferSelect;

/** Host machines: the CNC machine whose spindle carries the head. */
export const machines = pgTable(
  "machines",
  {
    id: primaryId(),
    siteId: requiredRef("site_id", () => sites.id),
    name: text("name").notNull(),
    builder: text("builder"),
    model: text("model"),
    serial: text("serial"),
    kind: text("kind").notNull().default("machining centre"),
    control: text("control"),
    retiredAt: retiredAt(),
    ...timestamps,
  },
  (t) => [index("machines_site_idx").on(t.siteId)],
);
export type Machine = typeof machines.$inferSelect;

/** Two-axis heads. Axis letters say which machine axes the primary and secondary axes are. */
export const heads = pgTable(
  "heads",
  {
    id: primaryId(),
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
    machineId: ref("machine_id", () => machines.id, "set null"),
    retiredAt: retiredAt(),
    ...timestamps,
  },
  (t) => [index("heads_machine_idx").on(t.machineId)],
);
export type Head = typeof heads.$inferSelect;

export const jobs = pgTable(
  "jobs",
  {
    id: primaryId(),
    /** Human reference, e.g. TR-2026-0007; unique. */
    reference: text("reference").notNull().unique(),
    title: text("title").notNull(),
    kind: jobKindEnum("kind").notNull(),
    status: jobStatusEnum("status").notNull().default("draft"),
    /** Denormalised from machine → site → customer so every tenant check is one column. */
    customerId: requiredRef("customer_id", () => customers.id),
    machineId: requiredRef("machine_id", () => machines.id),
    headId: requiredRef("head_id", () => heads.id),
    assignedInstallerId: byUser("assigned_installer_id"),
    decisionRule: decisionRuleEnum("decision_rule").notNull().default("simple"),
    /** The procedure template version the job started with; later edits of the template do not change it. */
    templateId: ref("template_id", (): AnyPgColumn => procedureTemplates.id),
    scheduledFor: instant("scheduled_for"),
    /** IANA zone the schedule was given in (e.g. Europe/Berlin); times are stored in UTC. */
    timeZone: text("time_zone"),
    airTempC: doublePrecision("air_temp_c"),
    notes: text("notes"),
    /** The customer's order or purchase-order reference, printed on the report. */
    orderReference: text("order_reference"),
    customerContactName: text("customer_contact_name"),
    customerContactEmail: text("customer_contact_email"),
    /** The condition of the item as received, in words (printed on the report). */
    conditionAsFound: text("condition_as_found"),
    /** When the head should next be re-checked (printed on the report). */
    nextRecheckOn: date("next_recheck_on", { mode: "string" }),
    /** While on hold: the status the job left, restored on release. */
    heldFromStatus: jobStatusEnum("held_from_status"),
    holdReason: text("hold_reason"),
    /** Why the job was cancelled (required to cancel; the audit trail keeps who and when). */
    cancelReason: text("cancel_reason"),
    createdById: byUser("created_by_id"),
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
    at: instantNow("at"),
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
  (t) => [
    index("audit_events_job_idx").on(t.jobId),
    index("audit_events_entity_idx").on(t.entityType, t.entityId),
  ],
);
export type AuditEvent = typeof auditEvents.$inferSelect;

/** Failed sign-ins, for rate limiting per account and per address (kept short-lived). */
export const signInFailures = pgTable(
  "sign_in_failures",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    at: instantNow("at"),
    emailKey: text("email_key").notNull(),
    address: text("address").notNull(),
    attempts: integer("attempts").notNull().default(1),
  },
  (t) => [
    index("sign_in_failures_email_idx").on(t.emailKey, t.at),
    index("sign_in_failures_address_idx").on(t.address, t.at),
  ],
);

/** Measuring instruments with their calibration status. Resolution and uncertainty in the canonical unit of their quantity (mm or arcsec). */
export const instruments = pgTable("instruments", {
  id: primaryId(),
  kind: text("kind").notNull(),
  serial: text("serial").notNull().unique(),
  maker: text("maker"),
  model: text("model"),
  quantityKind: quantityKindEnum("quantity_kind").notNull().default("length"),
  resolution: doublePrecision("resolution").notNull(),
  standardUncertainty: doublePrecision("standard_uncertainty").notNull(),
  calibratedOn: date("calibrated_on", { mode: "string" }),
  calibrationDueOn: date("calibration_due_on", { mode: "string" }).notNull(),
  certificateRef: text("certificate_ref"),
  /** The span the instrument reads over, in its canonical unit (mm or arcsec); null = not stated. */
  rangeMin: doublePrecision("range_min"),
  rangeMax: doublePrecision("range_max"),
  /** A reference sphere's calibrated diameter in mm, as its certificate states it (printed on the report). */
  calibratedSizeMm: doublePrecision("calibrated_size_mm"),
  /** Kept in step with retired_at (set together by db/queries/instruments.ts). */
  retired: boolean("retired").notNull().default(false),
  retiredAt: retiredAt(),
  ...timestamps,
});
export type Instrument = typeof instruments.$inferSelect;

/**
 * Calibrations of an instrument, oldest first: each recalibration is a new row (the history is
 * kept) and copies its dates and certificate onto the instrument, which brings it back into use.
 */
export const instrumentCalibrations = pgTable(
  "instrument_calibrations",
  {
    id: primaryId(),
    instrumentId: requiredRef("instrument_id", () => instruments.id),
    calibratedOn: date("calibrated_on", { mode: "string" }).notNull(),
    dueOn: date("due_on", { mode: "string" }).notNull(),
    certificateRef: text("certificate_ref").notNull(),
    laboratory: text("laboratory").notNull(),
    recordedById: byUser("recorded_by_id"),
    createdAt: instantNow("created_at"),
  },
  (t) => [index("instrument_calibrations_instrument_idx").on(t.instrumentId, t.calibratedOn)],
);
export type InstrumentCalibration = typeof instrumentCalibrations.$inferSelect;

/** Procedure templates are versioned: editing one makes a new version; jobs keep theirs. */
export const procedureTemplates = pgTable(
  "procedure_templates",
  {
    id: primaryId(),
    name: text("name").notNull(),
    version: integer("version").notNull(),
    description: text("description"),
    isCurrent: boolean("is_current").notNull().default(true),
    /** The job kinds this procedure applies to; null = every kind. */
    jobKinds: jobKindEnum("job_kinds").array(),
    /** The head model it is written for; null = every model. */
    headModel: text("head_model"),
    /** Retired procedures are not offered for new jobs; jobs that use them keep them. */
    retiredAt: instant("retired_at"),
    /** The procedure asks for a tool-centre-point check after compensation before the report is issued. */
    tcpCheckRequired: boolean("tcp_check_required").notNull().default(false),
    /** TCP-check limits, µm (null = recorded, not judged): range of x, y and z each, and distance from the mean centre. */
    tcpRangeLimitUm: doublePrecision("tcp_range_limit_um"),
    tcpDeviationLimitUm: doublePrecision("tcp_deviation_limit_um"),
    /** Where the TCP-check limits come from (null when there is no limit), as for a step's limits. */
    tcpLimitSource: limitSourceEnum("tcp_limit_source"),
    tcpLimitSourceNote: text("tcp_limit_source_note"),
    createdById: byUser("created_by_id"),
    ...timestamps,
  },
  (t) => [uniqueIndex("procedure_templates_name_version_idx").on(t.name, t.version)],
);
export type ProcedureTemplate = typeof procedureTemplates.$inferSelect;

/**
 * One step of a template: what is measured, its limits (canonical unit: mm for length, arcsec
 * for angle; null = no limit on that side), the decision rule, and where the limit comes from.
 */
export const templateSteps = pgTable(
  "template_steps",
  {
    id: primaryId(),
    templateId: requiredRef("template_id", () => procedureTemplates.id, "cascade"),
    position: integer("position").notNull(),
    title: text("title").notNull(),
    instructions: text("instructions"),
    quantity: text("quantity").notNull(),
    quantityKind: quantityKindEnum("quantity_kind").notNull(),
    derivation: stepDerivationEnum("derivation").notNull().default("direct"),
    /** For angle_over_distance: the distance the reading is taken over (mm). */
    distanceMm: doublePrecision("distance_mm"),
    lowerLimit: doublePrecision("lower_limit"),
    upperLimit: doublePrecision("upper_limit"),
    decisionRule: decisionRuleEnum("decision_rule").notNull().default("simple"),
    limitSource: limitSourceEnum("limit_source").notNull(),
    limitSourceNote: text("limit_source_note"),
    safetyNote: text("safety_note"),
    /** multi_point: the named points in entry order (e.g. ["12","3","6","9"]). */
    points: jsonb("points").$type<string[]>(),
    /** multi_point: what the judged value is derived from the points. */
    pointResult: multiPointResultEnum("point_result"),
    /** record: the unit the value is written in (e.g. "N·m", "mm"); stored as entered. */
    recordUnit: text("record_unit"),
    /** The unit the procedure writes this step's limits in (mm, um, in, arcsec); stored values stay canonical. */
    limitUnit: text("limit_unit"),
    /** The step is not complete without a photo (dial face, set-up, shims). */
    photoRequired: boolean("photo_required").notNull().default(false),
  },
  (t) => [uniqueIndex("template_steps_position_idx").on(t.templateId, t.position)],
);
export type TemplateStep = typeof templateSteps.$inferSelect;

/**
 * Checklist readings. Values are stored in the canonical unit of the step's quantity (mm or
 * arcsec) with what was entered kept beside them. A correction is a new row that supersedes the
 * old one; nothing is overwritten.
 */
export const readings = pgTable(
  "readings",
  {
    id: primaryId(),
    jobId: jobRef(),
    stepId: requiredRef("step_id", () => templateSteps.id),
    phase: phaseEnum("phase").notNull(),
    /**
     * Canonical value (mm or arcsec); for a multi-point step the value derived from its points; for
     * a check 1 = yes and 0 = no; for a record the value in the step's own unit; for a note 0.
     */
    value: doublePrecision("value").notNull(),
    enteredValue: doublePrecision("entered_value").notNull(),
    enteredUnit: text("entered_unit").notNull(),
    /**
     * Inputs of a derived value, as entered: the reading and distance of an angle, or for a
     * multi_point step `{ points: { "12": v, "3": v, … } }` in the entered unit.
     */
    inputs: jsonb("inputs"),
    /**
     * Text answers: "yes"/"no" for a check step (value 1/0), the text of a note step (value 0),
     * or where a recorded value applies (shim positions) for a record step.
     */
    textValue: text("text_value"),
    instrumentId: ref("instrument_id", () => instruments.id),
    note: text("note"),
    takenAt: instantNow("taken_at"),
    recordedById: byUser("recorded_by_id"),
    supersededById: ref("superseded_by_id", (): AnyPgColumn => readings.id),
    createdAt: instantNow("created_at"),
    /** The id the tablet gave the reading when it was typed: a repeated send finds it instead of storing twice. */
    clientId: uuid("client_id"),
    /** The device's clock when the reading was entered; orders readings of one step from several tablets. */
    deviceTime: instant("device_time"),
  },
  (t) => [
    index("readings_job_idx").on(t.jobId, t.stepId, t.phase),
    uniqueIndex("readings_job_client_uq").on(t.jobId, t.clientId),
  ],
);
export type Reading = typeof readings.$inferSelect;

/**
 * Uploaded datasets. The original file is kept unchanged in object storage under a key we make
 * (never from the file name); parsed columns are stored in SI-based units in dataset_columns.
 */
export const datasets = pgTable(
  "datasets",
  {
    id: primaryId(),
    jobId: jobRef(),
    kind: datasetKindEnum("kind").notNull(),
    phase: phaseEnum("phase").notNull(),
    status: datasetStatusEnum("status").notNull().default("stored"),
    rows: integer("rows").notNull(),
    sha256: text("sha256").notNull(),
    storageKey: text("storage_key").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    /** Shown to people only; never used to build a storage key or a path. */
    originalFilename: text("original_filename").notNull(),
    contentType: text("content_type").notNull().default("text/csv"),
    /** The units chosen at upload, e.g. { units: "in" } or { travel_units, reading_units }. */
    units: jsonb("units").notNull(),
    options: jsonb("options"),
    warnings: jsonb("warnings").$type<string[]>().notNull().default([]),
    summary: jsonb("summary"),
    uploadedById: byUser("uploaded_by_id"),
    uploadedAt: instantNow("uploaded_at"),
    deletedAt: instant("deleted_at"),
    deletedById: byUser("deleted_by_id"),
  },
  (t) => [index("datasets_job_idx").on(t.jobId)],
);
export type Dataset = typeof datasets.$inferSelect;

/** Parsed numeric columns of a dataset, each a little-endian Float64Array in bytea. */
export const datasetColumns = pgTable(
  "dataset_columns",
  {
    datasetId: requiredRef("dataset_id", () => datasets.id, "cascade"),
    name: text("name").notNull(),
    unit: text("unit").notNull(),
    data: bytea("data").notNull(),
  },
  (t) => [uniqueIndex("dataset_columns_pk").on(t.datasetId, t.name)],
);

/** Stored objects, for the PostgreSQL fallback of the object-storage interface. */
export const storageObjects = pgTable("storage_objects", {
  key: text("key").primaryKey(),
  data: bytea("data").notNull(),
  sha256: text("sha256").notNull(),
  sizeBytes: integer("size_bytes").notNull(),
  contentType: text("content_type").notNull(),
  createdAt: instantNow("created_at"),
});

/** E-mail outbox: written in the transaction that causes the message; a worker sends it. */
export const outbox = pgTable(
  "outbox",
  {
    id: primaryId(),
    /** Makes a message idempotent: the same event never queues the same e-mail twice. */
    dedupeKey: text("dedupe_key").notNull().unique(),
    toAddress: text("to_address").notNull(),
    subject: text("subject").notNull(),
    textBody: text("text_body").notNull(),
    htmlBody: text("html_body"),
    status: outboxStatusEnum("status").notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: instantNow("next_attempt_at"),
    lastError: text("last_error"),
    jobId: ref("job_id", () => jobs.id, "set null"),
    createdAt: instantNow("created_at"),
    sentAt: instant("sent_at"),
  },
  (t) => [index("outbox_pending_idx").on(t.status, t.nextAttemptAt)],
);
export type OutboxMessage = typeof outbox.$inferSelect;

/** One-time tokens for invitations and password resets; only a hash of the token is stored. */
export const userTokens = pgTable(
  "user_tokens",
  {
    id: primaryId(),
    userId: requiredRef("user_id", () => users.id, "cascade"),
    purpose: text("purpose").notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    expiresAt: instant("expires_at").notNull(),
    usedAt: instant("used_at"),
    createdAt: instantNow("created_at"),
  },
  (t) => [index("user_tokens_user_idx").on(t.userId)],
);

/**
 * Report revisions. A row is written once, when the revision is issued: the PDF bytes, their
 * SHA-256 and the content it was rendered from. A trigger (migration 0004) refuses any UPDATE or
 * DELETE, so an issued revision can never change; a correction is a new row whose
 * `supersedes_id` names the revision it replaces.
 */
export const reports = pgTable(
  "reports",
  {
    id: primaryId(),
    jobId: jobRef(),
    revision: integer("revision").notNull(),
    supersedesId: ref("supersedes_id", (): AnyPgColumn => reports.id),
    amendmentReason: text("amendment_reason"),
    pdf: bytea("pdf").notNull(),
    pdfSha256: text("pdf_sha256").notNull(),
    contentSha256: text("content_sha256").notNull(),
    content: jsonb("content").notNull(),
    issuedAt: instantNow("issued_at"),
    issuedById: ref("issued_by_id", () => users.id),
  },
  (t) => [
    uniqueIndex("reports_job_revision_idx").on(t.jobId, t.revision),
    uniqueIndex("reports_supersedes_idx").on(t.supersedesId),
  ],
);
export type Report = typeof reports.$inferSelect;

/**
 * Electronic signatures (21 CFR 11.50: printed name, date-time and meaning). Before issue they
 * sign the job's work (performed, inspected, approved) and are printed in the PDF; after issue the
 * customer's acceptance or rejection signs the issued PDF's hash. Each carries the signed
 * manifest and its Ed25519 signature. Append-only (migration 0004).
 */
export const signatures = pgTable(
  "signatures",
  {
    id: primaryId(),
    jobId: jobRef(),
    reportId: ref("report_id", () => reports.id),
    meaning: signatureMeaningEnum("meaning").notNull(),
    signerId: requiredRef("signer_id", () => users.id),
    signerName: text("signer_name").notNull(),
    signerRole: roleEnum("signer_role").notNull(),
    signedAt: instant("signed_at").notNull(),
    comment: text("comment"),
    manifest: jsonb("manifest").notNull(),
    signature: text("signature").notNull(),
    keyId: text("key_id").notNull(),
  },
  (t) => [index("signatures_job_idx").on(t.jobId), index("signatures_report_idx").on(t.reportId)],
);
export type Signature = typeof signatures.$inferSelect;

/**
 * Computations run on a dataset (the head fit). `input_sha256` is SHA-256 over the dataset's
 * SHA-256 and the canonical JSON of the options and head configuration, so running the same input
 * with the same geometry version again finds the stored result instead of adding a copy.
 * `result` is geometry's JSON of the fit (headFitToJson) plus what the page draws (poses and
 * residuals per pose). Written once; never updated.
 */
export const analyses = pgTable(
  "analyses",
  {
    id: primaryId(),
    jobId: jobRef(),
    datasetId: requiredRef("dataset_id", () => datasets.id),
    kind: analysisKindEnum("kind").notNull().default("head_fit"),
    geometryVersion: text("geometry_version").notNull(),
    inputSha256: text("input_sha256").notNull(),
    options: jsonb("options").notNull(),
    result: jsonb("result").notNull(),
    createdById: byUser("created_by_id"),
    createdAt: instantNow("created_at"),
  },
  (t) => [
    uniqueIndex("analyses_input_idx").on(t.datasetId, t.inputSha256, t.geometryVersion),
    index("analyses_job_idx").on(t.jobId, t.createdAt),
  ],
);
export type Analysis = typeof analyses.$inferSelect;

/**
 * Limits for the fitted head parameters, per procedure template version (like a step's limits):
 * in the parameter's own unit (µm for lengths, arcsec for angles; null = no limit on that side),
 * judged with the decision rule against the fit's expanded uncertainty. `parameter` is
 * geometry's key (HeadParameterKey). A parameter without a row is printed as recorded.
 */
export const templateParameterLimits = pgTable(
  "template_parameter_limits",
  {
    id: primaryId(),
    templateId: requiredRef("template_id", () => procedureTemplates.id, "cascade"),
    parameter: text("parameter").notNull(),
    lowerLimit: doublePrecision("lower_limit"),
    upperLimit: doublePrecision("upper_limit"),
    decisionRule: decisionRuleEnum("decision_rule").notNull().default("simple"),
    limitSource: limitSourceEnum("limit_source").notNull(),
    limitSourceNote: text("limit_source_note"),
  },
  (t) => [uniqueIndex("template_parameter_limits_idx").on(t.templateId, t.parameter)],
);
export type TemplateParameterLimit = typeof templateParameterLimits.$inferSelect;

/** The axis of the head a rotary-positioning test is about: the primary (rotary) or secondary (tilt) axis. */
export const headAxisRoleEnum = pgEnum("head_axis_role", HEAD_AXIS_ROLES);

/**
 * Limits for the ISO 230-2 positioning quantities of the head's rotary axes, per procedure
 * template version: an upper limit in arc seconds for one quantity (A, E, M, R or B,
 * bidirectional) of one axis, with where it comes from. A procedure that carries a limit for an
 * axis asks for that axis's positioning test before the report is issued.
 */
export const templatePositioningLimits = pgTable(
  "template_positioning_limits",
  {
    id: primaryId(),
    templateId: requiredRef("template_id", () => procedureTemplates.id, "cascade"),
    axis: headAxisRoleEnum("axis").notNull(),
    quantity: text("quantity").notNull(),
    upperLimitArcsec: doublePrecision("upper_limit_arcsec").notNull(),
    limitSource: limitSourceEnum("limit_source").notNull(),
    limitSourceNote: text("limit_source_note"),
  },
  (t) => [
    uniqueIndex("template_positioning_limits_idx").on(t.templateId, t.axis, t.quantity),
    check("template_positioning_limits_quantity", sql`${t.quantity} in ('A', 'E', 'M', 'R', 'B')`),
    check("template_positioning_limits_upper", sql`${t.upperLimitArcsec} >= 0`),
  ],
);
export type TemplatePositioningLimit = typeof templatePositioningLimits.$inferSelect;

/**
 * A picture of the 3D view the engineer saved for the report: the PNG in object storage under a
 * key the server makes, with its SHA-256, the exaggeration factor it was drawn with, and, when
 * the view overlaid an earlier fit, which one. Written once; a new picture is a new row.
 */
export const analysisViews = pgTable(
  "analysis_views",
  {
    id: primaryId(),
    jobId: jobRef(),
    analysisId: requiredRef("analysis_id", () => analyses.id),
    /** The other phase's fit drawn with this one (before/after overlay), if any. */
    overlayAnalysisId: ref("overlay_analysis_id", () => analyses.id),
    storageKey: text("storage_key").notNull(),
    sha256: text("sha256").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    widthPx: integer("width_px").notNull(),
    heightPx: integer("height_px").notNull(),
    factor: doublePrecision("factor").notNull(),
    caption: text("caption"),
    createdById: byUser("created_by_id"),
    createdAt: instantNow("created_at"),
  },
  (t) => [index("analysis_views_job_idx").on(t.jobId, t.createdAt)],
);
export type AnalysisView = typeof analysisViews.$inferSelect;

/**
 * A result that does not conform (FAIL) or cannot be decided, carried into the report as a
 * deviation: what it concerns (`subject`: "step:{stepId}", "parameter:{key}" or
 * "test_part:{datasetId}:{row}"), the decision when it was recorded, the written justification
 * and the application engineer who approved carrying it. Written once; never updated.
 */
export const deviations = pgTable(
  "deviations",
  {
    id: primaryId(),
    jobId: jobRef(),
    subject: text("subject").notNull(),
    /** The result as the report names it, e.g. "Bore B, diameter" or "EC0C". */
    subjectLabel: text("subject_label").notNull(),
    decision: text("decision").notNull(),
    justification: text("justification").notNull(),
    approvedById: requiredRef("approved_by_id", () => users.id),
    approvedByName: text("approved_by_name").notNull(),
    createdAt: instantNow("created_at"),
  },
  (t) => [uniqueIndex("deviations_subject_idx").on(t.jobId, t.subject)],
);
export type Deviation = typeof deviations.$inferSelect;

/**
 * The environment at the machine while the work was done: air and machine temperature, entered
 * with the readings (several per job and phase). Appended, never edited.
 */
export const environmentRecords = pgTable(
  "environment_records",
  {
    id: primaryId(),
    jobId: jobRef(),
    phase: phaseEnum("phase").notNull(),
    airTempC: doublePrecision("air_temp_c"),
    machineTempC: doublePrecision("machine_temp_c"),
    note: text("note"),
    takenAt: instantNow("taken_at"),
    recordedById: byUser("recorded_by_id"),
    /** The id the tablet gave the record: a repeated send finds it instead of storing twice. */
    clientId: uuid("client_id"),
    createdAt: instantNow("created_at"),
  },
  (t) => [
    index("environment_records_job_idx").on(t.jobId, t.takenAt),
    uniqueIndex("environment_records_job_client_uq").on(t.jobId, t.clientId),
  ],
);
export type EnvironmentRecord = typeof environmentRecords.$inferSelect;

/**
 * Photos of a step (dial faces, set-ups, shims), taken on the tablet. The image is re-encoded by
 * the server (metadata stripped, turned upright) and stored with a thumbnail through lib/storage;
 * sha256 is of the stored image. Appended, never edited.
 */
export const photos = pgTable(
  "photos",
  {
    id: primaryId(),
    jobId: jobRef(),
    stepId: requiredRef("step_id", () => templateSteps.id),
    /** The reading it shows, when it was taken with one (null: a photo of the step itself). */
    readingId: ref("reading_id", () => readings.id),
    phase: phaseEnum("phase").notNull(),
    storageKey: text("storage_key").notNull(),
    thumbKey: text("thumb_key").notNull(),
    sha256: text("sha256").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    width: integer("width").notNull(),
    height: integer("height").notNull(),
    takenAt: instant("taken_at").notNull(),
    uploadedById: byUser("uploaded_by_id"),
    /** The id the tablet gave the photo: a repeated send finds it instead of storing twice. */
    clientId: uuid("client_id"),
    createdAt: instantNow("created_at"),
  },
  (t) => [
    index("photos_job_idx").on(t.jobId, t.stepId),
    uniqueIndex("photos_job_client_uq").on(t.jobId, t.clientId),
  ],
);
export type Photo = typeof photos.$inferSelect;

/**
 * The company that issues the reports (ISO/IEC 17025:2017 §7.8.2.1 b): one row (id 1), kept by the
 * administrator at /registers/settings. Empty name or address blocks issuing a report.
 */
export const issuerSettings = pgTable(
  "issuer_settings",
  {
    id: integer("id").primaryKey().default(1),
    name: text("name").notNull().default(""),
    address: text("address").notNull().default(""),
    contactEmail: text("contact_email").notNull().default(""),
    contactPhone: text("contact_phone").notNull().default(""),
    /** Accreditation body, number and scope as the issuer states it; empty when not accredited. */
    accreditation: text("accreditation").notNull().default(""),
    /** The statement about reproducing the report only in full. */
    reproductionStatement: text("reproduction_statement").notNull().default(""),
    updatedById: byUser("updated_by_id"),
    updatedAt: instantNow("updated_at"),
  },
  (t) => [check("issuer_settings_single_row", sql`${t.id} = 1`)],
);
export type IssuerSettings = typeof issuerSettings.$inferSelect;

/**
 * The engineer's choice of saved 3D views for the report: one row per view (included or not),
 * changed by upsert with an audit event. Only views of the approved fit of at least 600 × 400 px
 * may be included (lib/report/view-choice.ts); analysis_views itself is written once.
 */
export const reportViews = pgTable(
  "report_views",
  {
    viewId: ref("view_id", () => analysisViews.id).primaryKey(),
    jobId: jobRef(),
    included: boolean("included").notNull(),
    chosenById: byUser("chosen_by_id"),
    chosenAt: instantNow("chosen_at"),
  },
  (t) => [index("report_views_job_idx").on(t.jobId)],
);
export type ReportView = typeof reportViews.$inferSelect;

/**
 * Instruments used for a job's measurement data rather than for a checklist reading: the touch
 * probe, the reference sphere and any CMM (lib/domain/instruments DATA_INSTRUMENT_USES). Written
 * once, audited; printed with their calibration on the report.
 */
export const jobInstruments = pgTable(
  "job_instruments",
  {
    id: primaryId(),
    jobId: jobRef(),
    instrumentId: requiredRef("instrument_id", () => instruments.id),
    use: text("use").notNull(),
    recordedById: byUser("recorded_by_id"),
    recordedAt: instantNow("recorded_at"),
  },
  (t) => [uniqueIndex("job_instruments_uq").on(t.jobId, t.instrumentId, t.use)],
);
export type JobInstrument = typeof jobInstruments.$inferSelect;

export const controlValueStageEnum = pgEnum("control_value_stage", CONTROL_VALUE_STAGES);

/**
 * The control's kinematic values for a job's head, as found before the adjustment and as left
 * after it (lib/domain/control-values: lengths in mm, angles in degrees, whatever the control's
 * units). `unit_system` is the control's, so the values are shown as the control holds them. An
 * as-left record names the approved analysis its values to enter were computed from. Written once;
 * a correction is a new row and the newest of a stage is the current one.
 */
export const controlValueRecords = pgTable(
  "control_value_records",
  {
    id: primaryId(),
    jobId: jobRef(),
    stage: controlValueStageEnum("stage").notNull(),
    unitSystem: unitSystemEnum("unit_system").notNull(),
    values: jsonb("values").$type<ControlValueSet>().notNull(),
    analysisId: ref("analysis_id", () => analyses.id),
    note: text("note"),
    recordedById: byUser("recorded_by_id"),
    createdAt: instantNow("created_at"),
  },
  (t) => [index("control_value_records_job_idx").on(t.jobId, t.stage, t.createdAt)],
);
export type ControlValueRecord = typeof controlValueRecords.$inferSelect;

/**
 * The Type B inputs of a head fit's uncertainty budget (JCGM 100), chosen by the engineer: which
 * registered instruments (probe, reference sphere, tool-length presetter) and temperature band, and
 * the standard uncertainties they gave at the time (µm, K, 1/K, mm), so the budget in the report is
 * reproducible when a register changes later. Written once; a new choice is a new row.
 */
export const analysisBudgetInputs = pgTable(
  "analysis_budget_inputs",
  {
    id: primaryId(),
    jobId: jobRef(),
    analysisId: requiredRef("analysis_id", () => analyses.id),
    probeInstrumentId: ref("probe_instrument_id", () => instruments.id),
    sphereInstrumentId: ref("sphere_instrument_id", () => instruments.id),
    presetterInstrumentId: ref("presetter_instrument_id", () => instruments.id),
    /** geometry's BudgetTypeB as resolved when chosen: uProbeUm, uSphereUm, uToolUm, deltaTK, alphaPerK, lengthMm. */
    inputs: jsonb("inputs").$type<Record<string, number>>().notNull(),
    createdById: byUser("created_by_id"),
    createdAt: instantNow("created_at"),
  },
  (t) => [index("analysis_budget_inputs_analysis_idx").on(t.analysisId, t.createdAt)],
);
export type AnalysisBudgetInput = typeof analysisBudgetInputs.$inferSelect;
