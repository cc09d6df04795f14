CREATE TYPE "public"."dataset_kind" AS ENUM('sphere_probe', 'tram', 'sweep', 'test_part');--> statement-breakpoint
CREATE TYPE "public"."dataset_status" AS ENUM('stored', 'deleted');--> statement-breakpoint
CREATE TYPE "public"."limit_source" AS ENUM('standard', 'maker_manual', 'common_practice', 'customer_spec');--> statement-breakpoint
CREATE TYPE "public"."outbox_status" AS ENUM('pending', 'sent', 'failed');--> statement-breakpoint
CREATE TYPE "public"."phase" AS ENUM('pre', 'post');--> statement-breakpoint
CREATE TYPE "public"."quantity_kind" AS ENUM('length', 'angle');--> statement-breakpoint
CREATE TYPE "public"."step_derivation" AS ENUM('direct', 'angle_over_distance', 'sweep_flatness', 'check');--> statement-breakpoint
CREATE TABLE "dataset_columns" (
	"dataset_id" uuid NOT NULL,
	"name" text NOT NULL,
	"unit" text NOT NULL,
	"data" "bytea" NOT NULL
);
--> statement-breakpoint
CREATE TABLE "datasets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"kind" "dataset_kind" NOT NULL,
	"phase" "phase" NOT NULL,
	"status" "dataset_status" DEFAULT 'stored' NOT NULL,
	"rows" integer NOT NULL,
	"sha256" text NOT NULL,
	"storage_key" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"original_filename" text NOT NULL,
	"content_type" text DEFAULT 'text/csv' NOT NULL,
	"units" jsonb NOT NULL,
	"options" jsonb,
	"warnings" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"summary" jsonb,
	"uploaded_by_id" uuid,
	"uploaded_at" timestamp with time zone DEFAULT now() NOT NULL,
	"deleted_at" timestamp with time zone,
	"deleted_by_id" uuid
);
--> statement-breakpoint
CREATE TABLE "instruments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"kind" text NOT NULL,
	"serial" text NOT NULL,
	"maker" text,
	"model" text,
	"quantity_kind" "quantity_kind" DEFAULT 'length' NOT NULL,
	"resolution" double precision NOT NULL,
	"standard_uncertainty" double precision NOT NULL,
	"calibrated_on" date,
	"calibration_due_on" date NOT NULL,
	"certificate_ref" text,
	"retired" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "instruments_serial_unique" UNIQUE("serial")
);
--> statement-breakpoint
CREATE TABLE "outbox" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"dedupe_key" text NOT NULL,
	"to_address" text NOT NULL,
	"subject" text NOT NULL,
	"text_body" text NOT NULL,
	"html_body" text,
	"status" "outbox_status" DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"next_attempt_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_error" text,
	"job_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone,
	CONSTRAINT "outbox_dedupe_key_unique" UNIQUE("dedupe_key")
);
--> statement-breakpoint
CREATE TABLE "procedure_templates" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"version" integer NOT NULL,
	"description" text,
	"is_current" boolean DEFAULT true NOT NULL,
	"created_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "readings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"step_id" uuid NOT NULL,
	"phase" "phase" NOT NULL,
	"value" double precision NOT NULL,
	"entered_value" double precision NOT NULL,
	"entered_unit" text NOT NULL,
	"inputs" jsonb,
	"instrument_id" uuid,
	"note" text,
	"taken_at" timestamp with time zone DEFAULT now() NOT NULL,
	"recorded_by_id" uuid,
	"superseded_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "storage_objects" (
	"key" text PRIMARY KEY NOT NULL,
	"data" "bytea" NOT NULL,
	"sha256" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"content_type" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "template_steps" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"template_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"title" text NOT NULL,
	"instructions" text,
	"quantity" text NOT NULL,
	"quantity_kind" "quantity_kind" NOT NULL,
	"derivation" "step_derivation" DEFAULT 'direct' NOT NULL,
	"distance_mm" double precision,
	"lower_limit" double precision,
	"upper_limit" double precision,
	"decision_rule" "decision_rule" DEFAULT 'simple' NOT NULL,
	"limit_source" "limit_source" NOT NULL,
	"limit_source_note" text,
	"safety_note" text
);
--> statement-breakpoint
CREATE TABLE "user_tokens" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"purpose" text NOT NULL,
	"token_hash" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"used_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "user_tokens_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
ALTER TABLE "jobs" ADD COLUMN "template_id" uuid;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "sessions_valid_after" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "dataset_columns" ADD CONSTRAINT "dataset_columns_dataset_id_datasets_id_fk" FOREIGN KEY ("dataset_id") REFERENCES "public"."datasets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "datasets" ADD CONSTRAINT "datasets_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "datasets" ADD CONSTRAINT "datasets_uploaded_by_id_users_id_fk" FOREIGN KEY ("uploaded_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "datasets" ADD CONSTRAINT "datasets_deleted_by_id_users_id_fk" FOREIGN KEY ("deleted_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outbox" ADD CONSTRAINT "outbox_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "procedure_templates" ADD CONSTRAINT "procedure_templates_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "readings" ADD CONSTRAINT "readings_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "readings" ADD CONSTRAINT "readings_step_id_template_steps_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."template_steps"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "readings" ADD CONSTRAINT "readings_instrument_id_instruments_id_fk" FOREIGN KEY ("instrument_id") REFERENCES "public"."instruments"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "readings" ADD CONSTRAINT "readings_recorded_by_id_users_id_fk" FOREIGN KEY ("recorded_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "readings" ADD CONSTRAINT "readings_superseded_by_id_readings_id_fk" FOREIGN KEY ("superseded_by_id") REFERENCES "public"."readings"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "template_steps" ADD CONSTRAINT "template_steps_template_id_procedure_templates_id_fk" FOREIGN KEY ("template_id") REFERENCES "public"."procedure_templates"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "user_tokens" ADD CONSTRAINT "user_tokens_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "dataset_columns_pk" ON "dataset_columns" USING btree ("dataset_id","name");--> statement-breakpoint
CREATE INDEX "datasets_job_idx" ON "datasets" USING btree ("job_id");--> statement-breakpoint
CREATE INDEX "outbox_pending_idx" ON "outbox" USING btree ("status","next_attempt_at");--> statement-breakpoint
CREATE UNIQUE INDEX "procedure_templates_name_version_idx" ON "procedure_templates" USING btree ("name","version");--> statement-breakpoint
CREATE INDEX "readings_job_idx" ON "readings" USING btree ("job_id","step_id","phase");--> statement-breakpoint
CREATE UNIQUE INDEX "template_steps_position_idx" ON "template_steps" USING btree ("template_id","position");--> statement-breakpoint
CREATE INDEX "user_tokens_user_idx" ON "user_tokens" USING btree ("user_id");--> statement-breakpoint
ALTER TABLE "jobs" ADD CONSTRAINT "jobs_template_id_procedure_templates_id_fk" FOREIGN KEY ("template_id") REFERENCES "public"."procedure_templates"("id") ON DELETE restrict ON UPDATE no action;