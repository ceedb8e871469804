import { index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { user } from "./auth";
import { commissions } from "./commissions";
import { studios } from "./studios";

/** One decorated piece's chart inside a design version (exchange format v1 plus lettering layers). */
export interface DesignChartEntry {
  /** e.g. "back-of-hand-left", "hat-band" */
  area: string;
  label: string;
  /** chart exchange format v1 (lib/core/chart/format.ts) */
  chart: unknown;
  /** lettering placed as text, kept so a mirrored pair re-sets it readable (lib/core/chart/layered-design.ts) */
  lettering?: unknown[];
  /** colourwork options the maker fixed for this chart (knitted pair, in the round …) */
  options?: Record<string, unknown>;
}

/** A commission's design: a set of charts, saved as immutable versions. */
export const designs = pgTable(
  "designs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    commissionId: uuid("commission_id").references(() => commissions.id, { onDelete: "set null" }),
    title: text("title").notNull(),
    /** the version the editor opens (the newest on the main line) */
    headVersionId: uuid("head_version_id"),
    /** the version a client approved; once set, changes need a change request and a new quote version */
    lockedVersionId: uuid("locked_version_id"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("designs_studio").on(t.studioId), index("designs_commission").on(t.commissionId)],
);

export const designVersions = pgTable(
  "design_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    designId: uuid("design_id")
      .notNull()
      .references(() => designs.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    /** the version this one was edited from: two saves from the same parent are kept as siblings */
    parentVersionId: uuid("parent_version_id"),
    charts: jsonb("charts").$type<DesignChartEntry[]>().notNull(),
    /** SHA-256 of the canonical JSON of charts */
    contentHash: text("content_hash").notNull(),
    note: text("note").notNull().default(""),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("design_versions_design_number").on(t.designId, t.number)],
);

export type Design = typeof designs.$inferSelect;
export type DesignVersion = typeof designVersions.$inferSelect;
