ALTER TABLE "readings" ADD COLUMN "client_id" uuid;--> statement-breakpoint
ALTER TABLE "readings" ADD COLUMN "device_time" timestamp with time zone;--> statement-breakpoint
CREATE UNIQUE INDEX "readings_job_client_uq" ON "readings" USING btree ("job_id","client_id");