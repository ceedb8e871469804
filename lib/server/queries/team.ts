import "server-only";
import { and, asc, eq, gt, isNull } from "drizzle-orm";
import { db } from "@/db";
import { studioInvitations, studioMembers, user } from "@/db/schema";
import { assertCan, type Actor } from "../authz";

export async function getTeam(actor: Actor, studioId: string) {
  assertCan(actor, "studio.view", studioId);
  const members = await db
    .select({ id: studioMembers.id, role: studioMembers.role, name: user.name, email: user.email })
    .from(studioMembers)
    .innerJoin(user, eq(user.id, studioMembers.userId))
    .where(eq(studioMembers.studioId, studioId))
    .orderBy(asc(studioMembers.createdAt));
  const pending = await db
    .select({ id: studioInvitations.id, email: studioInvitations.email, expiresAt: studioInvitations.expiresAt })
    .from(studioInvitations)
    .where(
      and(
        eq(studioInvitations.studioId, studioId),
        isNull(studioInvitations.acceptedAt),
        gt(studioInvitations.expiresAt, new Date()),
      ),
    )
    .orderBy(asc(studioInvitations.createdAt));
  return { members, pending };
}
