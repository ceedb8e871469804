// The demo scenario (invented studio, people and yarns). Idempotent: a second run adds nothing.
// Runs only against the local demo database that the scripts start (DARNWELL_DEMO=1), so a
// deployment with its own database never gets demo accounts.
import { hashPassword } from "better-auth/crypto";
import { and, eq, sql } from "drizzle-orm";
import { closeDb, db } from "./index";
import type { SeedContext } from "./seed-parts/context";
import { seedDesigns } from "./seed-parts/designs";
import { seedJourney } from "./seed-parts/journey";
import { seedPayments } from "./seed-parts/payments";
import { seedProduction } from "./seed-parts/production";
import { seedQuotes } from "./seed-parts/quotes";
import { getSizeKeys } from "../lib/core/sizing";
import { defaultSizingForm, type SizingFormValues } from "../lib/schemas/sizing";
import {
  account,
  commissionEvents,
  commissions,
  studioClients,
  studioMembers,
  studios,
  user,
  yarnLots,
  yarns,
  type CommissionBrief,
  type CommissionState,
  type GarmentKind,
} from "./schema";

export const DEMO_PASSWORD = "darnwell-demo";

export const DEMO_PEOPLE = [
  { key: "owner", name: "Maren Ashby", email: "maren@hollin.test", role: "owner" },
  { key: "assistant", name: "Tobias Venn", email: "tobias@hollin.test", role: "assistant" },
  { key: "priya", name: "Priya Okafor", email: "priya@example.test", role: "client" },
  { key: "elias", name: "Elias Brandt", email: "elias@example.test", role: "client" },
  { key: "saoirse", name: "Saoirse Lund", email: "saoirse@example.test", role: "client" },
] as const;

const YARNS = [
  { colourName: "Gull white", hex: "#F2EEE4" },
  { colourName: "Peat brown", hex: "#4A3728" },
  { colourName: "Rowanberry", hex: "#A8322D" },
  { colourName: "Loch blue", hex: "#2E5A7A" },
  { colourName: "Gorse", hex: "#E0B33A" },
  { colourName: "Lichen green", hex: "#6F8A5B" },
];

interface DemoCommission {
  key: string;
  client: "priya" | "elias" | "saoirse";
  title: string;
  garment: GarmentKind;
  wearer: "adult" | "child" | "baby";
  state: CommissionState;
  neededBy: string;
  budgetMinor: number | null;
  priceMinor: number | null;
  brief: CommissionBrief;
  /** the studio's saved sizing form (lib/schemas/sizing.ts), where the maker has worked it out */
  sizing?: SizingFormValues;
  path: CommissionState[];
}

const COMMISSIONS: DemoCommission[] = [
  {
    key: "priya-mittens",
    client: "priya",
    title: "Snowflake mittens with P·O",
    garment: "mittens",
    wearer: "adult",
    state: "quote_sent",
    neededBy: "2027-01-22",
    budgetMinor: 14000,
    priceMinor: null,
    brief: { sizeLabel: "Woman M", lettering: "PO", colourWishes: "Gull white and Loch blue, a touch of Gorse", motifWishes: ["snowflake"] },
    // Maren's swatch in the stranded pattern: 32 sts and 36 rnds over 10 cm, a woman's standard size.
    sizing: { ...defaultSizingForm("mittens", { sizeLabel: "Woman M" }, getSizeKeys("mitten")), stitches: "32", rows: "36" },
    path: ["enquiry", "quoting", "quote_sent"],
  },
  {
    key: "elias-hat",
    client: "elias",
    title: "Watch cap with E.B. band",
    garment: "hat",
    wearer: "adult",
    state: "in_production",
    neededBy: "2026-12-18",
    budgetMinor: 9000,
    priceMinor: 8800,
    brief: { measurements: { headCircumferenceCm: 57 }, lettering: "EB", colourWishes: "Peat brown with Rowanberry letters" },
    path: ["enquiry", "quoting", "quote_sent", "booked", "designing", "proof_sent", "proof_approved", "in_production"],
  },
  {
    key: "saoirse-baby",
    client: "saoirse",
    title: "First mittens for Aoife",
    garment: "mittens",
    wearer: "baby",
    state: "enquiry",
    neededBy: "2027-02-14",
    budgetMinor: 6000,
    priceMinor: null,
    brief: { sizeLabel: "Baby 6–12 months", lettering: "AOIFE", colourWishes: "Soft white and Lichen green", notes: "No cord please." },
    path: ["enquiry"],
  },
  {
    key: "priya-pullover",
    client: "priya",
    title: "Yoke pullover with a fox band",
    garment: "pullover",
    wearer: "adult",
    state: "proof_sent",
    neededBy: "2027-03-01",
    budgetMinor: 52000,
    priceMinor: 48500,
    brief: { measurements: { chestCm: 96, bodyLengthCm: 60, sleeveLengthCm: 46 }, motifWishes: ["fox", "peerie"] },
    path: ["enquiry", "quoting", "quote_sent", "booked", "designing", "proof_sent"],
  },
  {
    key: "elias-reindeer",
    client: "elias",
    title: "Reindeer mittens (last winter)",
    garment: "mittens",
    wearer: "adult",
    state: "closed",
    neededBy: "2025-12-15",
    budgetMinor: 15000,
    priceMinor: 13600,
    brief: { sizeLabel: "Man L", motifWishes: ["reindeer"] },
    path: [
      "enquiry", "quoting", "quote_sent", "booked", "designing", "proof_sent", "proof_approved",
      "in_production", "ready", "balance_paid", "shipped", "delivered", "closed",
    ],
  },
];

export async function seedDemo(): Promise<{ created: boolean }> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  return db.transaction(async (tx) => {
    // One transaction, guarded by an advisory lock, so two starts cannot seed twice.
    await tx.execute(sql`select pg_advisory_xact_lock(4242001)`);
    const [existing] = await tx.select().from(studios).where(eq(studios.slug, "hollin-knitworks"));
    if (existing) return { created: false };

    const ids: Record<string, string> = {};
    for (const p of DEMO_PEOPLE) {
      const id = `demo-${p.key}`;
      ids[p.key] = id;
      await tx.insert(user).values({ id, name: p.name, email: p.email, emailVerified: true });
      await tx.insert(account).values({
        id: `demo-account-${p.key}`,
        accountId: id,
        providerId: "credential",
        userId: id,
        password: passwordHash,
      });
    }
    const [studio] = await tx
      .insert(studios)
      .values({
        slug: "hollin-knitworks",
        name: "Hollin Knitworks",
        tagline: "Mittens, hats and yoke pullovers with your initials knitted in.",
        about:
          "A two-person studio in a converted byre. We knit every piece in two colours of stranded wool at a firm gauge and add the rest by duplicate stitch, so small letters and bright details stay crisp.",
        makes: ["mittens", "hat", "pullover"],
        leadTimeWeeks: 5,
        currency: "GBP",
        timeZone: "Europe/London",
        brandHex: "#A3342A",
        contactEmail: "maren@hollin.test",
      })
      .returning();
    await tx.insert(studioMembers).values([
      { studioId: studio.id, userId: ids.owner, role: "owner" },
      { studioId: studio.id, userId: ids.assistant, role: "assistant" },
    ]);
    const clientIds: Record<string, string> = {};
    for (const p of DEMO_PEOPLE.filter((x) => x.role === "client")) {
      const [c] = await tx
        .insert(studioClients)
        .values({ studioId: studio.id, userId: ids[p.key], displayName: p.name })
        .returning();
      clientIds[p.key] = c.id;
    }
    const yarnIds: Record<string, string> = {};
    for (const [i, y] of YARNS.entries()) {
      const [row] = await tx
        .insert(yarns)
        .values({
          studioId: studio.id,
          name: "Skerry 4-ply",
          colourName: y.colourName,
          hex: y.hex,
          fibre: "Wool (100 %, non-superwash)",
          weightCategory: 1,
          metresPerSkein: 200,
          gramsPerSkein: 50,
          priceMinor: 850,
        })
        .returning();
      yarnIds[y.colourName] = row.id;
      await tx.insert(yarnLots).values({ yarnId: row.id, lotCode: `SK${24 + i}A`, stockSkeins: 4 + ((i * 3) % 7) });
    }
    let number = 1;
    const commissionIds: Record<string, string> = {};
    for (const c of COMMISSIONS) {
      const [row] = await tx
        .insert(commissions)
        .values({
          studioId: studio.id,
          clientId: clientIds[c.client],
          number: number++,
          title: c.title,
          garment: c.garment,
          wearer: c.wearer,
          state: c.state,
          neededBy: c.neededBy,
          currency: "GBP",
          budgetMinor: c.budgetMinor,
          priceMinor: c.priceMinor,
          brief: c.brief,
          sizing: c.sizing ?? null,
        })
        .returning();
      commissionIds[c.key] = row.id;
      const start = Date.parse(c.neededBy) - 60 * 86_400_000;
      for (let k = 0; k < c.path.length; k++) {
        await tx.insert(commissionEvents).values({
          commissionId: row.id,
          actorUserId: k === 0 ? ids[c.client] : ids.owner,
          actorRole: k === 0 ? "client" : "owner",
          kind: k === 0 ? "requested" : "state_changed",
          fromState: k === 0 ? null : c.path[k - 1],
          toState: c.path[k],
          at: new Date(start + k * 3 * 86_400_000),
        });
      }
    }
    await tx.update(studios).set({ nextCommissionNo: number }).where(and(eq(studios.id, studio.id)));
    const ctx: SeedContext = { studioId: studio.id, userIds: ids, clientIds, commissionIds, yarnIds };
    // Each area adds its own demo rows (db/seed-parts/), in this order.
    await seedDesigns(tx, ctx);
    await seedQuotes(tx, ctx);
    await seedJourney(tx, ctx);
    await seedPayments(tx, ctx);
    await seedProduction(tx, ctx);
    return { created: true };
  });
}

async function main() {
  if (process.env.DARNWELL_DEMO !== "1") {
    console.error("seed: refusing to add demo accounts: DARNWELL_DEMO=1 is set only for the local demo database");
    process.exit(1);
  }
  const { created } = await seedDemo();
  console.log(created ? "seed: demo scenario added" : "seed: demo scenario already present");
  await closeDb();
}

if (process.argv[1] && /seed\.ts$/.test(process.argv[1])) void main();
