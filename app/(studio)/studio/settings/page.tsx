import { notFound } from "next/navigation";
import { eq } from "drizzle-orm";
import { PageTitle } from "@/components/ui/card";
import { db } from "@/db";
import { studios } from "@/db/schema";
import { rateSources, RATE_KEYS } from "@/lib/core/labour/default-rates";
import { minorToDecimalString } from "@/lib/core/pricing/format-money";
import { can } from "@/lib/server/authz";
import { requireStudioMember } from "@/lib/server/page-guards";
import { loadStudioSettings } from "@/lib/server/settings";
import { SettingsForm } from "./settings-form";
import { TaxSettingsForm } from "./tax-form";
import { getTaxSettings } from "@/lib/server/tax-settings";
import { NotificationSettingsForm } from "@/components/notifications/forms";
import { getNotificationSettings } from "@/lib/server/notifications";

export const metadata = { title: "Settings" };

export default async function SettingsPage() {
  const { actor, membership } = await requireStudioMember("/studio/settings");
  if (!can(actor, "studio.settings", membership.studioId)) notFound();
  const settings = await loadStudioSettings(membership.studioId);
  const [s] = await db.select({ currency: studios.currency }).from(studios).where(eq(studios.id, membership.studioId));
  const values: Record<string, string> = {
    hourlyRate: minorToDecimalString(settings.hourlyRateMinor, s.currency),
    pricePolicy: settings.pricePolicy,
    taxRatePercent: String(settings.taxRatePercent),
    pricesIncludeTax: settings.pricesIncludeTax ? "yes" : "no",
    depositPercent: String(settings.depositPercent),
    designFee: minorToDecimalString(settings.designFeeMinor, s.currency),
    quoteValidDays: String(settings.quoteValidDays),
    depositRefundBeforeKnittingPercent: String(settings.depositRefundBeforeKnittingPercent),
  };
  for (const k of RATE_KEYS) values[`rate_${k}`] = String(settings.rates[k]);
  const rates = RATE_KEYS.map((k) => ({ key: k, basis: rateSources[k].basis, note: rateSources[k].note }));
  return (
    <>
      <PageTitle title="Studio settings" lead="Your rates, tax and deposit. Quotes already sent keep the figures they were made with." />
      <SettingsForm currency={s.currency} defaults={values} rates={rates} />
      <TaxSettingsForm defaults={taxFormValues(await getTaxSettings(actor, membership.studioId))} />
      <section id="notifications" aria-labelledby="notifications-heading" className="mt-10">
        <h2 id="notifications-heading" className="mb-3 text-xl">Notifications by e-mail</h2>
        <NotificationSettingsForm audience="studio" kinds={await getNotificationSettings(actor, "studio")} />
      </section>
    </>
  );
}

function taxFormValues(t: Awaited<ReturnType<typeof getTaxSettings>>): Record<string, string> {
  const cat = (id: string) => t.categories.find((c) => c.id === id);
  return {
    standardLabel: cat("standard")?.label ?? "Standard rate",
    // The studio's tax rate is the standard rate (the Prices form above edits it too).
    standardRate: String(t.standardRatePercent),
    reducedLabel: cat("reduced")?.label ?? "",
    reducedRate: cat("reduced") ? String(cat("reduced")!.ratePercent) : "",
    zeroLabel: cat("zero")?.label ?? "",
    exemptLabel: cat("exempt")?.label ?? "",
    ...Object.fromEntries(Object.entries(t.defaults).map(([k, v]) => [`default_${k}`, v])),
    legalName: t.seller.legalName,
    address: t.seller.address,
    taxNumber: t.seller.taxNumber,
  };
}
