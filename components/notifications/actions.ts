"use server";
// Server actions of the notification pages (studio and portal): mark all read, e-mail settings.
// Each acts on the signed-in person's own rows only (lib/server/notifications.ts scopes every query).
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { audienceSchema, notificationSettingsFormSchema } from "@/lib/schemas/notifications";
import { formAction } from "@/lib/server/action";
import { notFound } from "@/lib/server/errors";
import { markAllNotificationsRead, saveNotificationSettings } from "@/lib/server/notifications";

export const markAllReadAction = formAction(z.object({ audience: audienceSchema }), async ({ audience }, actor) => {
  if (audience === "studio" && actor.memberships.length === 0) throw notFound();
  const marked = await markAllNotificationsRead(actor, audience);
  revalidatePath(audience === "studio" ? "/studio" : "/portal", "layout");
  return { marked };
});

export const saveNotificationSettingsAction = formAction(
  z.record(z.string().max(64), z.string().max(16)),
  async (raw, actor) => {
    const audience = audienceSchema.parse(raw.audience);
    if (audience === "studio" && actor.memberships.length === 0) throw notFound();
    await saveNotificationSettings(actor, audience, notificationSettingsFormSchema(audience).parse(raw));
    return { saved: true };
  },
  { message: "Saved. In-app notifications always appear; e-mails follow these choices." },
);
