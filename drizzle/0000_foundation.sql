CREATE TYPE "public"."member_role" AS ENUM('owner', 'assistant');--> statement-breakpoint
CREATE TYPE "public"."actor_role" AS ENUM('owner', 'assistant', 'client', 'system');--> statement-breakpoint
CREATE TYPE "public"."commission_state" AS ENUM('enquiry', 'quoting', 'quote_sent', 'booked', 'designing', 'proof_sent', 'proof_approved', 'in_production', 'ready', 'balance_paid', 'shipped', 'delivered', 'closed', 'declined', 'cancelled', 'paused');--> statement-breakpoint
CREATE TYPE "public"."garment_kind" AS ENUM('mittens', 'hat', 'pullover');--> statement-breakpoint
CREATE TYPE "public"."wearer" AS ENUM('adult', 'teen', 'child', 'baby');--> statement-breakpoint
CREATE TABLE "account" (
	"id" text PRIMARY KEY NOT NULL,
	"account_id" text NOT NULL,
	"provider_id" text NOT NULL,
	"user_id" text NOT NULL,
	"access_token" text,
	"refresh_token" text,
	"id_token" text,
	"access_token_expires_at" timestamp with time zone,
	"refresh_token_expires_at" timestamp with time zone,
	"scope" text,
	"password" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "rate_limit" (
	"id" text PRIMARY KEY NOT NULL,
	"key" text NOT NULL,
	"count" integer NOT NULL,
	"last_request" bigint NOT NULL,
	CONSTRAINT "rate_limit_key_unique" UNIQUE("key")
);
--> statement-breakpoint
CREATE TABLE "session" (
	"id" text PRIMARY KEY NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"token" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"ip_address" text,
	"user_agent" text,
	"user_id" text NOT NULL,
	CONSTRAINT "session_token_unique" UNIQUE("token")
);
--> statement-breakpoint
CREATE TABLE "user" (
	"id" text PRIMARY KEY NOT NULL,
	"name" text NOT NULL,
	"email" text NOT NULL,
	"email_verified" boolean DEFAULT false NOT NULL,
	"image" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "user_email_unique" UNIQUE("email")
);
--> statement-breakpoint
CREATE TABLE "verification" (
	"id" text PRIMARY KEY NOT NULL,
	"identifier" text NOT NULL,
	"value" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "studio_clients" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"studio_id" uuid NOT NULL,
	"user_id" text NOT NULL,
	"display_name" text NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "studio_invitations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"studio_id" uuid NOT NULL,
	"email" text NOT NULL,
	"role" "member_role" DEFAULT 'assistant' NOT NULL,
	"token_hash" text NOT NULL,
	"invited_by" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"accepted_at" timestamp with time zone,
	"accepted_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "studio_invitations_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE TABLE "studio_members" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"studio_id" uuid NOT NULL,
	"user_id" text NOT NULL,
	"role" "member_role" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "studios" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"slug" text NOT NULL,
	"name" text NOT NULL,
	"tagline" text DEFAULT '' NOT NULL,
	"about" text DEFAULT '' NOT NULL,
	"makes" text[] DEFAULT '{}'::text[] NOT NULL,
	"lead_time_weeks" integer DEFAULT 6 NOT NULL,
	"currency" text DEFAULT 'GBP' NOT NULL,
	"time_zone" text DEFAULT 'Europe/London' NOT NULL,
	"brand_hex" text DEFAULT '#A3342A' NOT NULL,
	"contact_email" text NOT NULL,
	"next_commission_no" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "studios_slug_unique" UNIQUE("slug"),
	CONSTRAINT "studios_slug_format" CHECK ("studios"."slug" ~ '^[a-z0-9]+(-[a-z0-9]+)*$')
);
--> statement-breakpoint
CREATE TABLE "yarn_lots" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"yarn_id" uuid NOT NULL,
	"lot_code" text NOT NULL,
	"stock_skeins" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "yarn_lots_stock" CHECK ("yarn_lots"."stock_skeins" >= 0)
);
--> statement-breakpoint
CREATE TABLE "yarns" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"studio_id" uuid NOT NULL,
	"name" text NOT NULL,
	"colour_name" text NOT NULL,
	"hex" text NOT NULL,
	"fibre" text NOT NULL,
	"weight_category" integer NOT NULL,
	"metres_per_skein" integer NOT NULL,
	"grams_per_skein" integer NOT NULL,
	"price_minor" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "yarns_hex" CHECK ("yarns"."hex" ~ '^#[0-9A-Fa-f]{6}$'),
	CONSTRAINT "yarns_weight" CHECK ("yarns"."weight_category" between 0 and 7),
	CONSTRAINT "yarns_positive" CHECK ("yarns"."metres_per_skein" > 0 and "yarns"."grams_per_skein" > 0 and "yarns"."price_minor" >= 0)
);
--> statement-breakpoint
CREATE TABLE "commission_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"commission_id" uuid NOT NULL,
	"actor_user_id" text,
	"actor_role" "actor_role" NOT NULL,
	"kind" text NOT NULL,
	"from_state" "commission_state",
	"to_state" "commission_state",
	"detail" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "commissions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"studio_id" uuid NOT NULL,
	"client_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"title" text NOT NULL,
	"garment" "garment_kind" NOT NULL,
	"wearer" "wearer" DEFAULT 'adult' NOT NULL,
	"state" "commission_state" DEFAULT 'enquiry' NOT NULL,
	"paused_from" "commission_state",
	"needed_by" date,
	"currency" text NOT NULL,
	"budget_minor" integer,
	"price_minor" integer,
	"brief" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "commissions_money" CHECK (coalesce("commissions"."budget_minor", 0) >= 0 and coalesce("commissions"."price_minor", 0) >= 0)
);
--> statement-breakpoint
ALTER TABLE "account" ADD CONSTRAINT "account_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "session" ADD CONSTRAINT "session_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "studio_clients" ADD CONSTRAINT "studio_clients_studio_id_studios_id_fk" FOREIGN KEY ("studio_id") REFERENCES "public"."studios"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "studio_clients" ADD CONSTRAINT "studio_clients_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "studio_invitations" ADD CONSTRAINT "studio_invitations_studio_id_studios_id_fk" FOREIGN KEY ("studio_id") REFERENCES "public"."studios"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "studio_invitations" ADD CONSTRAINT "studio_invitations_invited_by_user_id_fk" FOREIGN KEY ("invited_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "studio_invitations" ADD CONSTRAINT "studio_invitations_accepted_by_user_id_fk" FOREIGN KEY ("accepted_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "studio_members" ADD CONSTRAINT "studio_members_studio_id_studios_id_fk" FOREIGN KEY ("studio_id") REFERENCES "public"."studios"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "studio_members" ADD CONSTRAINT "studio_members_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "yarn_lots" ADD CONSTRAINT "yarn_lots_yarn_id_yarns_id_fk" FOREIGN KEY ("yarn_id") REFERENCES "public"."yarns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "yarns" ADD CONSTRAINT "yarns_studio_id_studios_id_fk" FOREIGN KEY ("studio_id") REFERENCES "public"."studios"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "commission_events" ADD CONSTRAINT "commission_events_commission_id_commissions_id_fk" FOREIGN KEY ("commission_id") REFERENCES "public"."commissions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "commission_events" ADD CONSTRAINT "commission_events_actor_user_id_user_id_fk" FOREIGN KEY ("actor_user_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "commissions" ADD CONSTRAINT "commissions_studio_id_studios_id_fk" FOREIGN KEY ("studio_id") REFERENCES "public"."studios"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "commissions" ADD CONSTRAINT "commissions_client_id_studio_clients_id_fk" FOREIGN KEY ("client_id") REFERENCES "public"."studio_clients"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "account_user_idx" ON "account" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "session_user_idx" ON "session" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "verification_identifier_idx" ON "verification" USING btree ("identifier");--> statement-breakpoint
CREATE UNIQUE INDEX "studio_clients_studio_user" ON "studio_clients" USING btree ("studio_id","user_id");--> statement-breakpoint
CREATE INDEX "studio_invitations_studio" ON "studio_invitations" USING btree ("studio_id");--> statement-breakpoint
CREATE UNIQUE INDEX "studio_members_studio_user" ON "studio_members" USING btree ("studio_id","user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "yarn_lots_yarn_lot" ON "yarn_lots" USING btree ("yarn_id","lot_code");--> statement-breakpoint
CREATE INDEX "yarns_studio" ON "yarns" USING btree ("studio_id");--> statement-breakpoint
CREATE INDEX "commission_events_commission" ON "commission_events" USING btree ("commission_id","at");--> statement-breakpoint
CREATE UNIQUE INDEX "commissions_studio_number" ON "commissions" USING btree ("studio_id","number");--> statement-breakpoint
CREATE INDEX "commissions_client" ON "commissions" USING btree ("client_id");--> statement-breakpoint
CREATE INDEX "commissions_studio_state" ON "commissions" USING btree ("studio_id","state");