CREATE TYPE "public"."analysis_kind" AS ENUM('head_fit');--> statement-breakpoint
CREATE TABLE "analyses" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"dataset_id" uuid NOT NULL,
	"kind" "analysis_kind" DEFAULT 'head_fit' NOT NULL,
	"geometry_version" text NOT NULL,
	"input_sha256" text NOT NULL,
	"options" jsonb NOT NULL,
	"result" jsonb NOT NULL,
	"created_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_dataset_id_datasets_id_fk" FOREIGN KEY ("dataset_id") REFERENCES "public"."datasets"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "analyses_input_idx" ON "analyses" USING btree ("dataset_id","input_sha256","geometry_version");--> statement-breakpoint
CREATE INDEX "analyses_job_idx" ON "analyses" USING btree ("job_id","created_at");