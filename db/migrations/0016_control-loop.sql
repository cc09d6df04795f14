CREATE TYPE "public"."control_value_stage" AS ENUM('as_found', 'as_left');--> statement-breakpoint
ALTER TYPE "public"."dataset_kind" ADD VALUE 'tcp_check';--> statement-breakpoint
CREATE TABLE "analysis_budget_inputs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"analysis_id" uuid NOT NULL,
	"probe_instrument_id" uuid,
	"sphere_instrument_id" uuid,
	"presetter_instrument_id" uuid,
	"inputs" jsonb NOT NULL,
	"created_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "control_value_records" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"stage" "control_value_stage" NOT NULL,
	"unit_system" "unit_system" NOT NULL,
	"values" jsonb NOT NULL,
	"analysis_id" uuid,
	"note" text,
	"recorded_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "procedure_templates" ADD COLUMN "tcp_check_required" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "procedure_templates" ADD COLUMN "tcp_range_limit_um" double precision;--> statement-breakpoint
ALTER TABLE "procedure_templates" ADD COLUMN "tcp_deviation_limit_um" double precision;--> statement-breakpoint
ALTER TABLE "analysis_budget_inputs" ADD CONSTRAINT "analysis_budget_inputs_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_budget_inputs" ADD CONSTRAINT "analysis_budget_inputs_analysis_id_analyses_id_fk" FOREIGN KEY ("analysis_id") REFERENCES "public"."analyses"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_budget_inputs" ADD CONSTRAINT "analysis_budget_inputs_probe_instrument_id_instruments_id_fk" FOREIGN KEY ("probe_instrument_id") REFERENCES "public"."instruments"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_budget_inputs" ADD CONSTRAINT "analysis_budget_inputs_sphere_instrument_id_instruments_id_fk" FOREIGN KEY ("sphere_instrument_id") REFERENCES "public"."instruments"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_budget_inputs" ADD CONSTRAINT "analysis_budget_inputs_presetter_instrument_id_instruments_id_fk" FOREIGN KEY ("presetter_instrument_id") REFERENCES "public"."instruments"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_budget_inputs" ADD CONSTRAINT "analysis_budget_inputs_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "control_value_records" ADD CONSTRAINT "control_value_records_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "control_value_records" ADD CONSTRAINT "control_value_records_analysis_id_analyses_id_fk" FOREIGN KEY ("analysis_id") REFERENCES "public"."analyses"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "control_value_records" ADD CONSTRAINT "control_value_records_recorded_by_id_users_id_fk" FOREIGN KEY ("recorded_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "analysis_budget_inputs_analysis_idx" ON "analysis_budget_inputs" USING btree ("analysis_id","created_at");--> statement-breakpoint
CREATE INDEX "control_value_records_job_idx" ON "control_value_records" USING btree ("job_id","stage","created_at");--> statement-breakpoint
-- Hand-written: control values and budget inputs are records someone relies on; a correction is a new row.
CREATE TRIGGER control_value_records_immutable BEFORE UPDATE OR DELETE ON control_value_records
  FOR EACH ROW EXECUTE FUNCTION refuse_change_of_signed_record();--> statement-breakpoint
CREATE TRIGGER control_value_records_no_truncate BEFORE TRUNCATE ON control_value_records
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_signed_record();--> statement-breakpoint
CREATE TRIGGER analysis_budget_inputs_immutable BEFORE UPDATE OR DELETE ON analysis_budget_inputs
  FOR EACH ROW EXECUTE FUNCTION refuse_change_of_signed_record();--> statement-breakpoint
CREATE TRIGGER analysis_budget_inputs_no_truncate BEFORE TRUNCATE ON analysis_budget_inputs
  FOR EACH STATEMENT EXECUTE FUNCTION refuse_change_of_signed_record();
