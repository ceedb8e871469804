import { sql } from "drizzle-orm";
import { check, index, integer, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { studios } from "./studios";

/** One colourway of one yarn base as the studio stocks it. */
export const yarns = pgTable(
  "yarns",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    studioId: uuid("studio_id")
      .notNull()
      .references(() => studios.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    colourName: text("colour_name").notNull(),
    hex: text("hex").notNull(),
    fibre: text("fibre").notNull(),
    /** Standard Yarn Weight System category, 0–7 */
    weightCategory: integer("weight_category").notNull(),
    metresPerSkein: integer("metres_per_skein").notNull(),
    gramsPerSkein: integer("grams_per_skein").notNull(),
    priceMinor: integer("price_minor").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("yarns_studio").on(t.studioId),
    check("yarns_hex", sql`${t.hex} ~ '^#[0-9A-Fa-f]{6}$'`),
    check("yarns_weight", sql`${t.weightCategory} between 0 and 7`),
    check("yarns_positive", sql`${t.metresPerSkein} > 0 and ${t.gramsPerSkein} > 0 and ${t.priceMinor} >= 0`),
  ],
);

export const yarnLots = pgTable(
  "yarn_lots",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    yarnId: uuid("yarn_id")
      .notNull()
      .references(() => yarns.id, { onDelete: "cascade" }),
    lotCode: text("lot_code").notNull(),
    stockSkeins: integer("stock_skeins").notNull().default(0),
  },
  (t) => [
    uniqueIndex("yarn_lots_yarn_lot").on(t.yarnId, t.lotCode),
    check("yarn_lots_stock", sql`${t.stockSkeins} >= 0`),
  ],
);

export type Yarn = typeof yarns.$inferSelect;
