// Abuse limits shared by every app instance (nothing is kept in process memory).
import { integer, pgTable, primaryKey, text, timestamp } from "drizzle-orm/pg-core";

/**
 * Failed password sign-ins per account, keyed by a SHA-256 of the lower-cased e-mail (so unknown
 * addresses are treated exactly like known ones and nothing typed is stored). See lib/server/sign-in-lock.ts.
 */
export const signInLocks = pgTable("sign_in_locks", {
  emailHash: text("email_hash").primaryKey(),
  /** attempts counted since the series began (an attempt is counted before its password is checked) */
  attempts: integer("attempts").notNull().default(0),
  /** how many locks this series has had: each lock lasts twice as long as the one before */
  locks: integer("locks").notNull().default(0),
  lockedUntil: timestamp("locked_until", { withTimezone: true }),
  lastAttemptAt: timestamp("last_attempt_at", { withTimezone: true }).notNull().defaultNow(),
});

/** Fixed-window counters (e.g. photos added by one signed-out visitor or one address per hour). */
export const usageCounters = pgTable(
  "usage_counters",
  {
    key: text("key").notNull(),
    windowStart: timestamp("window_start", { withTimezone: true }).notNull(),
    count: integer("count").notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.key, t.windowStart] })],
);
