"use server";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { RATE_KEYS, type LabourRates } from "@/lib/core/labour/default-rates";
import { settingsFormSchema } from "@/lib/schemas/settings-form";
import { formAction } from "@/lib/server/action";
import { assertCan } from "@/lib/server/authz";
import { AppError, fieldErrorsOf, forbidden } from "@/lib/server/errors";
import { loadStudioSettings, updateStudioSettings } from "@/lib/server/settings";
import { db } from "@/db";
import { studios } from "@/db/schema";
import { eq } from "drizzle-orm";

export const saveSettingsAction = formAction(
  z.record(z.string(), z.string()),
  async (raw, actor) => {
    const studio = actor.memberships[0];
    if (!studio) throw forbidden();
    assertCan(actor, "studio.settings", studio.studioId);
    const [s] = await db.select({ currency: studios.currency }).from(studios).where(eq(studios.id, studio.studioId));
    const parsed = settingsFormSchema(s.currency).safeParse(raw);
    if (!parsed.success) throw new AppError(422, "invalid_input", "Some fields need attention.", fieldErrorsOf(parsed.error));
    const v = parsed.data;
    const current = await loadStudioSettings(studio.studioId);
    const rates = { ...current.rates } as LabourRates;
    for (const k of RATE_KEYS) rates[k] = v[`rate_${k}`];
    await updateStudioSettings(actor, studio.studioId, {
      hourlyRateMinor: v.hourlyRate,
      pricePolicy: v.pricePolicy,
      taxRatePercent: v.taxRatePercent,
      pricesIncludeTax: v.pricesIncludeTax === "yes",
      depositPercent: v.depositPercent,
      designFeeMinor: v.designFee,
      quoteValidDays: v.quoteValidDays,
      depositRefundBeforeKnittingPercent: v.depositRefundBeforeKnittingPercent,
      rates,
    });
    revalidatePath("/studio/settings");
    return { saved: true };
  },
  { message: "Settings saved. New quotes use them; sent quotes keep the rates they were made with." },
);
