import { sql } from "drizzle-orm";
import { boolean, check, date, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { PIECE_STAGES } from "../../lib/core/workflow/pieces";
import { user } from "./auth";
import { actorRole, commissions } from "./commissions";
import { studioMembers, studios } from "./studios";
import { yarnLots, yarns } from "./yarns";

export const pieceStage = pgEnum("piece_stage", PIECE_STAGES);

/** A piece of a commission (a pair of mittens is two) moving through the production stages. */
export const pieces = pgTable(
  "pieces",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    commissionId: uuid("commission_id")
      .notNull()
      .references(() => commissions.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    position: integer("position").notNull().default(0),
    stage: pieceStage("stage").notNull().default("queued"),
    /** features for the labour model (lib/core/labour PieceFeatures) */
    features: jsonb("features").$type<Record<string, number | boolean>>().notNull().default({}),
    /** minutes per stage: { knitting: { p50, p80 }, … } */
    estimate: jsonb("estimate").$type<Record<string, { p50: number; p80: number }>>().notNull().default({}),
    dryingHours: integer("drying_hours").notNull().default(24),
    dryUntil: timestamp("dry_until", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("pieces_commission").on(t.commissionId), index("pieces_studio_stage").on(t.studioId, t.stage)],
);

export const pieceEvents = pgTable(
  "piece_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    pieceId: uuid("piece_id")
      .notNull()
      .references(() => pieces.id, { onDelete: "cascade" }),
    actorUserId: text("actor_user_id").references(() => user.id, { onDelete: "set null" }),
    actorRole: actorRole("actor_role").notNull(),
    fromStage: pieceStage("from_stage"),
    toStage: pieceStage("to_stage").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("piece_events_piece").on(t.pieceId, t.at)],
);

export const timeSource = pgEnum("time_source", ["timer", "manual"]);

/** Logged work. A running timer has endedAt null; minutes are fixed when it stops. */
export const timeEntries = pgTable(
  "time_entries",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    pieceId: uuid("piece_id")
      .notNull()
      .references(() => pieces.id, { onDelete: "cascade" }),
    stage: pieceStage("stage").notNull(),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    source: timeSource("source").notNull(),
    startedAt: timestamp("started_at", { withTimezone: true }).notNull(),
    endedAt: timestamp("ended_at", { withTimezone: true }),
    /** minutes already banked by pauses of a running timer, or the whole entry once stopped */
    minutes: integer("minutes").notNull().default(0),
    /** a running timer is paused when this is set */
    pausedAt: timestamp("paused_at", { withTimezone: true }),
    /** start of the current run of a running timer (set on start and resume, null while paused or stopped) */
    runningSince: timestamp("running_since", { withTimezone: true }),
    /** seconds banked by earlier runs of a running timer, before it was paused */
    bankedSeconds: integer("banked_seconds").notNull().default(0),
    note: text("note").notNull().default(""),
    /** e.g. a timer left running overnight: shown for review, not silently counted */
    flag: text("flag"),
    deletedAt: timestamp("deleted_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("time_entries_piece").on(t.pieceId, t.stage),
    index("time_entries_user").on(t.userId, t.startedAt),
    // One running timer per person.
    uniqueIndex("time_entries_one_running").on(t.userId).where(sql`${t.endedAt} is null and ${t.deletedAt} is null`),
    check("time_entries_minutes", sql`${t.minutes} >= 0`),
  ],
);

export const timeEntryEdits = pgTable("time_entry_edits", {
  id: uuid("id").primaryKey().defaultRandom(),
  entryId: uuid("entry_id")
    .notNull()
    .references(() => timeEntries.id, { onDelete: "cascade" }),
  editorUserId: text("editor_user_id").references(() => user.id, { onDelete: "set null" }),
  before: jsonb("before").$type<Record<string, unknown>>(),
  after: jsonb("after").$type<Record<string, unknown>>(),
  at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
});

/** When each member can work: minutes per weekday (Mon..Sun), an optional weekly cap, days off. */
export const memberAvailability = pgTable("member_availability", {
  memberId: uuid("member_id")
    .primaryKey()
    .references(() => studioMembers.id, { onDelete: "cascade" }),
  weekdayMinutes: integer("weekday_minutes").array().notNull().default(sql`'{360,360,360,360,360,0,0}'::int[]`),
  weeklyCapMinutes: integer("weekly_cap_minutes"),
  daysOff: date("days_off").array().notNull().default(sql`'{}'::date[]`),
  /** stages this member works on (empty = all) */
  stages: text("stages").array().notNull().default(sql`'{}'::text[]`),
});

export const shipments = pgTable("shipments", {
  id: uuid("id").primaryKey().defaultRandom(),
  commissionId: uuid("commission_id")
    .notNull()
    .references(() => commissions.id, { onDelete: "cascade" }),
  carrier: text("carrier").notNull(),
  tracking: text("tracking").notNull(),
  shippedBy: text("shipped_by").references(() => user.id, { onDelete: "set null" }),
  shippedAt: timestamp("shipped_at", { withTimezone: true }).notNull().defaultNow(),
});

/** Finished pieces' features and logged minutes: the history calibration learns from. */
export const labourHistory = pgTable("labour_history", {
  id: uuid("id").primaryKey().defaultRandom(),
  studioId: uuid("studio_id")
    .notNull()
    .references(() => studios.id, { onDelete: "cascade" }),
  pieceId: uuid("piece_id").references(() => pieces.id, { onDelete: "set null" }),
  features: jsonb("features").$type<Record<string, number | boolean>>().notNull(),
  loggedMinutes: jsonb("logged_minutes").$type<Record<string, number>>().notNull(),
  estimatedMinutes: jsonb("estimated_minutes").$type<Record<string, number>>().notNull().default({}),
  closedAt: timestamp("closed_at", { withTimezone: true }).notNull().defaultNow(),
});

export const proposalStatus = pgEnum("proposal_status", ["proposed", "accepted", "rejected"]);

export const rateProposals = pgTable("rate_proposals", {
  id: uuid("id").primaryKey().defaultRandom(),
  studioId: uuid("studio_id")
    .notNull()
    .references(() => studios.id, { onDelete: "cascade" }),
  rates: jsonb("rates").$type<Record<string, unknown>>().notNull(),
  report: jsonb("report").$type<Record<string, unknown>>().notNull(),
  status: proposalStatus("status").notNull().default("proposed"),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  decidedAt: timestamp("decided_at", { withTimezone: true }),
  decidedBy: text("decided_by").references(() => user.id, { onDelete: "set null" }),
});

/** Skeins set aside for an accepted commission. */
export const yarnReservations = pgTable(
  "yarn_reservations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    commissionId: uuid("commission_id")
      .notNull()
      .references(() => commissions.id, { onDelete: "cascade" }),
    yarnId: uuid("yarn_id")
      .notNull()
      .references(() => yarns.id, { onDelete: "cascade" }),
    lotId: uuid("lot_id").references(() => yarnLots.id, { onDelete: "set null" }),
    skeins: integer("skeins").notNull(),
    needsSecondLot: boolean("needs_second_lot").notNull().default(false),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    releasedAt: timestamp("released_at", { withTimezone: true }),
  },
  (t) => [index("yarn_reservations_commission").on(t.commissionId), check("yarn_reservations_skeins", sql`${t.skeins} > 0`)],
);

export type Piece = typeof pieces.$inferSelect;
export type TimeEntry = typeof timeEntries.$inferSelect;
