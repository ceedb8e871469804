import "server-only";
// The studio's yarns: records, stock per dye lot, what accepted commissions reserve, and what to buy.
import { and, asc, eq, inArray, isNull, notInArray, sql } from "drizzle-orm";
import { db } from "@/db";
import { commissions, studios, yarnLots, yarnReservations, yarns } from "@/db/schema";
import { getYarnWeight } from "@/lib/core/yarn";
import { lotSchema, yarnBodySchema, yarnFields } from "@/lib/schemas/yarns";
import { z } from "zod";
import { assertCan, memberRole, type Actor } from "./authz";
import { conflict, forbidden, notFound } from "./errors";

/** Reservations stop counting once the piece has left (shipped) or the commission ended. */
const NOT_HOLDING = ["shipped", "delivered", "closed", "declined", "cancelled"] as const;

export interface YarnRow {
  id: string;
  name: string;
  colourName: string;
  hex: string;
  fibre: string;
  weightCategory: number;
  weightName: string;
  metresPerSkein: number;
  gramsPerSkein: number;
  priceMinor: number;
  lots: { id: string; lotCode: string; stockSkeins: number }[];
  stock: number;
  reserved: number;
  short: number;
}

async function studioCurrency(studioId: string): Promise<string> {
  const [s] = await db.select({ currency: studios.currency }).from(studios).where(eq(studios.id, studioId));
  if (!s) throw notFound("That studio");
  return s.currency;
}

export async function listYarns(actor: Actor, studioId: string): Promise<{ currency: string; yarns: YarnRow[]; purchase: { yarnId: string; label: string; skeins: number; costMinor: number }[] }> {
  assertCan(actor, "studio.view", studioId);
  const currency = await studioCurrency(studioId);
  const rows = await db.select().from(yarns).where(eq(yarns.studioId, studioId)).orderBy(asc(yarns.name), asc(yarns.colourName));
  const ids = rows.map((y) => y.id);
  const lots = ids.length ? await db.select().from(yarnLots).where(inArray(yarnLots.yarnId, ids)).orderBy(asc(yarnLots.lotCode)) : [];
  const reserved = ids.length
    ? await db
        .select({ yarnId: yarnReservations.yarnId, skeins: sql<number>`sum(${yarnReservations.skeins})::int` })
        .from(yarnReservations)
        .innerJoin(commissions, eq(commissions.id, yarnReservations.commissionId))
        .where(and(inArray(yarnReservations.yarnId, ids), isNull(yarnReservations.releasedAt), notInArray(commissions.state, [...NOT_HOLDING])))
        .groupBy(yarnReservations.yarnId)
    : [];
  const list: YarnRow[] = rows.map((y) => {
    const own = lots.filter((l) => l.yarnId === y.id);
    const stock = own.reduce((s, l) => s + l.stockSkeins, 0);
    const r = reserved.find((x) => x.yarnId === y.id)?.skeins ?? 0;
    return {
      id: y.id,
      name: y.name,
      colourName: y.colourName,
      hex: y.hex,
      fibre: y.fibre,
      weightCategory: y.weightCategory,
      weightName: getYarnWeight(y.weightCategory).name,
      metresPerSkein: y.metresPerSkein,
      gramsPerSkein: y.gramsPerSkein,
      priceMinor: y.priceMinor,
      lots: own.map((l) => ({ id: l.id, lotCode: l.lotCode, stockSkeins: l.stockSkeins })),
      stock,
      reserved: r,
      short: Math.max(0, r - stock),
    };
  });
  const purchase = list
    .filter((y) => y.short > 0)
    .map((y) => ({ yarnId: y.id, label: `${y.name}, ${y.colourName}`, skeins: y.short, costMinor: y.short * y.priceMinor }));
  return { currency, yarns: list, purchase };
}

/** Owner only: a new yarn record (it carries a price), with its first dye lot if given. */
export async function createYarn(actor: Actor, studioId: string, raw: unknown, lot?: z.input<typeof lotSchema>) {
  assertCan(actor, "commission.price", studioId);
  const input = yarnBodySchema(await studioCurrency(studioId)).parse(raw);
  const firstLot = lot ? lotSchema.parse(lot) : null;
  return db.transaction(async (tx) => {
    const { price, ...rest } = input;
    const [y] = await tx.insert(yarns).values({ studioId, ...rest, priceMinor: price }).returning();
    if (firstLot) await tx.insert(yarnLots).values({ yarnId: y.id, ...firstLot });
    return y;
  });
}

async function loadYarn(actor: Actor, yarnId: string) {
  const [y] = await db.select().from(yarns).where(eq(yarns.id, yarnId));
  if (!y || memberRole(actor, y.studioId) === null) throw notFound("That yarn");
  return y;
}

/** Owner: every field; assistant: the record but not the price (an attempt to change it is refused). */
export async function updateYarn(actor: Actor, yarnId: string, raw: unknown) {
  const y = await loadYarn(actor, yarnId);
  assertCan(actor, "commission.work", y.studioId);
  const input = yarnBodySchema(await studioCurrency(y.studioId)).parse(raw);
  const { price, ...rest } = input;
  if (price !== y.priceMinor && memberRole(actor, y.studioId) !== "owner") {
    throw forbidden("Only the studio owner can change yarn prices.");
  }
  const [updated] = await db.update(yarns).set({ ...rest, priceMinor: price }).where(eq(yarns.id, y.id)).returning();
  return updated;
}

/** Owner or assistant: a dye lot and its stock (a new code adds a lot, a known code sets its stock). */
export async function setLotStock(actor: Actor, yarnId: string, raw: z.input<typeof lotSchema>) {
  const y = await loadYarn(actor, yarnId);
  assertCan(actor, "commission.work", y.studioId);
  const input = lotSchema.parse(raw);
  const [row] = await db
    .insert(yarnLots)
    .values({ yarnId: y.id, ...input })
    .onConflictDoUpdate({ target: [yarnLots.yarnId, yarnLots.lotCode], set: { stockSkeins: input.stockSkeins } })
    .returning();
  return row;
}

export async function deleteLot(actor: Actor, lotId: string) {
  const [lot] = await db.select({ lot: yarnLots, studioId: yarns.studioId }).from(yarnLots).innerJoin(yarns, eq(yarns.id, yarnLots.yarnId)).where(eq(yarnLots.id, lotId));
  if (!lot || memberRole(actor, lot.studioId) === null) throw notFound("That dye lot");
  assertCan(actor, "commission.work", lot.studioId);
  const [held] = await db.select({ id: yarnReservations.id }).from(yarnReservations).where(and(eq(yarnReservations.lotId, lotId), isNull(yarnReservations.releasedAt))).limit(1);
  if (held) throw conflict("A commission has skeins reserved from this lot; set its stock to 0 instead.");
  await db.delete(yarnLots).where(eq(yarnLots.id, lotId));
}

export { yarnFields };
