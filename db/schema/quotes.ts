import { sql } from "drizzle-orm";
import { check, date, index, integer, jsonb, pgEnum, pgTable, smallint, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { user } from "./auth";
import { commissions } from "./commissions";
import { designVersions } from "./designs";
import { studios } from "./studios";

export const quoteStatus = pgEnum("quote_status", ["draft", "sent", "accepted", "changes_requested", "superseded", "expired"]);

/** A quote version: immutable once sent (status may move on, the money never changes). */
export const quoteVersions = pgTable(
  "quote_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    commissionId: uuid("commission_id")
      .notNull()
      .references(() => commissions.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    status: quoteStatus("status").notNull().default("draft"),
    currency: text("currency").notNull(),
    /** ISO 4217 minor-unit digits the amounts below were stored with (checked against the table when read back) */
    minorDigits: smallint("minor_digits").notNull(),
    /** what the quote was built from (lib/core/pricing buildQuote input, labour estimate, features) */
    input: jsonb("input").$type<Record<string, unknown>>().notNull(),
    /** buildQuote output: lines and totals in minor units */
    result: jsonb("result").$type<Record<string, unknown>>().notNull(),
    totalMinor: integer("total_minor").notNull(),
    depositMinor: integer("deposit_minor").notNull(),
    balanceMinor: integer("balance_minor").notNull(),
    designVersionId: uuid("design_version_id").references(() => designVersions.id, { onDelete: "set null" }),
    validUntil: date("valid_until"),
    messageToClient: text("message_to_client").notNull().default(""),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    acceptedName: text("accepted_name"),
    acceptedBy: text("accepted_by").references(() => user.id, { onDelete: "set null" }),
    changeRequest: text("change_request"),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("quote_versions_commission_number").on(t.commissionId, t.number),
    index("quote_versions_studio").on(t.studioId),
    check("quote_versions_money", sql`${t.depositMinor} + ${t.balanceMinor} = ${t.totalMinor} and ${t.depositMinor} >= 0`),
  ],
);

export type QuoteVersion = typeof quoteVersions.$inferSelect;
