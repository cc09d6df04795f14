CREATE TYPE "public"."head_axis_role" AS ENUM('primary', 'secondary');--> statement-breakpoint
ALTER TYPE "public"."dataset_kind" ADD VALUE 'rotary_positioning';--> statement-breakpoint
CREATE TABLE "template_positioning_limits" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"template_id" uuid NOT NULL,
	"axis" "head_axis_role" NOT NULL,
	"quantity" text NOT NULL,
	"upper_limit_arcsec" double precision NOT NULL,
	"limit_source" "limit_source" NOT NULL,
	"limit_source_note" text,
	CONSTRAINT "template_positioning_limits_quantity" CHECK ("template_positioning_limits"."quantity" in ('A', 'E', 'M', 'R', 'B')),
	CONSTRAINT "template_positioning_limits_upper" CHECK ("template_positioning_limits"."upper_limit_arcsec" >= 0)
);
--> statement-breakpoint
ALTER TABLE "template_positioning_limits" ADD CONSTRAINT "template_positioning_limits_template_id_procedure_templates_id_fk" FOREIGN KEY ("template_id") REFERENCES "public"."procedure_templates"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "template_positioning_limits_idx" ON "template_positioning_limits" USING btree ("template_id","axis","quantity");