ALTER TABLE "time_entries" ADD COLUMN "running_since" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "time_entries" ADD COLUMN "banked_seconds" integer DEFAULT 0 NOT NULL;