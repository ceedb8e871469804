// Demo journey rows: the yoke pullover (priya-pullover, "Proof sent") gets its design, proof 1
// waiting for Priya's answer, and a short message thread.
import { createHash } from "node:crypto";
import { and, desc, eq, ne } from "drizzle-orm";
import { createChart, getMotif, placeLettering, serializeChart, tileMotif } from "../../lib/core/chart";
import { designs, designVersions, messages, proofs, quoteVersions, type DesignChartEntry } from "../schema";
import type { SeedPart } from "./context";

function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== "object") return JSON.stringify(value) ?? "null";
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(",")}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(",")}}`;
}
const sha = (s: string) => createHash("sha256").update(s).digest("hex");

/** A yoke band: foxes between peerie borders, with "PO" under the foxes (96 × 30 at 26/30). */
function buildYokeBand(): DesignChartEntry[] {
  const palette = [
    { key: "A", name: "Loch blue", hex: "#2E5A7A" },
    { key: "B", name: "Gull white", hex: "#F2EEE4" },
    { key: "C", name: "Rowanberry", hex: "#A8322D" },
  ];
  let c = createChart(96, 30, { stitchesPer10cm: 26, rowsPer10cm: 30 }, palette);
  c = tileMotif(c, getMotif("diamond-peerie"), { x: 0, y: 1, width: 96, height: 5 }, { pattern: 1 });
  c = tileMotif(c, getMotif("fox"), { x: 0, y: 8, width: 96, height: getMotif("fox").height }, { pattern: 2 });
  c = tileMotif(c, getMotif("lice"), { x: 0, y: 8 + getMotif("fox").height, width: 96, height: 30 - 8 - getMotif("fox").height }, { pattern: 1 });
  const layer = { text: "PO", font: "3x5" as const, box: { x: 42, y: 1, width: 12, height: 6 }, key: "C", backgroundKey: "A" };
  c = placeLettering(c, { text: layer.text, font: layer.font, box: layer.box, colour: 2, background: 0 });
  return [{ area: "yoke-band", label: "Yoke band", chart: serializeChart(c), lettering: [layer] }];
}

export const seedJourney: SeedPart = async (tx, ctx) => {
  const commissionId = ctx.commissionIds["priya-pullover"];
  if (!commissionId) return;
  let [design] = await tx.select().from(designs).where(eq(designs.commissionId, commissionId)).limit(1);
  if (!design) {
    [design] = await tx.insert(designs).values({ studioId: ctx.studioId, commissionId, title: "Yoke with a fox band" }).returning();
    const charts = buildYokeBand();
    const [v] = await tx
      .insert(designVersions)
      .values({ designId: design.id, number: 1, charts, contentHash: sha(canonicalJson(charts)), note: "Demo design", createdBy: ctx.userIds.owner })
      .returning();
    await tx.update(designs).set({ headVersionId: v.id }).where(eq(designs.id, design.id));
    design = { ...design, headVersionId: v.id };
  }
  const [v] = await tx.select().from(designVersions).where(eq(designVersions.id, design.headVersionId!));
  const [q] = await tx
    .select({ id: quoteVersions.id })
    .from(quoteVersions)
    .where(and(eq(quoteVersions.commissionId, commissionId), ne(quoteVersions.status, "draft")))
    .orderBy(desc(quoteVersions.number))
    .limit(1);
  // Same fingerprint as lib/server/proofs.ts proofHash (that module is server-only).
  const contentHash = sha(`darnwell-proof\n1\n${v.contentHash}\n${q?.id ?? ""}`);
  await tx.insert(proofs).values({
    commissionId,
    number: 1,
    designVersionId: v.id,
    quoteVersionId: q?.id ?? null,
    contentHash,
    noteToClient: "Here is the fox band with your initials under the foxes. Tap any stitch to comment.",
    sentBy: ctx.userIds.owner,
  });
  await tx.insert(messages).values([
    { commissionId, authorUserId: ctx.userIds.priya, authorRole: "client", body: "Could the foxes face the other way on the back?", clientKey: "seed-1" },
    { commissionId, authorUserId: ctx.userIds.owner, authorRole: "owner", body: "We can mirror the band at the back seam; I will show it on the next proof if you like.", clientKey: "seed-2" },
  ]);
};
