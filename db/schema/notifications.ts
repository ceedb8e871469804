import { sql } from "drizzle-orm";
import { boolean, index, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { user } from "./auth";
import { commissions } from "./commissions";
import { studios } from "./studios";

/**
 * One thing a person is told about: made by lib/server/notifications.ts `notify()` in the same
 * transaction as the event. `audience` says which list it belongs to (a studio member's list in
 * /studio, a client's in /portal); title and body are plain words, `link` a path inside the app.
 */
export const notifications = pgTable(
  "notifications",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    recipientUserId: text("recipient_user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    commissionId: uuid("commission_id").references(() => commissions.id, { onDelete: "cascade" }),
    audience: text("audience").$type<"studio" | "client">().notNull(),
    /** one of NOTIFICATION_KINDS (lib/schemas/notifications.ts) */
    kind: text("kind").notNull(),
    title: text("title").notNull(),
    body: text("body").notNull(),
    link: text("link").notNull(),
    /** the event, e.g. "quote-accepted:<quoteId>": a person is told of one event once */
    dedupeKey: text("dedupe_key").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    readAt: timestamp("read_at", { withTimezone: true }),
  },
  (t) => [
    uniqueIndex("notifications_once").on(t.recipientUserId, t.dedupeKey),
    index("notifications_list").on(t.recipientUserId, t.audience, t.createdAt),
    /** the header's unread count and a person's unread list */
    index("notifications_unread").on(t.recipientUserId, t.audience).where(sql`${t.readAt} is null`),
  ],
);

/** A person's choice per kind; no row means the default (e-mail on). In-app items are always made. */
export const notificationSettings = pgTable(
  "notification_settings",
  {
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    kind: text("kind").notNull(),
    email: boolean("email").notNull().default(true),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.kind] })],
);

export type Notification = typeof notifications.$inferSelect;
