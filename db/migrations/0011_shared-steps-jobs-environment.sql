CREATE TYPE "public"."multi_point_result" AS ENUM('tir', 'mean', 'flatness');--> statement-breakpoint
ALTER TYPE "public"."step_derivation" ADD VALUE 'multi_point';--> statement-breakpoint
ALTER TYPE "public"."step_derivation" ADD VALUE 'record';--> statement-breakpoint
ALTER TYPE "public"."step_derivation" ADD VALUE 'note';--> statement-breakpoint
CREATE TABLE "environment_records" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"phase" "phase" NOT NULL,
	"air_temp_c" double precision,
	"machine_temp_c" double precision,
	"note" text,
	"taken_at" timestamp with time zone DEFAULT now() NOT NULL,
	"recorded_by_id" uuid,
	"client_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "jobs" ADD COLUMN "time_zone" text;--> statement-breakpoint
ALTER TABLE "jobs" ADD COLUMN "order_reference" text;--> statement-breakpoint
ALTER TABLE "jobs" ADD COLUMN "customer_contact_name" text;--> statement-breakpoint
ALTER TABLE "jobs" ADD COLUMN "customer_contact_email" text;--> statement-breakpoint
ALTER TABLE "jobs" ADD COLUMN "condition_as_found" text;--> statement-breakpoint
ALTER TABLE "jobs" ADD COLUMN "next_recheck_on" date;--> statement-breakpoint
ALTER TABLE "procedure_templates" ADD COLUMN "job_kinds" "job_kind"[];--> statement-breakpoint
ALTER TABLE "procedure_templates" ADD COLUMN "head_model" text;--> statement-breakpoint
ALTER TABLE "procedure_templates" ADD COLUMN "retired_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "readings" ADD COLUMN "text_value" text;--> statement-breakpoint
ALTER TABLE "template_steps" ADD COLUMN "points" jsonb;--> statement-breakpoint
ALTER TABLE "template_steps" ADD COLUMN "point_result" "multi_point_result";--> statement-breakpoint
ALTER TABLE "template_steps" ADD COLUMN "record_unit" text;--> statement-breakpoint
ALTER TABLE "template_steps" ADD COLUMN "photo_required" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "environment_records" ADD CONSTRAINT "environment_records_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "environment_records" ADD CONSTRAINT "environment_records_recorded_by_id_users_id_fk" FOREIGN KEY ("recorded_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "environment_records_job_idx" ON "environment_records" USING btree ("job_id","taken_at");--> statement-breakpoint
CREATE UNIQUE INDEX "environment_records_job_client_uq" ON "environment_records" USING btree ("job_id","client_id");--> statement-breakpoint
-- Environment records are appended, never changed (hand-written; keep when regenerating).
CREATE TRIGGER environment_records_immutable BEFORE UPDATE OR DELETE ON environment_records
  FOR EACH ROW EXECUTE FUNCTION refuse_change_of_signed_record();
