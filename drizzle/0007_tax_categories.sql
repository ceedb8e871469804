ALTER TYPE "public"."document_kind" ADD VALUE 'credit_note';--> statement-breakpoint
CREATE TABLE "credit_notes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"studio_id" uuid NOT NULL,
	"commission_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"refund_id" uuid NOT NULL,
	"payment_id" uuid NOT NULL,
	"corrects_id" uuid,
	"currency" text NOT NULL,
	"minor_digits" smallint NOT NULL,
	"content" jsonb NOT NULL,
	"total_minor" integer NOT NULL,
	"issued_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "credit_notes_refund_id_unique" UNIQUE("refund_id"),
	CONSTRAINT "credit_notes_negative" CHECK ("credit_notes"."total_minor" < 0)
);
--> statement-breakpoint
ALTER TABLE "studios" ADD COLUMN "legal_name" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "credit_notes" ADD CONSTRAINT "credit_notes_studio_id_studios_id_fk" FOREIGN KEY ("studio_id") REFERENCES "public"."studios"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "credit_notes" ADD CONSTRAINT "credit_notes_commission_id_commissions_id_fk" FOREIGN KEY ("commission_id") REFERENCES "public"."commissions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "credit_notes" ADD CONSTRAINT "credit_notes_refund_id_refunds_id_fk" FOREIGN KEY ("refund_id") REFERENCES "public"."refunds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "credit_notes" ADD CONSTRAINT "credit_notes_payment_id_payments_id_fk" FOREIGN KEY ("payment_id") REFERENCES "public"."payments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "credit_notes" ADD CONSTRAINT "credit_notes_corrects_id_invoices_id_fk" FOREIGN KEY ("corrects_id") REFERENCES "public"."invoices"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "credit_notes_studio_number" ON "credit_notes" USING btree ("studio_id","number");--> statement-breakpoint
CREATE INDEX "credit_notes_commission" ON "credit_notes" USING btree ("commission_id");