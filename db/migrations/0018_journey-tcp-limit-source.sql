ALTER TABLE "procedure_templates" ADD COLUMN "tcp_limit_source" "limit_source";--> statement-breakpoint
ALTER TABLE "procedure_templates" ADD COLUMN "tcp_limit_source_note" text;