import { sql } from "drizzle-orm";
import { check, date, index, integer, jsonb, pgEnum, pgTable, smallint, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { commissions } from "./commissions";
import { quoteVersions } from "./quotes";
import { studios } from "./studios";

export const paymentKind = pgEnum("payment_kind", ["deposit", "balance"]);
export const paymentStatus = pgEnum("payment_status", ["open", "paid", "failed", "expired", "refunded", "partially_refunded"]);

/** One checkout for one amount; its state comes only from verified webhook events. */
export const payments = pgTable(
  "payments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    commissionId: uuid("commission_id")
      .notNull()
      .references(() => commissions.id, { onDelete: "cascade" }),
    quoteVersionId: uuid("quote_version_id").references(() => quoteVersions.id),
    kind: paymentKind("kind").notNull(),
    status: paymentStatus("status").notNull().default("open"),
    amountMinor: integer("amount_minor").notNull(),
    currency: text("currency").notNull(),
    /** ISO 4217 minor-unit digits of amountMinor/refundedMinor (checked against the table before charging or refunding) */
    minorDigits: smallint("minor_digits").notNull(),
    refundedMinor: integer("refunded_minor").notNull().default(0),
    checkoutSessionId: text("checkout_session_id").unique(),
    checkoutUrl: text("checkout_url"),
    paymentIntentId: text("payment_intent_id"),
    /** the idempotency key used to create the session, kept so a retry sends the same one */
    idempotencyKey: text("idempotency_key").notNull().unique(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    paidAt: timestamp("paid_at", { withTimezone: true }),
  },
  (t) => [
    index("payments_commission").on(t.commissionId),
    index("payments_studio").on(t.studioId, t.createdAt),
    check("payments_amounts", sql`${t.amountMinor} > 0 and ${t.refundedMinor} between 0 and ${t.amountMinor}`),
  ],
);

export const refunds = pgTable("refunds", {
  id: uuid("id").primaryKey().defaultRandom(),
  paymentId: uuid("payment_id")
    .notNull()
    .references(() => payments.id, { onDelete: "cascade" }),
  providerRefundId: text("provider_refund_id").unique(),
  amountMinor: integer("amount_minor").notNull(),
  /** ISO 4217 minor-unit digits of amountMinor (the payment's currency) */
  minorDigits: smallint("minor_digits").notNull(),
  reason: text("reason").notNull().default(""),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

/** Each provider event once: a replay is acknowledged and ignored. */
/** processed: applied; ignored: a type we do not use (acknowledged); rejected: signed but malformed (400). */
export const webhookEventStatus = pgEnum("webhook_event_status", ["processed", "ignored", "rejected"]);

/**
 * Every verified provider event, once. A rejected one is keyed `rejected_<sha256 of the body>` (its
 * own id may be missing or unusable) and keeps why in `detail`.
 */
export const webhookEvents = pgTable("webhook_events", {
  id: text("id").primaryKey(),
  type: text("type").notNull(),
  payload: jsonb("payload").$type<Record<string, unknown>>().notNull(),
  status: webhookEventStatus("status").notNull().default("processed"),
  detail: text("detail"),
  receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
  processedAt: timestamp("processed_at", { withTimezone: true }),
});

/** credit_note: only a counter kind (credit notes live in their own table, numbered on their own). */
export const documentKind = pgEnum("document_kind", ["invoice", "receipt", "credit_note"]);

/** Invoices and receipts, numbered per studio and kind without gaps (allocated in the same transaction). */
export const invoices = pgTable(
  "invoices",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    commissionId: uuid("commission_id")
      .notNull()
      .references(() => commissions.id, { onDelete: "cascade" }),
    kind: documentKind("kind").$type<"invoice" | "receipt">().notNull(),
    number: integer("number").notNull(),
    quoteVersionId: uuid("quote_version_id").references(() => quoteVersions.id),
    paymentId: uuid("payment_id").references(() => payments.id),
    currency: text("currency").notNull(),
    /** ISO 4217 minor-unit digits of every amount in content and totalMinor */
    minorDigits: smallint("minor_digits").notNull(),
    /** lines, tax, totals, deposit paid, balance due, as issued */
    content: jsonb("content").$type<Record<string, unknown>>().notNull(),
    totalMinor: integer("total_minor").notNull(),
    dueDate: date("due_date"),
    issuedAt: timestamp("issued_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("invoices_studio_kind_number").on(t.studioId, t.kind, t.number), index("invoices_commission").on(t.commissionId)],
);

/** Per-studio counters for gap-free document numbers (row locked while a number is taken). */
export const documentCounters = pgTable(
  "document_counters",
  {
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    kind: documentKind("kind").notNull(),
    next: integer("next").notNull().default(1),
  },
  (t) => [uniqueIndex("document_counters_pk").on(t.studioId, t.kind)],
);

/**
 * A credit note for one refund: its own gap-free number per studio (counter kind "credit_note",
 * taken in the refund's transaction), the document it corrects, and negative amounts per rate.
 * One per refund (unique refund_id), whichever path records the refund first.
 */
export const creditNotes = pgTable(
  "credit_notes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    commissionId: uuid("commission_id")
      .notNull()
      .references(() => commissions.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    refundId: uuid("refund_id")
      .notNull()
      .unique()
      .references(() => refunds.id, { onDelete: "cascade" }),
    paymentId: uuid("payment_id")
      .notNull()
      .references(() => payments.id, { onDelete: "cascade" }),
    /** the receipt or invoice this credit note corrects */
    correctsId: uuid("corrects_id").references(() => invoices.id),
    currency: text("currency").notNull(),
    /** ISO 4217 minor digits of the currency when issued (the amounts are in its minor units) */
    minorDigits: smallint("minor_digits").notNull(),
    /** lines per rate (negative), reason, corrected document's number, as issued */
    content: jsonb("content").$type<Record<string, unknown>>().notNull(),
    /** negative: the amount credited back, tax included */
    totalMinor: integer("total_minor").notNull(),
    issuedAt: timestamp("issued_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("credit_notes_studio_number").on(t.studioId, t.number),
    index("credit_notes_commission").on(t.commissionId),
    check("credit_notes_negative", sql`${t.totalMinor} < 0`),
  ],
);

export type Payment = typeof payments.$inferSelect;
export type CreditNote = typeof creditNotes.$inferSelect;
export type Invoice = typeof invoices.$inferSelect;
