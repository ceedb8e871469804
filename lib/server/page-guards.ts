import "server-only";
import { notFound, redirect } from "next/navigation";
import { getActor, type Actor } from "./authz";

/** For pages: the signed-in person, or a trip to sign-in that comes back to `here`. */
export async function requirePageActor(here: string): Promise<Actor> {
  const actor = await getActor();
  if (!actor) redirect(`/sign-in?next=${encodeURIComponent(here)}`);
  return actor;
}

/** For studio pages: a member of a studio (clients get a 404, not a hint). */
export async function requireStudioMember(here: string) {
  const actor = await requirePageActor(here);
  const membership = actor.memberships[0];
  if (!membership) notFound();
  return { actor, membership };
}
