import "server-only";
// Shipping (owner only, through the workflow's `ship` move) and the care card for a commission.
import { eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { commissions, shipments, studios, yarnReservations, yarns } from "@/db/schema";
import { getCareCard } from "@/lib/core/production";
import { env } from "@/lib/env";
import { CareCardDocument } from "@/templates/pdf/care-card";
import { shippedMessage } from "@/templates/email/production";
import { assertCan, memberRole, type Actor } from "./authz";
import { notFound } from "./errors";
import { notify } from "./notifications";
import { renderPdf } from "./pdf";
import { getCommissionFor, getCommissionMailParties } from "./queries/commissions";
import { moveCommission } from "./workflow";

/** Marks a commission shipped with carrier and tracking, and tells the client (outbox), in one transaction. */
export async function shipCommission(actor: Actor, input: { commissionId: string; carrier: string; tracking: string }) {
  const [c] = await db.select().from(commissions).where(eq(commissions.id, input.commissionId));
  if (!c || memberRole(actor, c.studioId) === null) throw notFound("That commission");
  assertCan(actor, "commission.ship", c.studioId);
  return db.transaction(async (tx) => {
    const outcome = await moveCommission(actor, c.id, "ship", { tx, detail: { carrier: input.carrier, tracking: input.tracking } });
    const [shipment] = await tx
      .insert(shipments)
      .values({ commissionId: c.id, carrier: input.carrier, tracking: input.tracking, shippedBy: actor.userId })
      .returning();
    const who = await getCommissionMailParties(tx, c.id);
    const base = env.BETTER_AUTH_URL.replace(/\/$/, "");
    const mail = shippedMessage({
      studioName: who.studioName,
      clientName: who.clientName,
      title: c.title,
      carrier: input.carrier,
      tracking: input.tracking,
      commissionUrl: `${base}/portal/commissions/${c.id}`,
      careCardUrl: `${base}/api/commissions/${c.id}/care-card`,
      accentHex: who.brandHex,
    });
    await notify(tx, { to: "client", kind: "shipped", studioId: c.studioId, commissionId: c.id, key: `shipped:${shipment.id}`, actorUserId: actor.userId, link: `/portal/commissions/${c.id}`,
      title: `${who.studioName} posted ${c.title}`, body: `Sent with ${input.carrier}, tracking ${input.tracking}.`, mail: { ...mail, replyTo: who.contactEmail, dedupeKey: `shipped:${shipment.id}` } });
    return { outcome, shipment };
  });
}

export async function getShipments(actor: Actor, commissionId: string) {
  const c = await getCommissionFor(actor, commissionId);
  return db.select().from(shipments).where(eq(shipments.commissionId, c.id));
}

/**
 * The fibres a commission's cautions and care go by: its reserved yarns, or with none reserved
 * the studio's usual yarns (the demo studio knits wool only). Callers have checked access.
 */
export async function getCommissionFibres(c: { id: string; studioId: string }): Promise<{ fibres: string[]; reserved: (typeof yarns.$inferSelect)[] }> {
  const held = await db.select({ yarnId: yarnReservations.yarnId }).from(yarnReservations).where(eq(yarnReservations.commissionId, c.id));
  const reserved = held.length ? await db.select().from(yarns).where(inArray(yarns.id, held.map((r) => r.yarnId))) : [];
  const fibres = reserved.length
    ? reserved.map((y) => y.fibre)
    : (await db.select({ fibre: yarns.fibre }).from(yarns).where(eq(yarns.studioId, c.studioId)).limit(20)).map((y) => y.fibre);
  return { fibres, reserved };
}

/** The care card PDF for a commission the actor may see (its studio, or its own client). */
export async function renderCareCard(actor: Actor, commissionId: string): Promise<{ pdf: Buffer; filename: string }> {
  const c = await getCommissionFor(actor, commissionId);
  const [row] = await db.select({ wearer: commissions.wearer, garment: commissions.garment, sizing: commissions.sizing }).from(commissions).where(eq(commissions.id, c.id));
  const { fibres, reserved: yarnRows } = await getCommissionFibres(c);
  const [studio] = await db.select().from(studios).where(eq(studios.id, c.studioId));
  // A standard child's size chosen in the sizing form can only make the cautions stricter.
  const sizeKey = typeof row?.sizing?.size === "string" ? row.sizing.size : null;
  const card = getCareCard({ fibres, wearer: row?.wearer ?? "adult", garment: row?.garment ?? "pullover", sizeKey });
  const pdf = await renderPdf(
    CareCardDocument({
      studio: { name: studio.name, contactEmail: studio.contactEmail, brandHex: studio.brandHex },
      piece: { title: c.title, clientName: c.clientName, yarns: [...new Set(yarnRows.map((y) => `${y.name}, ${y.colourName} (${y.fibre})`))] },
      card,
    }),
  );
  return { pdf, filename: `care-card-${c.number}.pdf` };
}
