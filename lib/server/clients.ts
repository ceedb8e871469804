import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { studioClients, studios } from "@/db/schema";
import type { Actor } from "./authz";
import { notFound } from "./errors";
import { studioSlugSchema } from "@/lib/schemas/common";

export async function getStudioBySlug(slug: string) {
  // A value that cannot be a slug names no studio (and never reaches the database).
  if (!studioSlugSchema.safeParse(slug).success) return null;
  const [studio] = await db.select().from(studios).where(eq(studios.slug, slug));
  return studio ?? null;
}

/** Makes the signed-in person a client of the studio (idempotent). */
export async function joinStudioAsClient(actor: Actor, slug: string) {
  const studio = await getStudioBySlug(slug);
  if (!studio) throw notFound("That studio");
  const [row] = await db
    .insert(studioClients)
    .values({ studioId: studio.id, userId: actor.userId, displayName: actor.name })
    .onConflictDoUpdate({ target: [studioClients.studioId, studioClients.userId], set: { userId: actor.userId } })
    .returning({ id: studioClients.id });
  return { studio, clientId: row.id };
}
