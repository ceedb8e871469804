import { sql } from "drizzle-orm";
import {
  check,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import { user } from "./auth";

export const memberRole = pgEnum("member_role", ["owner", "assistant"]);

/** A studio is a tenant: everything below belongs to exactly one. */
export const studios = pgTable(
  "studios",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    slug: text("slug").notNull().unique(),
    name: text("name").notNull(),
    tagline: text("tagline").notNull().default(""),
    about: text("about").notNull().default(""),
    makes: text("makes").array().notNull().default(sql`'{}'::text[]`),
    leadTimeWeeks: integer("lead_time_weeks").notNull().default(6),
    currency: text("currency").notNull().default("GBP"),
    timeZone: text("time_zone").notNull().default("Europe/London"),
    brandHex: text("brand_hex").notNull().default("#A3342A"),
    contactEmail: text("contact_email").notNull(),
    /** seller details on invoices: the legal name (when it differs from the trading name), address, VAT number */
    legalName: text("legal_name").notNull().default(""),
    address: text("address").notNull().default(""),
    taxNumber: text("tax_number").notNull().default(""),
    /** studio settings (rates, tax, deposit, policies); validated by lib/schemas when read and written */
    settings: jsonb("settings").$type<Record<string, unknown>>().notNull().default({}),
    /** next commission number, allocated inside the transaction that creates the commission */
    nextCommissionNo: integer("next_commission_no").notNull().default(1),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [check("studios_slug_format", sql`${t.slug} ~ '^[a-z0-9]+(-[a-z0-9]+)*$'`)],
);

export const studioMembers = pgTable(
  "studio_members",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    role: memberRole("role").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("studio_members_studio_user").on(t.studioId, t.userId)],
);

export const studioInvitations = pgTable(
  "studio_invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: memberRole("role").notNull().default("assistant"),
    /** SHA-256 of the token sent by e-mail; the token itself is never stored */
    tokenHash: text("token_hash").notNull().unique(),
    invitedBy: text("invited_by")
      .notNull()
      .references(() => user.id),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    acceptedBy: text("accepted_by").references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("studio_invitations_studio").on(t.studioId)],
);

/** A person who commissions work from a studio; linked to their sign-in once they have one. */
export const studioClients = pgTable(
  "studio_clients",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    displayName: text("display_name").notNull(),
    notes: text("notes").notNull().default(""),
    shippingAddress: text("shipping_address").notNull().default(""),
    /** the payment provider's customer id, once there is one */
    paymentCustomerId: text("payment_customer_id"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("studio_clients_studio_user").on(t.studioId, t.userId)],
);

export type Studio = typeof studios.$inferSelect;
export type StudioMember = typeof studioMembers.$inferSelect;
export type StudioClient = typeof studioClients.$inferSelect;
export type MemberRole = (typeof memberRole.enumValues)[number];
