import "server-only";
import { eq } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { studios } from "@/db/schema";
import { readStudioSettings, studioSettingsSchema, type StudioSettings } from "@/lib/schemas/settings";
import { assertCan, type Actor } from "./authz";
import { notFound } from "./errors";

/** Settings for server code that has already checked who is asking. */
export async function loadStudioSettings(studioId: string, q: Executor = db): Promise<StudioSettings> {
  const [row] = await q.select({ settings: studios.settings }).from(studios).where(eq(studios.id, studioId));
  if (!row) throw notFound("That studio");
  return readStudioSettings(row.settings);
}

/** Owner only: replace settings (validated; unknown keys dropped). */
export async function updateStudioSettings(actor: Actor, studioId: string, patch: Partial<StudioSettings>, q: Executor = db): Promise<StudioSettings> {
  assertCan(actor, "studio.settings", studioId);
  const current = await loadStudioSettings(studioId, q);
  const next = studioSettingsSchema.parse({ ...current, ...patch });
  await q.update(studios).set({ settings: next }).where(eq(studios.id, studioId));
  return next;
}
