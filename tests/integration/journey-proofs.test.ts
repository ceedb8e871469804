import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import { eq } from "drizzle-orm";
import { describe, expect, test } from "vitest";
import { db } from "@/db";
import { commissionEvents, commissions, designs, designVersions, outboxMessages, proofComments, proofs, studios } from "@/db/schema";
import { AppError } from "@/lib/server/errors";
import { approveProof, getProofView, listProofs, requestProofChanges, sendProof } from "@/lib/server/proofs";
import { makeWorld, waitForMail, type World } from "./helpers";

const band = JSON.parse(readFileSync("tests/fixtures/charts/peerie-band.json", "utf8")) as { rows: string[] } & Record<string, unknown>;

/** A commission in "designing" with a design whose head version is the peerie band. */
async function designing(w: World) {
  await db.update(commissions).set({ state: "designing" }).where(eq(commissions.id, w.commissionA));
  const [d] = await db.insert(designs).values({ studioId: w.studioId, commissionId: w.commissionA, title: "Band" }).returning();
  const v1 = await addVersion(d.id, 1, band.rows);
  return { designId: d.id, v1 };
}

async function addVersion(designId: string, number: number, rows: string[], palette?: unknown) {
  const charts = [{ area: "cuff-band", label: "Cuff band", chart: { ...band, rows, ...(palette ? { palette } : {}) } }];
  const [v] = await db
    .insert(designVersions)
    .values({ designId, number, charts, contentHash: createHash("sha256").update(JSON.stringify(charts)).digest("hex") })
    .returning();
  await db.update(designs).set({ headVersionId: v.id }).where(eq(designs.id, designId));
  return v;
}

// As a handler sees them behind proxy.ts: what the client sent moved aside, the socket's address in X-Forwarded-For.
const headers = (ip: string) => new Headers({ "x-darnwell-forwarded-for": "10.0.0.1", "x-forwarded-for": ip });

describe("proofs", () => {
  test("send, ask for changes on a stitch, send proof 2 with differences, approve it: locked, mailed, audited", async () => {
    const w = await makeWorld();
    const owner = await w.actor(w.owner.id);
    const client = await w.actor(w.clientA.id);
    const { designId, v1 } = await designing(w);

    const p1 = await sendProof(owner, w.commissionA, "First go");
    expect(p1.number).toBe(1);
    expect(p1.designVersionId).toBe(v1.id);
    expect(p1.contentHash).toMatch(/^[0-9a-f]{64}$/);
    const mail = await waitForMail(w.clientA.email, (m) => m.subject.includes("Proof 1"));
    expect(mail.links.some((l) => l.includes(`/portal/commissions/${w.commissionA}/proofs/${p1.id}`))).toBe(true);
    const [queued] = await db.select().from(outboxMessages).where(eq(outboxMessages.dedupeKey, `proof-sent:${p1.id}`));
    expect(queued.attachments[0].contentType).toBe("image/png");
    expect(Buffer.from(queued.attachments[0].base64, "base64").subarray(1, 4).toString()).toBe("PNG");

    await requestProofChanges(client, p1.id, { contentHash: p1.contentHash, note: "Bolder please", comments: [{ chartIndex: 0, row: 3, stitch: 2, body: "Make this red" }] }, headers("203.0.113.9"));
    const pinned = await db.select().from(proofComments).where(eq(proofComments.proofId, p1.id));
    expect(pinned.find((c) => c.row === 3)).toMatchObject({ stitch: 2, chartIndex: 0, body: "Make this red" });
    await waitForMail(`studio-${(await db.select().from(studios).where(eq(studios.id, w.studioId)))[0].slug.slice(3)}@it.test`, (m) => m.subject.includes("asked for changes"));
    expect((await db.select().from(commissions).where(eq(commissions.id, w.commissionA)))[0].state).toBe("designing");

    // Proof 2 from a changed design: one stitch recoloured in a new colour.
    const rows = [...band.rows];
    rows[0] = "C" + rows[0].slice(1);
    const palette = [...(band.palette as unknown[]), { key: "C", name: "Gorse", hex: "#E0B33A" }];
    await addVersion(designId, 2, rows, palette);
    const p2 = await sendProof(owner, w.commissionA, "");
    expect(p2.number).toBe(2);
    const view = await getProofView(client, w.commissionA, p2.id);
    expect(view.previousNumber).toBe(1);
    expect(view.diff?.[0]).toMatchObject({ status: "changed", cellsChanged: 1, coloursAdded: ["Gorse"] });

    // Proof 1 is answered and old: refused.
    await expect(approveProof(client, p1.id, p1.contentHash, headers("203.0.113.9"))).rejects.toMatchObject({ status: 409, code: "stale_proof" });
    // A hash that is not the proof's: refused.
    await expect(approveProof(client, p2.id, "0".repeat(64), headers("203.0.113.9"))).rejects.toMatchObject({ status: 409 });
    // The owner cannot approve for the client.
    await expect(approveProof(owner, p2.id, p2.contentHash, null)).rejects.toMatchObject({ status: 403 });

    const done = await approveProof(client, p2.id, p2.contentHash, headers("203.0.113.9"));
    expect(done).toMatchObject({ status: "approved", decidedBy: w.clientA.id, decisionIp: "203.0.113.9" });
    expect(done.decidedAt).toBeInstanceOf(Date);
    const [d] = await db.select().from(designs).where(eq(designs.id, designId));
    expect(d.lockedVersionId).toBe(p2.designVersionId);
    const [c] = await db.select().from(commissions).where(eq(commissions.id, w.commissionA));
    expect(c.state).toBe("proof_approved");
    const events = await db.select().from(commissionEvents).where(eq(commissionEvents.commissionId, w.commissionA));
    const approval = events.find((e) => e.detail.move === "approve_proof");
    expect(approval?.detail).toMatchObject({ proofId: p2.id, contentHash: p2.contentHash });
    expect((await listProofs(client, w.commissionA)).map((p) => [p.number, p.status])).toEqual([
      [2, "approved"],
      [1, "changes_requested"],
    ]);
  });

  test("two approvals racing end with one", async () => {
    const w = await makeWorld();
    const owner = await w.actor(w.owner.id);
    const client = await w.actor(w.clientA.id);
    await designing(w);
    const p = await sendProof(owner, w.commissionA, "");
    const results = await Promise.allSettled([
      approveProof(client, p.id, p.contentHash, headers("198.51.100.1")),
      approveProof(client, p.id, p.contentHash, headers("198.51.100.2")),
      approveProof(client, p.id, p.contentHash, headers("198.51.100.3")),
    ]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    for (const r of results.filter((x) => x.status === "rejected")) expect(((r as PromiseRejectedResult).reason as AppError).status).toBe(409);
    const events = await db.select().from(commissionEvents).where(eq(commissionEvents.commissionId, w.commissionA));
    expect(events.filter((e) => e.detail.move === "approve_proof")).toHaveLength(1);
  });

  test("another client gets 404 for the proof; no design means no proof; the assistant cannot send one", async () => {
    const w = await makeWorld();
    const owner = await w.actor(w.owner.id);
    const assistant = await w.actor(w.assistant.id);
    const clientB = await w.actor(w.clientB.id);
    await db.update(commissions).set({ state: "designing" }).where(eq(commissions.id, w.commissionA));
    await expect(sendProof(owner, w.commissionA, "")).rejects.toMatchObject({ status: 422, code: "no_design" });
    await designing(w).catch(() => undefined);
    await expect(sendProof(assistant, w.commissionA, "")).rejects.toMatchObject({ status: 403 });
    const p = await sendProof(owner, w.commissionA, "");
    await expect(getProofView(clientB, w.commissionA, p.id)).rejects.toMatchObject({ status: 404 });
    await expect(approveProof(clientB, p.id, p.contentHash, null)).rejects.toMatchObject({ status: 404 });
    await expect(requestProofChanges(clientB, p.id, { contentHash: p.contentHash, note: "x", comments: [] }, null)).rejects.toMatchObject({ status: 404 });
    await expect(getProofView(await w.actor(w.outsider.id), w.commissionA, p.id)).rejects.toMatchObject({ status: 404 });
    const [row] = await db.select().from(proofs).where(eq(proofs.id, p.id));
    expect(row.status).toBe("sent");
  });
});
