import "server-only";
// Yarn per studio yarn for a commission's current design, read from its garment (every stitch of
// every piece, lib/server/garment.ts), and the free stock of each dye lot (recorded stock less what
// other live commissions hold on it).
import { and, asc, desc, eq, inArray, isNull, ne, notInArray } from "drizzle-orm";
import { db } from "@/db";
import { commissions, designVersions, designs, yarnLots, yarnReservations, yarns, type CommissionBrief, type GarmentKind } from "@/db/schema";
import { estimateGarmentYarn, type DesignYarnEstimate, type StudioYarnRecord } from "@/lib/core/yarn/design-yarn";
import { assertCan, type Actor } from "./authz";
import type { CommissionGarment } from "./garment";

/** Commission states that no longer hold yarn (as the yarn records count them). */
const NOT_HOLDING = ["shipped", "delivered", "closed", "declined", "cancelled"] as const;

export interface CommissionYarnEstimate extends DesignYarnEstimate {
  designTitle: string;
  designVersion: number;
  /** what the garment was sized from, its stand-in note and charts not counted */
  plainNote: string;
}

/** The design version a quote prices: the approved one if any, else the head. No permission check: callers read the commission for their actor first. */
export async function getPricedDesignVersion(commissionId: string) {
  const [d] = await db.select().from(designs).where(eq(designs.commissionId, commissionId)).orderBy(desc(designs.updatedAt)).limit(1);
  if (!d) return null;
  const versionId = d.lockedVersionId ?? d.headVersionId;
  const [v] = versionId
    ? await db.select().from(designVersions).where(eq(designVersions.id, versionId))
    : await db.select().from(designVersions).where(eq(designVersions.designId, d.id)).orderBy(desc(designVersions.number)).limit(1);
  return v ? { design: d, version: v } : null;
}

/** Studio yarns with the skeins of each lot not held by another live commission. */
async function studioYarnRecords(studioId: string, commissionId: string): Promise<StudioYarnRecord[]> {
  const rows = await db.select().from(yarns).where(eq(yarns.studioId, studioId)).orderBy(asc(yarns.createdAt), asc(yarns.colourName));
  const ids = rows.map((y) => y.id);
  if (!ids.length) return [];
  const lots = await db.select().from(yarnLots).where(inArray(yarnLots.yarnId, ids)).orderBy(asc(yarnLots.lotCode));
  const held = await db
    .select({ lotId: yarnReservations.lotId, skeins: yarnReservations.skeins })
    .from(yarnReservations)
    .innerJoin(commissions, eq(commissions.id, yarnReservations.commissionId))
    .where(
      and(
        inArray(yarnReservations.yarnId, ids),
        isNull(yarnReservations.releasedAt),
        ne(yarnReservations.commissionId, commissionId),
        notInArray(commissions.state, [...NOT_HOLDING]),
      ),
    );
  return rows.map((y) => {
    const own = lots.filter((l) => l.yarnId === y.id);
    return {
      id: y.id,
      name: y.name,
      colourName: y.colourName,
      hex: y.hex,
      metresPerSkein: y.metresPerSkein,
      gramsPerSkein: y.gramsPerSkein,
      ...(own.length
        ? {
            lots: own.map((l) => ({
              lot: l.lotCode,
              skeins: Math.max(0, l.stockSkeins - held.filter((h) => h.lotId === l.id).reduce((s, h) => s + h.skeins, 0)),
            })),
          }
        : {}),
    };
  });
}

/**
 * Yarn for the design a quote prices, read from the commission's garment: every stitch of every
 * piece once, per colour, darned stitches over their real underlay, then matched to the studio's
 * yarns. Null when the commission has no design. The caller has read the commission for this
 * actor; the studio check is made here as well.
 */
export async function getCommissionYarnEstimate(
  actor: Actor,
  c: { id: string; studioId: string; garment: GarmentKind; brief: CommissionBrief | null },
  /** the priced version when the caller has loaded it already */
  preloaded?: Awaited<ReturnType<typeof getPricedDesignVersion>>,
  /** the commission's garment when the caller has read it already (lib/server/garment.ts) */
  loadedGarment?: CommissionGarment,
): Promise<CommissionYarnEstimate | null> {
  assertCan(actor, "studio.view", c.studioId);
  const priced = preloaded === undefined ? await getPricedDesignVersion(c.id) : preloaded;
  if (!priced || priced.design.studioId !== c.studioId) return null;
  const { getCommissionGarment, problemsText } = await import("./garment");
  const garment = loadedGarment ?? (await getCommissionGarment(c, { priced }));
  const records = await studioYarnRecords(c.studioId, c.id);
  const pieces = garment.reading.pieces.map((p) => p.name);
  const estimate = estimateGarmentYarn({ yarn: garment.reading.yarn, yarns: records, pieces });
  const problems = problemsText(garment.problems);
  const r1 = (v: number) => Math.round(v * 10) / 10;
  const from = garment.sizedFrom === "saved sizing" ? "the saved sizing" : garment.sizedFrom === "brief" ? (garment.sizing.size ? `size ${garment.sizing.size} from the brief` : "the brief's measurements") : "a standard size";
  const plainNote = [
    `Every stitch of the ${pieces.join(", ")} (${garment.sizing.pieces.reduce((s, p) => s + p.stitches * p.quantity, 0).toLocaleString("en-GB")} stitches), sized from ${from} at ${r1(garment.sizing.gauge.stitchesPer10cm)} sts per 10 cm, with the design's charts on their areas; darned stitches over the colour knitted under them.`,
    garment.note,
    problems,
  ]
    .filter(Boolean)
    .join(" ");
  return { ...estimate, designTitle: priced.design.title, designVersion: priced.version.number, plainNote };
}
