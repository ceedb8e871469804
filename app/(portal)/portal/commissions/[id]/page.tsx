import { notFound } from "next/navigation";
import { CommissionSummary } from "@/components/commission/commission-summary";
import { PortalJourney } from "@/components/journey/portal-journey";
import { PortalProgressPhotos } from "@/components/production/portal-progress-photos";
import { PortalShipping } from "@/components/production/portal-shipping";
import { PortalMoneySection } from "@/components/quotes/portal-money-section";
import { Card, PageTitle } from "@/components/ui/card";
import { asClient } from "@/lib/server/authz";
import { requirePageActor } from "@/lib/server/page-guards";
import { getCommissionFor } from "@/lib/server/queries/commissions";

export default async function PortalCommissionPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { id } = await params;
  const sp = await searchParams;
  // Back from the pay page: `?paid=deposit|balance` (anything else is ignored) or `?cancelled=…`.
  const returned = sp.cancelled ? "cancelled" : sp.paid === "deposit" || sp.paid === "balance" ? `paid:${sp.paid}` : undefined;
  const actor = await requirePageActor(`/portal/commissions/${id}`);
  const client = asClient(actor);
  const c = await getCommissionFor(client, id).catch(() => null);
  if (!c) notFound();
  return (
    <>
      <PageTitle title={c.title} lead={`With ${c.studioName}`} />
      <Card>
        <CommissionSummary c={c} />
      </Card>
      <PortalMoneySection actor={actor} commissionId={c.id} returned={returned} />
      <PortalJourney actor={actor} commissionId={c.id} requested={Boolean(sp.requested)} />
      <PortalProgressPhotos actor={client} commissionId={c.id} />
      <PortalShipping actor={client} commissionId={c.id} />
    </>
  );
}
