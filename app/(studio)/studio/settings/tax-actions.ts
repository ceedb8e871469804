"use server";
// The tax categories and seller details section of the settings page.
import { revalidatePath } from "next/cache";
import { taxSettingsFormSchema, taxSettingsFromForm } from "@/lib/schemas/tax-settings";
import { formAction } from "@/lib/server/action";
import { forbidden } from "@/lib/server/errors";
import { updateTaxSettings } from "@/lib/server/tax-settings";

export const saveTaxSettingsAction = formAction(
  taxSettingsFormSchema,
  async (v, actor) => {
    const studio = actor.memberships[0];
    if (!studio) throw forbidden();
    const { categories, defaults, seller } = taxSettingsFromForm(v);
    const { warnings } = await updateTaxSettings(actor, studio.studioId, { categories, defaults, seller });
    revalidatePath("/studio/settings");
    return { saved: true, warnings: Object.values(warnings) };
  },
  { message: "Tax categories and invoice details saved. New quotes use them; sent quotes keep theirs." },
);
