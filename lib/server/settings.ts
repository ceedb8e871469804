import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { studios } from "@/db/schema";
import { readStudioSettings, studioSettingsSchema, type StudioSettings } from "@/lib/schemas/settings";
import { assertCan, type Actor } from "./authz";
import { notFound } from "./errors";

/** Settings for server code that has already checked who is asking. */
export async function loadStudioSettings(studioId: string): Promise<StudioSettings> {
  const [row] = await db.select({ settings: studios.settings }).from(studios).where(eq(studios.id, studioId));
  if (!row) throw notFound("That studio");
  return readStudioSettings(row.settings);
}

/** Owner only: replace settings (validated; unknown keys dropped). */
export async function updateStudioSettings(actor: Actor, studioId: string, patch: Partial<StudioSettings>): Promise<StudioSettings> {
  assertCan(actor, "studio.settings", studioId);
  const current = await loadStudioSettings(studioId);
  const next = studioSettingsSchema.parse({ ...current, ...patch });
  await db.update(studios).set({ settings: next }).where(eq(studios.id, studioId));
  return next;
}
