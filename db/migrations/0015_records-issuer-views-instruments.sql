CREATE TABLE "issuer_settings" (
	"id" integer PRIMARY KEY DEFAULT 1 NOT NULL,
	"name" text DEFAULT '' NOT NULL,
	"address" text DEFAULT '' NOT NULL,
	"contact_email" text DEFAULT '' NOT NULL,
	"contact_phone" text DEFAULT '' NOT NULL,
	"accreditation" text DEFAULT '' NOT NULL,
	"reproduction_statement" text DEFAULT '' NOT NULL,
	"updated_by_id" uuid,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "issuer_settings_single_row" CHECK ("issuer_settings"."id" = 1)
);
--> statement-breakpoint
CREATE TABLE "job_instruments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"instrument_id" uuid NOT NULL,
	"use" text NOT NULL,
	"recorded_by_id" uuid,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "report_views" (
	"view_id" uuid PRIMARY KEY NOT NULL,
	"job_id" uuid NOT NULL,
	"included" boolean NOT NULL,
	"chosen_by_id" uuid,
	"chosen_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "instruments" ADD COLUMN "calibrated_size_mm" double precision;--> statement-breakpoint
ALTER TABLE "issuer_settings" ADD CONSTRAINT "issuer_settings_updated_by_id_users_id_fk" FOREIGN KEY ("updated_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_instruments" ADD CONSTRAINT "job_instruments_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_instruments" ADD CONSTRAINT "job_instruments_instrument_id_instruments_id_fk" FOREIGN KEY ("instrument_id") REFERENCES "public"."instruments"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_instruments" ADD CONSTRAINT "job_instruments_recorded_by_id_users_id_fk" FOREIGN KEY ("recorded_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "report_views" ADD CONSTRAINT "report_views_view_id_analysis_views_id_fk" FOREIGN KEY ("view_id") REFERENCES "public"."analysis_views"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "report_views" ADD CONSTRAINT "report_views_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "report_views" ADD CONSTRAINT "report_views_chosen_by_id_users_id_fk" FOREIGN KEY ("chosen_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "job_instruments_uq" ON "job_instruments" USING btree ("job_id","instrument_id","use");--> statement-breakpoint
CREATE INDEX "report_views_job_idx" ON "report_views" USING btree ("job_id");