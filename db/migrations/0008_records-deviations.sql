CREATE TABLE "deviations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"subject" text NOT NULL,
	"subject_label" text NOT NULL,
	"decision" text NOT NULL,
	"justification" text NOT NULL,
	"approved_by_id" uuid NOT NULL,
	"approved_by_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "deviations" ADD CONSTRAINT "deviations_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deviations" ADD CONSTRAINT "deviations_approved_by_id_users_id_fk" FOREIGN KEY ("approved_by_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "deviations_subject_idx" ON "deviations" USING btree ("job_id","subject");--> statement-breakpoint
-- A recorded deviation is part of the signed record: never edited or removed (function from 0004).
CREATE TRIGGER deviations_immutable BEFORE UPDATE OR DELETE ON deviations
  FOR EACH ROW EXECUTE FUNCTION refuse_change_of_signed_record();
