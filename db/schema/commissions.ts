import { sql } from "drizzle-orm";
import {
  check,
  date,
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
import { COMMISSION_STATES } from "../../lib/core/workflow/states";
import { user } from "./auth";
import { studioClients, studios } from "./studios";

export const commissionState = pgEnum("commission_state", COMMISSION_STATES);

export const garmentKind = pgEnum("garment_kind", ["mittens", "hat", "pullover"]);
export const wearer = pgEnum("wearer", ["adult", "teen", "child", "baby"]);
export const actorRole = pgEnum("actor_role", ["owner", "assistant", "client", "system"]);

/** What the client asked for, as submitted (validated by the request schema). */
export interface CommissionBrief {
  sizeLabel?: string;
  measurements?: Record<string, number>;
  colourWishes?: string;
  lettering?: string;
  motifWishes?: string[];
  notes?: string;
}

export const commissions = pgTable(
  "commissions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    clientId: uuid("client_id")
      .notNull()
      .references(() => studioClients.id, { onDelete: "restrict" }),
    /** per-studio number shown to people (e.g. 14) */
    number: integer("number").notNull(),
    title: text("title").notNull(),
    garment: garmentKind("garment").notNull(),
    wearer: wearer("wearer").notNull().default("adult"),
    state: commissionState("state").notNull().default("enquiry"),
    /** the state a paused commission resumes to */
    pausedFrom: commissionState("paused_from"),
    neededBy: date("needed_by"),
    currency: text("currency").notNull(),
    budgetMinor: integer("budget_minor"),
    /** the agreed price; set by the owner only (quotes replace this with versions) */
    priceMinor: integer("price_minor"),
    brief: jsonb("brief").$type<CommissionBrief>().notNull().default({}),
    /** the studio's sizing form (lib/schemas/sizing.ts): measurements, ease, measured gauge, repeat */
    sizing: jsonb("sizing").$type<Record<string, unknown>>(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("commissions_studio_number").on(t.studioId, t.number),
    index("commissions_client").on(t.clientId),
    index("commissions_studio_state").on(t.studioId, t.state),
    check("commissions_money", sql`coalesce(${t.budgetMinor}, 0) >= 0 and coalesce(${t.priceMinor}, 0) >= 0`),
  ],
);

/** Audit trail: every state change and every price change, written in the same transaction. */
export const commissionEvents = pgTable(
  "commission_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    commissionId: uuid("commission_id")
      .notNull()
      .references(() => commissions.id, { onDelete: "cascade" }),
    actorUserId: text("actor_user_id").references(() => user.id, { onDelete: "set null" }),
    actorRole: actorRole("actor_role").notNull(),
    kind: text("kind").notNull(),
    fromState: commissionState("from_state"),
    toState: commissionState("to_state"),
    detail: jsonb("detail").$type<Record<string, unknown>>().notNull().default({}),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("commission_events_commission").on(t.commissionId, t.at)],
);

export type Commission = typeof commissions.$inferSelect;
export type CommissionState = (typeof commissionState.enumValues)[number];
export type GarmentKind = (typeof garmentKind.enumValues)[number];
