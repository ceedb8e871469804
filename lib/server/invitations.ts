import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { and, eq, gt, isNull } from "drizzle-orm";
import { db } from "@/db";
import { studioInvitations, studioMembers, studios } from "@/db/schema";
import { env } from "@/lib/env";
import { invitationMessage } from "@/templates/email/auth";
import { assertCan, type Actor } from "./authz";
import { AppError, conflict } from "./errors";
import { enqueueMail } from "./outbox";

const INVITATION_DAYS = 7;
export const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");

export async function inviteMember(actor: Actor, studioId: string, email: string) {
  assertCan(actor, "studio.team", studioId);
  const normalised = email.trim().toLowerCase();
  const [studio] = await db.select().from(studios).where(eq(studios.id, studioId));
  const existing = await db.query.user.findFirst({ where: (u, { eq: e }) => e(u.email, normalised) });
  if (existing) {
    const [member] = await db
      .select()
      .from(studioMembers)
      .where(and(eq(studioMembers.studioId, studioId), eq(studioMembers.userId, existing.id)));
    if (member) throw conflict(`${normalised} is already a member of ${studio.name}.`);
  }
  const token = randomBytes(32).toString("base64url");
  const url = `${env.BETTER_AUTH_URL}/invitations/${token}`;
  // The invitation and its mail are written together: neither exists without the other.
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(studioInvitations)
      .values({
        studioId,
        email: normalised,
        role: "assistant",
        tokenHash: hashToken(token),
        invitedBy: actor.userId,
        expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
      })
      .returning({ id: studioInvitations.id });
    await enqueueMail({ to: normalised, studioId, ...invitationMessage(studio.name, actor.name, url) }, tx);
    return { id: row.id, email: normalised };
  });
}

export type InvitationLookup =
  | { status: "valid"; email: string; studioName: string; studioId: string; id: string }
  | { status: "unknown" | "used" | "expired"; message: string };

export async function lookupInvitation(token: string): Promise<InvitationLookup> {
  if (typeof token !== "string" || token.length > 200) return { status: "unknown", message: "This invitation link is not valid. Check that you copied all of it." };
  const [row] = await db
    .select({ inv: studioInvitations, studioName: studios.name })
    .from(studioInvitations)
    .innerJoin(studios, eq(studios.id, studioInvitations.studioId))
    .where(eq(studioInvitations.tokenHash, hashToken(token)));
  if (!row) return { status: "unknown", message: "This invitation link is not valid. Check that you copied all of it." };
  if (row.inv.acceptedAt)
    return { status: "used", message: "This invitation has already been used. Sign in with the account that accepted it." };
  if (row.inv.expiresAt < new Date())
    return { status: "expired", message: "This invitation has expired. Ask the studio owner to send a new one." };
  return { status: "valid", email: row.inv.email, studioName: row.studioName, studioId: row.inv.studioId, id: row.inv.id };
}

/** Accepts once, in one transaction; a second use (even racing) is refused. */
export async function acceptInvitation(actor: Actor, token: string) {
  const found = await lookupInvitation(token);
  if (found.status !== "valid") throw new AppError(409, `invitation_${found.status}`, found.message);
  if (found.email !== actor.email.toLowerCase()) {
    throw new AppError(
      403,
      "invitation_other_email",
      `This invitation is for ${found.email}. Sign out and sign in (or sign up) with that address.`,
    );
  }
  return db.transaction(async (tx) => {
    const claimed = await tx
      .update(studioInvitations)
      .set({ acceptedAt: new Date(), acceptedBy: actor.userId })
      .where(
        and(
          eq(studioInvitations.id, found.id),
          isNull(studioInvitations.acceptedAt),
          gt(studioInvitations.expiresAt, new Date()),
        ),
      )
      .returning({ role: studioInvitations.role });
    if (claimed.length === 0) throw new AppError(409, "invitation_used", "This invitation has already been used.");
    await tx
      .insert(studioMembers)
      .values({ studioId: found.studioId, userId: actor.userId, role: claimed[0].role })
      .onConflictDoNothing();
    return { studioId: found.studioId, studioName: found.studioName };
  });
}
