ALTER TYPE "public"."job_status" ADD VALUE 'on_hold';--> statement-breakpoint
ALTER TYPE "public"."job_status" ADD VALUE 'cancelled';--> statement-breakpoint
ALTER TABLE "jobs" ADD COLUMN "held_from_status" "job_status";--> statement-breakpoint
ALTER TABLE "jobs" ADD COLUMN "hold_reason" text;--> statement-breakpoint
ALTER TABLE "jobs" ADD COLUMN "cancel_reason" text;