CREATE TYPE "public"."webhook_event_status" AS ENUM('processed', 'ignored', 'rejected');--> statement-breakpoint
ALTER TABLE "webhook_events" ADD COLUMN "status" "webhook_event_status" DEFAULT 'processed' NOT NULL;--> statement-breakpoint
ALTER TABLE "webhook_events" ADD COLUMN "detail" text;