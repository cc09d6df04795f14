CREATE TABLE "analysis_views" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"analysis_id" uuid NOT NULL,
	"overlay_analysis_id" uuid,
	"storage_key" text NOT NULL,
	"sha256" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"width_px" integer NOT NULL,
	"height_px" integer NOT NULL,
	"factor" double precision NOT NULL,
	"caption" text,
	"created_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "template_parameter_limits" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"template_id" uuid NOT NULL,
	"parameter" text NOT NULL,
	"lower_limit" double precision,
	"upper_limit" double precision,
	"decision_rule" "decision_rule" DEFAULT 'simple' NOT NULL,
	"limit_source" "limit_source" NOT NULL,
	"limit_source_note" text
);
--> statement-breakpoint
ALTER TABLE "analysis_views" ADD CONSTRAINT "analysis_views_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_views" ADD CONSTRAINT "analysis_views_analysis_id_analyses_id_fk" FOREIGN KEY ("analysis_id") REFERENCES "public"."analyses"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_views" ADD CONSTRAINT "analysis_views_overlay_analysis_id_analyses_id_fk" FOREIGN KEY ("overlay_analysis_id") REFERENCES "public"."analyses"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_views" ADD CONSTRAINT "analysis_views_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "template_parameter_limits" ADD CONSTRAINT "template_parameter_limits_template_id_procedure_templates_id_fk" FOREIGN KEY ("template_id") REFERENCES "public"."procedure_templates"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "analysis_views_job_idx" ON "analysis_views" USING btree ("job_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "template_parameter_limits_idx" ON "template_parameter_limits" USING btree ("template_id","parameter");--> statement-breakpoint
-- A saved picture of the 3D view may be printed in an issued report: it is written once.
CREATE TRIGGER analysis_views_immutable BEFORE UPDATE OR DELETE ON analysis_views
  FOR EACH ROW EXECUTE FUNCTION refuse_change_of_signed_record();
