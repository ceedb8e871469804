import "server-only";
// The one authorisation helper. Every page, server action, route handler and query asks it.
// A client sees only their own commissions; a member only their studio's; an assistant may
// work on commissions but not change prices, payments or the team.
import { eq } from "drizzle-orm";
import { headers } from "next/headers";
import { db } from "@/db";
import { studioClients, studioMembers, studios } from "@/db/schema";
import type { MemberRole } from "@/db/schema";
import { getAuth } from "./auth";
import { forbidden, notFound, unauthenticated } from "./errors";

export interface Actor {
  userId: string;
  email: string;
  name: string;
  memberships: { studioId: string; studioSlug: string; studioName: string; role: MemberRole }[];
  clientOf: { studioId: string; clientId: string }[];
}

export type Permission =
  | "studio.view" // see the studio area, its commissions and clients
  | "studio.team" // invite or remove members
  | "studio.settings"
  | "commission.work" // move pieces, log hours, send proofs and messages
  | "commission.price" // set prices, send quotes
  | "payments.manage"
  | "commission.ship";

const OWNER_ONLY: ReadonlySet<Permission> = new Set([
  "studio.team",
  "studio.settings",
  "commission.price",
  "payments.manage",
  "commission.ship",
]);

/** Pure rule: may a member with this role do this? (clients hold no studio permission) */
export function roleAllows(role: MemberRole, permission: Permission): boolean {
  if (role === "owner") return true;
  return !OWNER_ONLY.has(permission);
}

export async function loadActor(userId: string): Promise<Actor | null> {
  const [u] = await db.query.user.findMany({ where: (t, { eq: e }) => e(t.id, userId), limit: 1 });
  if (!u) return null;
  const memberships = await db
    .select({ studioId: studioMembers.studioId, role: studioMembers.role, studioSlug: studios.slug, studioName: studios.name })
    .from(studioMembers)
    .innerJoin(studios, eq(studios.id, studioMembers.studioId))
    .where(eq(studioMembers.userId, userId));
  const clientOf = await db
    .select({ studioId: studioClients.studioId, clientId: studioClients.id })
    .from(studioClients)
    .where(eq(studioClients.userId, userId));
  return { userId: u.id, email: u.email, name: u.name, memberships, clientOf };
}

/** The signed-in person for this request, or null. Reads the session fresh (no cookie cache). */
export async function getActor(requestHeaders?: Headers): Promise<Actor | null> {
  const h = requestHeaders ?? (await headers());
  const s = await getAuth().api.getSession({ headers: h, query: { disableCookieCache: true } });
  if (!s) return null;
  return loadActor(s.user.id);
}

export async function requireActor(requestHeaders?: Headers): Promise<Actor> {
  const actor = await getActor(requestHeaders);
  if (!actor) throw unauthenticated();
  return actor;
}

export function memberRole(actor: Actor, studioId: string): MemberRole | null {
  return actor.memberships.find((m) => m.studioId === studioId)?.role ?? null;
}

export function can(actor: Actor, permission: Permission, studioId: string): boolean {
  const role = memberRole(actor, studioId);
  return role !== null && roleAllows(role, permission);
}

/**
 * Throws when the actor may not act on the studio. Someone with no link to the studio gets
 * 404 (we do not confirm what exists); a member without the permission gets 403.
 */
export function assertCan(actor: Actor, permission: Permission, studioId: string): void {
  const role = memberRole(actor, studioId);
  if (role === null) throw notFound();
  if (!roleAllows(role, permission)) {
    throw forbidden(
      permission === "commission.price" || permission === "payments.manage"
        ? "Only the studio owner can change prices and payments."
        : "Only the studio owner can do that.",
    );
  }
}

/** The studio the actor works in (the first membership), or null for a client-only account. */
export function primaryStudio(actor: Actor) {
  return actor.memberships[0] ?? null;
}

/** The same person seen only as a client (the portal shows what they commissioned, nothing more). */
export function asClient(actor: Actor): Actor {
  return { ...actor, memberships: [] };
}

/** Where someone lands after signing in. */
export function homePathFor(actor: Actor): string {
  return actor.memberships.length > 0 ? "/studio" : "/portal";
}
