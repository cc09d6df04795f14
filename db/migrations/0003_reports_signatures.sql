CREATE TYPE "public"."signature_meaning" AS ENUM('performed', 'inspected', 'approved', 'accepted', 'rejected');--> statement-breakpoint
CREATE TABLE "reports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"revision" integer NOT NULL,
	"supersedes_id" uuid,
	"amendment_reason" text,
	"pdf" "bytea" NOT NULL,
	"pdf_sha256" text NOT NULL,
	"content_sha256" text NOT NULL,
	"content" jsonb NOT NULL,
	"issued_at" timestamp with time zone DEFAULT now() NOT NULL,
	"issued_by_id" uuid
);
--> statement-breakpoint
CREATE TABLE "signatures" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"report_id" uuid,
	"meaning" "signature_meaning" NOT NULL,
	"signer_id" uuid NOT NULL,
	"signer_name" text NOT NULL,
	"signer_role" "role" NOT NULL,
	"signed_at" timestamp with time zone NOT NULL,
	"comment" text,
	"manifest" jsonb NOT NULL,
	"signature" text NOT NULL,
	"key_id" text NOT NULL
);
--> statement-breakpoint
ALTER TABLE "reports" ADD CONSTRAINT "reports_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reports" ADD CONSTRAINT "reports_supersedes_id_reports_id_fk" FOREIGN KEY ("supersedes_id") REFERENCES "public"."reports"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reports" ADD CONSTRAINT "reports_issued_by_id_users_id_fk" FOREIGN KEY ("issued_by_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signatures" ADD CONSTRAINT "signatures_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signatures" ADD CONSTRAINT "signatures_report_id_reports_id_fk" FOREIGN KEY ("report_id") REFERENCES "public"."reports"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "signatures" ADD CONSTRAINT "signatures_signer_id_users_id_fk" FOREIGN KEY ("signer_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "reports_job_revision_idx" ON "reports" USING btree ("job_id","revision");--> statement-breakpoint
CREATE UNIQUE INDEX "reports_supersedes_idx" ON "reports" USING btree ("supersedes_id");--> statement-breakpoint
CREATE INDEX "signatures_job_idx" ON "signatures" USING btree ("job_id");--> statement-breakpoint
CREATE INDEX "signatures_report_idx" ON "signatures" USING btree ("report_id");