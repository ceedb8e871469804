import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { db } from "@/db";
import { studioInvitations, studioMembers } from "@/db/schema";
import { acceptInvitation, hashToken, inviteMember, lookupInvitation } from "@/lib/server/invitations";
import { freshEmail, makeUser, makeWorld, waitForMail, type World } from "./helpers";

let w: World;
beforeAll(async () => {
  w = await makeWorld();
});

const tokenFrom = (link: string) => link.split("/invitations/")[1];

describe("the owner invites an assistant by e-mail", () => {
  test("invitation mail → accept → member with the assistant role; the link works once", async () => {
    const owner = await w.actor(w.owner.id);
    const invitee = await makeUser("invitee");
    await inviteMember(owner, w.studioId, invitee.email);
    const mail = await waitForMail(invitee.email, (m) => /invited you/.test(m.subject));
    const link = mail.links.find((l) => l.includes("/invitations/"))!;
    const token = tokenFrom(link);
    expect((await lookupInvitation(token)).status).toBe("valid");

    const actor = await w.actor(invitee.id);
    await acceptInvitation(actor, token);
    const [m] = await db.select().from(studioMembers).where(eq(studioMembers.userId, invitee.id));
    expect(m.role).toBe("assistant");
    expect(m.studioId).toBe(w.studioId);

    await expect(acceptInvitation(actor, token)).rejects.toMatchObject({ status: 409, message: /already been used/ });
  });

  test("two acceptances racing end with one membership", async () => {
    const owner = await w.actor(w.owner.id);
    const invitee = await makeUser("racer");
    await inviteMember(owner, w.studioId, invitee.email);
    const mail = await waitForMail(invitee.email);
    const token = tokenFrom(mail.links.find((l) => l.includes("/invitations/"))!);
    const actor = await w.actor(invitee.id);
    const results = await Promise.allSettled([acceptInvitation(actor, token), acceptInvitation(actor, token)]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    const rows = await db.select().from(studioMembers).where(eq(studioMembers.userId, invitee.id));
    expect(rows).toHaveLength(1);
  });

  test("an assistant cannot invite; a client cannot invite", async () => {
    const assistant = await w.actor(w.assistant.id);
    await expect(inviteMember(assistant, w.studioId, freshEmail("x"))).rejects.toMatchObject({ status: 403 });
    const client = await w.actor(w.clientA.id);
    await expect(inviteMember(client, w.studioId, freshEmail("y"))).rejects.toMatchObject({ status: 404 });
  });

  test("the wrong account, an expired link and a made-up link each get a clear message", async () => {
    const owner = await w.actor(w.owner.id);
    const invitee = await makeUser("wrongacct");
    await inviteMember(owner, w.studioId, invitee.email);
    const token = tokenFrom((await waitForMail(invitee.email)).links.find((l) => l.includes("/invitations/"))!);

    const someoneElse = await w.actor(w.clientB.id);
    await expect(acceptInvitation(someoneElse, token)).rejects.toMatchObject({ status: 403, message: /is for/ });

    await db.update(studioInvitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(studioInvitations.tokenHash, hashToken(token)));
    const expired = await lookupInvitation(token);
    expect(expired).toMatchObject({ status: "expired", message: expect.stringMatching(/expired/) });
    await expect(acceptInvitation(await w.actor(invitee.id), token)).rejects.toMatchObject({ status: 409 });

    expect(await lookupInvitation("made-up-token-123")).toMatchObject({ status: "unknown" });
  });

  test("inviting someone who is already a member is refused", async () => {
    const owner = await w.actor(w.owner.id);
    await expect(inviteMember(owner, w.studioId, w.assistant.email)).rejects.toMatchObject({ status: 409 });
  });
});
