CREATE TABLE "photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"job_id" uuid NOT NULL,
	"step_id" uuid NOT NULL,
	"reading_id" uuid,
	"phase" "phase" NOT NULL,
	"storage_key" text NOT NULL,
	"thumb_key" text NOT NULL,
	"sha256" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"taken_at" timestamp with time zone NOT NULL,
	"uploaded_by_id" uuid,
	"client_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "instruments" ADD COLUMN "range_min" double precision;--> statement-breakpoint
ALTER TABLE "instruments" ADD COLUMN "range_max" double precision;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_step_id_template_steps_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."template_steps"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_reading_id_readings_id_fk" FOREIGN KEY ("reading_id") REFERENCES "public"."readings"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_uploaded_by_id_users_id_fk" FOREIGN KEY ("uploaded_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "photos_job_idx" ON "photos" USING btree ("job_id","step_id");--> statement-breakpoint
CREATE UNIQUE INDEX "photos_job_client_uq" ON "photos" USING btree ("job_id","client_id");--> statement-breakpoint
-- Photos are appended, never changed (hand-written; keep when regenerating).
CREATE TRIGGER photos_immutable BEFORE UPDATE OR DELETE ON photos
  FOR EACH ROW EXECUTE FUNCTION refuse_change_of_signed_record();
