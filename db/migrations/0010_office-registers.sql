CREATE TABLE "instrument_calibrations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"instrument_id" uuid NOT NULL,
	"calibrated_on" date NOT NULL,
	"due_on" date NOT NULL,
	"certificate_ref" text NOT NULL,
	"laboratory" text NOT NULL,
	"recorded_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "customers" ADD COLUMN "retired_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "heads" ADD COLUMN "retired_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "instruments" ADD COLUMN "retired_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "machines" ADD COLUMN "retired_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "sites" ADD COLUMN "retired_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "instrument_calibrations" ADD CONSTRAINT "instrument_calibrations_instrument_id_instruments_id_fk" FOREIGN KEY ("instrument_id") REFERENCES "public"."instruments"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "instrument_calibrations" ADD CONSTRAINT "instrument_calibrations_recorded_by_id_users_id_fk" FOREIGN KEY ("recorded_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "instrument_calibrations_instrument_idx" ON "instrument_calibrations" USING btree ("instrument_id","calibrated_on");--> statement-breakpoint
UPDATE "instruments" SET "retired_at" = "updated_at" WHERE "retired";
