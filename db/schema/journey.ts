import { boolean, index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { user } from "./auth";
import { actorRole, commissions } from "./commissions";
import { designVersions } from "./designs";
import { quoteVersions } from "./quotes";
import { studios } from "./studios";

export const proofStatus = pgEnum("proof_status", ["sent", "approved", "changes_requested", "superseded"]);

/** A frozen design version sent to the client for approval. */
export const proofs = pgTable(
  "proofs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    commissionId: uuid("commission_id")
      .notNull()
      .references(() => commissions.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    designVersionId: uuid("design_version_id")
      .notNull()
      .references(() => designVersions.id),
    quoteVersionId: uuid("quote_version_id").references(() => quoteVersions.id),
    contentHash: text("content_hash").notNull(),
    status: proofStatus("status").notNull().default("sent"),
    noteToClient: text("note_to_client").notNull().default(""),
    sentBy: text("sent_by").references(() => user.id, { onDelete: "set null" }),
    sentAt: timestamp("sent_at", { withTimezone: true }).notNull().defaultNow(),
    decidedBy: text("decided_by").references(() => user.id, { onDelete: "set null" }),
    decidedAt: timestamp("decided_at", { withTimezone: true }),
    decisionIp: text("decision_ip"),
    decisionNote: text("decision_note"),
  },
  (t) => [uniqueIndex("proofs_commission_number").on(t.commissionId, t.number)],
);

/** A comment pinned to a stitch of one chart of a proof (or to the whole proof when row is null). */
export const proofComments = pgTable(
  "proof_comments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    proofId: uuid("proof_id")
      .notNull()
      .references(() => proofs.id, { onDelete: "cascade" }),
    authorUserId: text("author_user_id").references(() => user.id, { onDelete: "set null" }),
    chartIndex: integer("chart_index"),
    /** trade numbering: row from the bottom, stitch from the right, both from 1 */
    row: integer("row"),
    stitch: integer("stitch"),
    body: text("body").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("proof_comments_proof").on(t.proofId)],
);

export const messages = pgTable(
  "messages",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    commissionId: uuid("commission_id")
      .notNull()
      .references(() => commissions.id, { onDelete: "cascade" }),
    authorUserId: text("author_user_id").references(() => user.id, { onDelete: "set null" }),
    authorRole: actorRole("author_role").notNull(),
    body: text("body").notNull(),
    /** the sender's own id for the message, so a retried post is stored once */
    clientKey: text("client_key"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("messages_commission").on(t.commissionId, t.createdAt), uniqueIndex("messages_client_key").on(t.commissionId, t.clientKey)],
);

/** How far each person has read each commission's thread (for unread counts). */
export const messageReads = pgTable(
  "message_reads",
  {
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    commissionId: uuid("commission_id")
      .notNull()
      .references(() => commissions.id, { onDelete: "cascade" }),
    lastReadAt: timestamp("last_read_at", { withTimezone: true }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.commissionId] })],
);

export const uploadKind = pgEnum("upload_kind", ["reference", "progress", "message"]);

/** An image in object storage, re-encoded on upload (no EXIF/GPS), with a thumbnail. */
export const uploads = pgTable(
  "uploads",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    commissionId: uuid("commission_id").references(() => commissions.id, { onDelete: "cascade" }),
    messageId: uuid("message_id").references(() => messages.id, { onDelete: "set null" }),
    pieceId: uuid("piece_id"),
    stage: text("stage"),
    kind: uploadKind("kind").notNull(),
    objectKey: text("object_key").notNull().unique(),
    thumbKey: text("thumb_key").notNull(),
    contentType: text("content_type").notNull(),
    bytes: integer("bytes").notNull(),
    width: integer("width").notNull(),
    height: integer("height").notNull(),
    sharedWithClient: boolean("shared_with_client").notNull().default(true),
    uploadedBy: text("uploaded_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("uploads_commission").on(t.commissionId)],
);

/** A request form kept while a visitor fills it in (and across signing up). */
export const requestDrafts = pgTable("request_drafts", {
  id: uuid("id").primaryKey().defaultRandom(),
  studioId: uuid("studio_id")
    .notNull()
    .references(() => studios.id, { onDelete: "cascade" }),
  /** random secret kept in the visitor's cookie; the draft is theirs alone */
  tokenHash: text("token_hash").notNull().unique(),
  userId: text("user_id").references(() => user.id, { onDelete: "cascade" }),
  data: jsonb("data").$type<Record<string, unknown>>().notNull().default({}),
  uploadIds: uuid("upload_ids").array().notNull().default([]),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
});

export const outboxStatus = pgEnum("outbox_status", ["pending", "sent", "failed"]);

/** Every e-mail goes through here: written in the transaction that causes it, sent by the worker. */
export const outboxMessages = pgTable(
  "outbox_messages",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id").references(() => studios.id, { onDelete: "cascade" }),
    /** the same key is queued once (e.g. "proof-sent:<proofId>") */
    dedupeKey: text("dedupe_key").unique(),
    to: text("to").notNull(),
    replyTo: text("reply_to"),
    subject: text("subject").notNull(),
    html: text("html").notNull(),
    text: text("text").notNull(),
    /** { filename, contentType, base64 } or { filename, contentType, objectKey } */
    attachments: jsonb("attachments").$type<Record<string, string>[]>().notNull().default([]),
    status: outboxStatus("status").notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).notNull().defaultNow(),
    lastError: text("last_error"),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("outbox_due").on(t.status, t.nextAttemptAt)],
);

export type Proof = typeof proofs.$inferSelect;
export type Upload = typeof uploads.$inferSelect;
export type OutboxMessage = typeof outboxMessages.$inferSelect;
