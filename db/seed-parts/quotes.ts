// Demo quote versions, built with the same pure core the quote builder uses: a sent quote for
// priya-mittens, and accepted ones for elias-hat, priya-pullover and elias-reindeer (their yarn
// reserved). The studio gets a tax number and prices that include 20 % tax.
import { eq } from "drizzle-orm";
import { defaultRates } from "../../lib/core/labour/default-rates";
import type { PieceFeatures } from "../../lib/core/labour/piece-features";
import { composeQuote, type QuoteDraft, type QuotePolicy } from "../../lib/core/pricing/compose-quote";
import { commissions, quoteVersions, studios, yarnLots, yarnReservations, yarns } from "../schema";
import type { SeedContext, SeedPart } from "./context";

const DAY = 86_400_000;
const iso = (ms: number) => new Date(ms).toISOString().slice(0, 10);

export const DEMO_SETTINGS = {
  hourlyRateMinor: 1500,
  pricePolicy: "p50" as const,
  taxRatePercent: 20,
  pricesIncludeTax: true,
  depositPercent: 50,
  designFeeMinor: 1500,
  quoteValidDays: 30,
  rates: { ...defaultRates },
  depositRefundBeforeKnittingPercent: 100,
  // UK VAT categories (the standard rate is taxRatePercent): reduced 5 %; young children's clothing
  // zero-rated (VAT Notice 714); exempt for anything outside VAT. Every kind of line defaults to standard.
  taxCategories: [
    { id: "standard" as const, label: "Standard rate", ratePercent: 20 },
    { id: "reduced" as const, label: "Reduced rate", ratePercent: 5 },
    { id: "zero" as const, label: "Zero-rated (young children's clothing)", ratePercent: 0 },
    { id: "exempt" as const, label: "Exempt", ratePercent: 0 },
  ],
  taxDefaults: { labour: "standard" as const, material: "standard" as const, design: "standard" as const, rush: "standard" as const, fee: "standard" as const, shipping: "standard" as const },
};

const POLICY: QuotePolicy = {
  currency: "GBP",
  hourlyRateMinor: DEMO_SETTINGS.hourlyRateMinor,
  labourPolicy: DEMO_SETTINGS.pricePolicy,
  taxRatePercent: DEMO_SETTINGS.taxRatePercent,
  pricesIncludeTax: DEMO_SETTINGS.pricesIncludeTax,
  depositPercent: DEMO_SETTINGS.depositPercent,
  rates: DEMO_SETTINGS.rates,
};

const mitten = (label: string, newDesign: boolean): PieceFeatures => ({
  label,
  newDesign,
  proofRounds: newDesign ? 1 : 0,
  plainStitches: 1700,
  strandedStitches: 2500,
  floatCatches: 36,
  shapingRounds: 14,
  thumbs: 1,
  duplicateStitches: 48,
  ends: 6,
  carryCm: 8,
});

interface DemoQuote {
  key: string;
  status: "sent" | "accepted";
  pieces: PieceFeatures[];
  yarns: [string, number][];
  shippingMinor: number;
  extras?: { label: string; amountMinor: number }[];
  /** days before now the quote was sent */
  sentDaysAgo: number;
  acceptedBy?: "priya" | "elias";
}

const QUOTES: DemoQuote[] = [
  { key: "priya-mittens", status: "sent", pieces: [mitten("Left mitten", true), mitten("Right mitten", false)], yarns: [["Gull white", 1], ["Loch blue", 1], ["Gorse", 1]], shippingMinor: 450, sentDaysAgo: 2 },
  {
    key: "elias-hat",
    status: "accepted",
    pieces: [{ label: "Watch cap", newDesign: true, proofRounds: 1, plainStitches: 6800, strandedStitches: 3200, floatCatches: 40, shapingRounds: 10, duplicateStitches: 64, ends: 6, carryCm: 10 }],
    yarns: [["Peat brown", 2], ["Rowanberry", 1]],
    shippingMinor: 450,
    sentDaysAgo: 40,
    acceptedBy: "elias",
  },
  {
    key: "priya-pullover",
    status: "accepted",
    pieces: [{ label: "Yoke pullover", newDesign: true, proofRounds: 2, plainStitches: 62000, strandedStitches: 12500, floatCatches: 180, shapingRounds: 40, duplicateStitches: 120, ends: 14, carryCm: 24 }],
    yarns: [["Loch blue", 7], ["Gull white", 2], ["Rowanberry", 1]],
    shippingMinor: 650,
    extras: [{ label: "Gift wrap", amountMinor: 400 }],
    sentDaysAgo: 30,
    acceptedBy: "priya",
  },
  { key: "elias-reindeer", status: "accepted", pieces: [mitten("Left mitten", true), mitten("Right mitten", false)], yarns: [["Peat brown", 1], ["Gull white", 1]], shippingMinor: 450, sentDaysAgo: 400, acceptedBy: "elias" },
];

export const seedQuotes: SeedPart = async (tx, ctx: SeedContext) => {
  await tx.update(studios).set({ settings: DEMO_SETTINGS, legalName: "Maren Hollin, trading as Hollin Knitworks", taxNumber: "GB 123 4567 89", address: "The Old Byre, Hollin Lane, Kendal LA8 0QT" }).where(eq(studios.id, ctx.studioId));
  const yarnRows = await tx.select().from(yarns).where(eq(yarns.studioId, ctx.studioId));
  const byColour = new Map(yarnRows.map((y) => [y.colourName, y]));
  const now = Date.now();
  for (const q of QUOTES) {
    const commissionId = ctx.commissionIds[q.key];
    const [c] = await tx.select().from(commissions).where(eq(commissions.id, commissionId));
    const draft: QuoteDraft = {
      pieces: q.pieces,
      materials: q.yarns.map(([colour, skeins]) => {
        const y = byColour.get(colour)!;
        return { yarnId: y.id, label: `${y.name}, ${y.colourName} (skeins)`, skeins, unitPriceMinor: y.priceMinor };
      }),
      extras: q.extras ?? [],
      designFeeMinor: DEMO_SETTINGS.designFeeMinor,
      shippingMinor: q.shippingMinor,
      discountMinor: 0,
      requestedDate: c.neededBy,
      earliestDate: null,
      rushFeeMinor: null,
    };
    const { quote, estimate } = composeQuote(draft, POLICY);
    const sentAt = new Date(now - q.sentDaysAgo * DAY);
    const validUntil = iso(sentAt.getTime() + (q.status === "sent" ? 30 : DEMO_SETTINGS.quoteValidDays) * DAY);
    await tx.insert(quoteVersions).values({
      studioId: ctx.studioId,
      commissionId,
      number: 1,
      status: q.status,
      currency: "GBP",
      minorDigits: quote.minorDigits,
      input: { draft, policy: POLICY, validUntil, estimate: { p50Minutes: estimate.totals.p50Minutes, p80Minutes: estimate.totals.p80Minutes } },
      result: quote as unknown as Record<string, unknown>,
      totalMinor: quote.totalMinor,
      depositMinor: quote.depositMinor,
      balanceMinor: quote.balanceMinor,
      validUntil,
      messageToClient: "Thank you for asking us. Here is what your piece involves and what it costs.",
      sentAt,
      acceptedAt: q.acceptedBy ? new Date(sentAt.getTime() + 2 * DAY) : null,
      acceptedName: q.acceptedBy === "priya" ? "Priya Okafor" : q.acceptedBy === "elias" ? "Elias Brandt" : null,
      acceptedBy: q.acceptedBy ? ctx.userIds[q.acceptedBy] : null,
      createdBy: ctx.userIds.owner,
      createdAt: new Date(sentAt.getTime() - DAY),
    });
    await tx.update(commissions).set({ priceMinor: quote.totalMinor }).where(eq(commissions.id, commissionId));
    if (q.status === "accepted" && q.key !== "elias-reindeer") {
      for (const m of draft.materials) {
        const [lot] = await tx.select().from(yarnLots).where(eq(yarnLots.yarnId, m.yarnId)).limit(1);
        await tx.insert(yarnReservations).values({ commissionId, yarnId: m.yarnId, lotId: lot?.id ?? null, skeins: m.skeins, needsSecondLot: !lot || lot.stockSkeins < m.skeins });
      }
    }
  }
};
