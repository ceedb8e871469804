import { eq } from "drizzle-orm";
import { readDesignOnGarment } from "../../lib/core/design-garment";
import { estimatePiece, getPieceLayout, type PieceEstimateMap } from "../../lib/core/production";
import { sizeGarment } from "../../lib/core/sizing";
import type { PieceFeatures } from "../../lib/core/labour/piece-features";
import { labourHistory, memberAvailability, pieceEvents, pieces, studioMembers, timeEntries, yarnReservations } from "../schema";
import type { SeedPart } from "./context";

const DAY = 86_400_000;

/** A plain garment's pieces at a standard size (the demo's pieces are counted by the garment, as the app counts them). */
function garmentPieces(garment: "mitten" | "hat", size: string): PieceFeatures[] {
  return readDesignOnGarment(sizeGarment({ garment, size, gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 } }), []).pieces;
}

/** An entry that started at 09:30 UTC `daysAgo` days before now. */
function at(daysAgo: number, hour = 9, minute = 30): Date {
  const d = new Date(Date.now() - daysAgo * DAY);
  d.setUTCHours(hour, minute, 0, 0);
  return d;
}

/** Earlier pieces the studio logged before this demo begins (invented), so calibration has history. */
const EARLIER: { features: PieceFeatures; logged: Record<string, number> }[] = [
  { features: { plainStitches: 2400, strandedStitches: 3600, floatCatches: 280, shapingRounds: 14, thumbs: 1, duplicateStitches: 60, ends: 8, carryCm: 30 }, logged: { knitting: 470, embroidery: 52, blocking: 18, finishing: 22 } },
  { features: { plainStitches: 2600, strandedStitches: 3900, floatCatches: 320, shapingRounds: 16, thumbs: 1, duplicateStitches: 90, ends: 10, carryCm: 45 }, logged: { knitting: 505, embroidery: 70, blocking: 15, finishing: 25 } },
  { features: { plainStitches: 6400, strandedStitches: 3300, floatCatches: 260, shapingRounds: 12, duplicateStitches: 110, ends: 10, carryCm: 55 }, logged: { knitting: 560, embroidery: 75, blocking: 20, finishing: 18 } },
  { features: { plainStitches: 6800, strandedStitches: 3800, floatCatches: 300, shapingRounds: 12, duplicateStitches: 140, ends: 12, carryCm: 70 }, logged: { knitting: 600, embroidery: 92, blocking: 17, finishing: 21 } },
  { features: { plainStitches: 2200, strandedStitches: 3400, floatCatches: 260, shapingRounds: 14, thumbs: 1, duplicateStitches: 40, ends: 6, carryCm: 20 }, logged: { knitting: 430, embroidery: 35, blocking: 16, finishing: 20 } },
  { features: { plainStitches: 7000, strandedStitches: 3000, floatCatches: 240, shapingRounds: 13, duplicateStitches: 100, ends: 9, carryCm: 50 }, logged: { knitting: 575, embroidery: 66, blocking: 19, finishing: 24 } },
];

/** Demo pieces, time entries, availability and closed-commission history. */
export const seedProduction: SeedPart = async (tx, ctx) => {
  const owner = ctx.userIds.owner;
  const assistant = ctx.userIds.assistant;
  const members = await tx.select().from(studioMembers).where(eq(studioMembers.studioId, ctx.studioId));
  for (const m of members) {
    await tx.insert(memberAvailability).values(
      m.role === "owner"
        ? { memberId: m.id, weekdayMinutes: [360, 360, 360, 360, 240, 0, 0], stages: [] }
        : // The assistant embroiders, blocks and finishes three days a week; knitting stays with the owner.
          { memberId: m.id, weekdayMinutes: [300, 0, 300, 0, 300, 0, 0], stages: ["embroidery", "blocking", "finishing"] },
    );
  }

  // The watch cap in production: knitting under way.
  const hatCommission = ctx.commissionIds["elias-hat"];
  const hatLayout = getPieceLayout("hat", garmentPieces("hat", "woman"), "pieces");
  const hatPlan = estimatePiece(hatLayout.pieces[0].features);
  const [hat] = await tx
    .insert(pieces)
    .values({
      studioId: ctx.studioId,
      commissionId: hatCommission,
      name: "Hat",
      stage: "knitting",
      features: hatLayout.pieces[0].features as Record<string, number | boolean>,
      estimate: hatPlan.estimate,
      dryingHours: hatPlan.dryingHours,
    })
    .returning();
  await tx.insert(pieceEvents).values([
    { pieceId: hat.id, actorUserId: owner, actorRole: "owner", fromStage: null, toStage: "queued", at: at(4, 8) },
    { pieceId: hat.id, actorUserId: owner, actorRole: "owner", fromStage: "queued", toStage: "knitting", at: at(4, 9) },
  ]);
  const hatEntries = [
    { days: 4, minutes: 95, who: owner, note: "Brim and first band rounds" },
    { days: 3, minutes: 140, who: owner, note: "Lettering band" },
    { days: 2, minutes: 110, who: owner, note: "" },
  ];
  for (const e of hatEntries) {
    const start = at(e.days);
    await tx.insert(timeEntries).values({
      studioId: ctx.studioId,
      pieceId: hat.id,
      stage: "knitting",
      userId: e.who,
      source: e.days === 3 ? "manual" : "timer",
      startedAt: start,
      endedAt: new Date(start.getTime() + e.minutes * 60_000),
      minutes: e.minutes,
      bankedSeconds: e.minutes * 60,
      note: e.note,
    });
  }

  // Last winter's reindeer mittens: closed, so their minutes are history for calibration.
  const reindeer = ctx.commissionIds["elias-reindeer"];
  const pair = getPieceLayout("mittens", garmentPieces("mitten", "woman"), "pieces");
  const reindeerLogged: Record<string, number>[] = [
    { knitting: 455, embroidery: 48, blocking: 15, finishing: 20 },
    { knitting: 430, embroidery: 44, blocking: 14, finishing: 22 },
  ];
  // Entries dated a month before the commission's date (mid-November 2025).
  const base = Date.parse("2025-11-10T09:00:00Z");
  let cursor = base;
  for (const [i, p] of pair.pieces.entries()) {
    const plan = estimatePiece(p.features);
    const [row] = await tx
      .insert(pieces)
      .values({
        studioId: ctx.studioId,
        commissionId: reindeer,
        name: p.name,
        position: i,
        stage: "done",
        features: p.features as Record<string, number | boolean>,
        estimate: plan.estimate,
        dryingHours: plan.dryingHours,
      })
      .returning();
    await tx.insert(pieceEvents).values({ pieceId: row.id, actorUserId: owner, actorRole: "owner", fromStage: "finishing", toStage: "done", at: new Date(base + 14 * DAY) });
    for (const [stage, minutes] of Object.entries(reindeerLogged[i])) {
      await tx.insert(timeEntries).values({
        studioId: ctx.studioId,
        pieceId: row.id,
        stage: stage as "knitting",
        userId: stage === "knitting" ? owner : assistant,
        source: "timer",
        startedAt: new Date(cursor),
        endedAt: new Date(cursor + minutes * 60_000),
        minutes,
        bankedSeconds: minutes * 60,
      });
      cursor += DAY;
    }
    await tx.insert(labourHistory).values({
      studioId: ctx.studioId,
      pieceId: row.id,
      features: p.features as Record<string, number | boolean>,
      loggedMinutes: reindeerLogged[i],
      estimatedMinutes: p50Of(plan.estimate),
      closedAt: new Date(Date.parse("2025-12-20T12:00:00Z")),
    });
  }
  // The yoke pullover has its yarn set aside (unless the quotes part reserved it already): more
  // Gull white than the shelf holds, so the yarn page shows a purchase list.
  const pullover = ctx.commissionIds["priya-pullover"];
  const held = await tx.select({ id: yarnReservations.id }).from(yarnReservations).where(eq(yarnReservations.commissionId, pullover)).limit(1);
  if (held.length === 0) {
    await tx.insert(yarnReservations).values([
      { commissionId: pullover, yarnId: ctx.yarnIds["Gull white"], skeins: 8, needsSecondLot: true },
      { commissionId: pullover, yarnId: ctx.yarnIds["Loch blue"], skeins: 3 },
    ]);
  }

  for (const [i, h] of EARLIER.entries()) {
    await tx.insert(labourHistory).values({
      studioId: ctx.studioId,
      pieceId: null,
      features: h.features as Record<string, number | boolean>,
      loggedMinutes: h.logged,
      estimatedMinutes: p50Of(estimatePiece(h.features).estimate),
      closedAt: new Date(Date.parse("2025-03-01T12:00:00Z") + i * 30 * DAY),
    });
  }
};

function p50Of(e: PieceEstimateMap): Record<string, number> {
  return Object.fromEntries(Object.entries(e).map(([s, v]) => [s, v.p50]));
}
