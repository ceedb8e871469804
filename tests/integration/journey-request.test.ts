import { eq } from "drizzle-orm";
import sharp from "sharp";
import { describe, expect, test } from "vitest";
import { db } from "@/db";
import { commissionEvents, commissions, requestDrafts, studioClients, studios, uploads, yarns } from "@/db/schema";
import { loadActor } from "@/lib/server/authz";
import { AppError } from "@/lib/server/errors";
import { createCommissionFromRequest, finishDraft, loadDraft, newDraftToken, saveDraft } from "@/lib/server/requests";
import { storeUpload } from "@/lib/server/uploads";
import { emptyRequest } from "@/lib/schemas/request";
import { makeUser, makeWorld, uid, waitForMail } from "./helpers";

async function studioWithYarn() {
  const w = await makeWorld();
  await db.update(studios).set({ makes: ["mittens", "hat"], nextCommissionNo: 41 }).where(eq(studios.id, w.studioId));
  const [y] = await db
    .insert(yarns)
    .values({ studioId: w.studioId, name: "Test 4-ply", colourName: "Moss", hex: "#556B2F", fibre: "Wool", weightCategory: 1, metresPerSkein: 200, gramsPerSkein: 50, priceMinor: 800 })
    .returning();
  const [s] = await db.select().from(studios).where(eq(studios.id, w.studioId));
  return { w, studio: s, yarnId: y.id };
}

const photo = () => sharp({ create: { width: 40, height: 30, channels: 3, background: "#a83" } }).jpeg().toBuffer();

describe("a commission request", () => {
  test("creates the commission with the next number, a client link, an audit row, the photos and two mails", async () => {
    const { studio, yarnId } = await studioWithYarn();
    const person = await makeUser("requester", "Wren Talbot");
    const actor = (await loadActor(person.id))!;
    expect(actor.clientOf).toHaveLength(0);
    const token = newDraftToken();
    const up = await storeUpload({ studioId: studio.id, commissionId: null, kind: "reference", uploadedBy: null, bytes: await photo() });
    const draft = await saveDraft(studio.id, token, {}, null);
    await db.update(requestDrafts).set({ uploadIds: [up.id] }).where(eq(requestDrafts.id, draft.id));
    const values = {
      ...emptyRequest("mittens"),
      wearer: "child",
      units: "in",
      measurements: { handCircumference: "6.5" },
      yarnIds: [yarnId],
      colourNotes: "and a little red",
      lettering: "W.T.",
      motifIds: ["fox"],
      budget: "95.50",
      uploadIds: [up.id],
    };
    const c = await createCommissionFromRequest(actor, studio, values, { draftId: draft.id, draftUploadIds: [up.id] });
    expect(c.number).toBe(41);
    const [row] = await db.select().from(commissions).where(eq(commissions.id, c.id));
    expect(row.state).toBe("enquiry");
    expect(row.wearer).toBe("child");
    expect(row.budgetMinor).toBe(9550);
    expect(row.brief.measurements).toEqual({ handCircumferenceCm: 16.5 });
    expect(row.brief.colourWishes).toBe("Moss; and a little red");
    expect(row.brief.motifWishes).toEqual(["Fox"]);
    const [s2] = await db.select().from(studios).where(eq(studios.id, studio.id));
    expect(s2.nextCommissionNo).toBe(42);
    const links = await db.select().from(studioClients).where(eq(studioClients.userId, person.id));
    expect(links.map((l) => l.studioId)).toEqual([studio.id]);
    const events = await db.select().from(commissionEvents).where(eq(commissionEvents.commissionId, c.id));
    expect(events.map((e) => [e.kind, e.toState, e.actorRole])).toEqual([["requested", "enquiry", "client"]]);
    const [attached] = await db.select().from(uploads).where(eq(uploads.id, up.id));
    expect(attached.commissionId).toBe(c.id);
    expect(await loadDraft(studio.id, token)).toBeNull();
    const toStudio = await waitForMail(studio.contactEmail, (m) => m.subject.includes(`no. 41`));
    expect(toStudio.links.some((l) => l.includes(`/studio/commissions/${c.id}`))).toBe(true);
    const toClient = await waitForMail(person.email, (m) => m.subject.includes("has your request"));
    expect(toClient.text).toContain("W.T.");
  });

  test("bad input is refused with field errors and nothing is written", async () => {
    const { studio } = await studioWithYarn();
    const person = await makeUser("badreq");
    const actor = (await loadActor(person.id))!;
    const err = await createCommissionFromRequest(actor, studio, { ...emptyRequest("mittens"), measurements: { handCircumference: "20" }, units: "in" }).catch(
      (e: unknown) => e,
    );
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).status).toBe(422);
    // 20 in is no hand; 20 cm is: the message says which unit it looks like.
    expect((err as AppError).fieldErrors?.["measurements.handCircumference"]?.[0]).toMatch(/looks like centimetres/);
    const other = await createCommissionFromRequest(actor, studio, { ...emptyRequest("pullover"), sizeLabel: "M" }).catch((e: unknown) => e);
    expect((other as AppError).fieldErrors?.garment?.[0]).toMatch(/does not make/);
    const none = await createCommissionFromRequest(actor, studio, { ...emptyRequest("hat") }).catch((e: unknown) => e);
    expect((none as AppError).fieldErrors?.sizeLabel?.[0]).toMatch(/Give a size/);
    const [s2] = await db.select().from(studios).where(eq(studios.id, studio.id));
    expect(s2.nextCommissionNo).toBe(41);
    expect(await db.select().from(studioClients).where(eq(studioClients.userId, person.id))).toHaveLength(0);
  });

  test("a draft with invalid fields saves every valid field and reports each invalid one", async () => {
    const { studio, yarnId } = await studioWithYarn();
    const token = newDraftToken();
    const first = await saveDraft(studio.id, token, { ...emptyRequest("mittens"), lettering: "AB", notes: "Soft please" }, null);
    expect(first.invalid).toEqual({});
    const typed = {
      ...emptyRequest("mittens"),
      wearer: "child",
      lettering: "A<B>", // refused characters
      neededBy: "31/01/2027", // not a date as the form takes it
      notes: "x".repeat(2001), // one over the limit
      yarnIds: [yarnId],
      colourNotes: "Moss with a cream cuff",
      measurements: { handCircumference: "16", handLength: "1".repeat(40) },
      sizeLabel: "Child 6",
    };
    const r = await saveDraft(studio.id, token, typed, null);
    expect(Object.keys(r.invalid).sort()).toEqual(["lettering", "measurements.handLength", "neededBy", "notes"]);
    expect(r.invalid.notes?.join(" ")).toMatch(/Keep the notes to 2000 characters or fewer/);
    expect(r.invalid.neededBy?.join(" ")).toMatch(/date that exists/);
    const back = (await loadDraft(studio.id, token))!.data;
    // The valid fields are kept…
    expect(back).toMatchObject({ wearer: "child", yarnIds: [yarnId], colourNotes: "Moss with a cream cuff", sizeLabel: "Child 6", measurements: { handCircumference: "16" } });
    // …and an invalid field keeps what was saved before instead of being lost or stored wrong.
    expect(back.lettering).toBe("AB");
    expect(back.notes).toBe("Soft please");
    expect(back.neededBy).toBe("");
    expect(back.measurements?.handLength).toBeUndefined();
    // A stored value that has gone stale costs only that field on reading.
    await db.update(requestDrafts).set({ data: { ...back, neededBy: "2001-01-01" } }).where(eq(requestDrafts.id, r.id));
    const stale = (await loadDraft(studio.id, token))!.data;
    expect(stale.neededBy).toBeUndefined();
    expect(stale.colourNotes).toBe("Moss with a cream cuff");
  });

  test("a draft is kept, restored by its token only, and finished after sign-up", async () => {
    const { studio } = await studioWithYarn();
    const token = newDraftToken();
    await saveDraft(studio.id, token, { garment: "hat", lettering: "AB", measurements: { headCircumference: "55" } }, null);
    const back = await loadDraft(studio.id, token);
    expect(back?.data).toMatchObject({ garment: "hat", lettering: "AB", measurements: { headCircumference: "55" } });
    expect(await loadDraft(studio.id, newDraftToken())).toBeNull();
    // An oversized field is never stored: it is reported, and what was saved before stays.
    const over = await saveDraft(studio.id, token, { garment: "hat", lettering: "AB", notes: "x".repeat(5000) }, null);
    expect(over.invalid.notes?.[0]).toMatch(/2000 characters or fewer/);
    expect((await loadDraft(studio.id, token))?.data.notes).toBeUndefined();

    const person = await makeUser(`signup${uid()}`);
    const actor = (await loadActor(person.id))!;
    // Not marked as sent: nothing is created.
    expect(await finishDraft(actor, studio.id, token)).toBeNull();
    await saveDraft(studio.id, token, { ...emptyRequest("hat"), lettering: "AB", measurements: { headCircumference: "55" }, submitted: true }, null);
    const made = await finishDraft(actor, studio.id, token);
    expect(made).not.toBeNull();
    const [row] = await db.select().from(commissions).where(eq(commissions.id, made!.id));
    expect(row.title).toBe("Hat with AB");
    expect(await loadDraft(studio.id, token)).toBeNull();
    await waitForMail(person.email, (m) => m.subject.includes("Hat with AB"));
  });

  test("two requests at once get different numbers", async () => {
    const { studio } = await studioWithYarn();
    const a = (await loadActor((await makeUser("race1")).id))!;
    const b = (await loadActor((await makeUser("race2")).id))!;
    const v = { ...emptyRequest("mittens"), sizeLabel: "Woman M" };
    const [x, y] = await Promise.all([createCommissionFromRequest(a, studio, v), createCommissionFromRequest(b, studio, v)]);
    expect([x.number, y.number].sort()).toEqual([41, 42]);
  });
});
