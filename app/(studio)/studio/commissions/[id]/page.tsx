import { notFound } from "next/navigation";
import { DesignSection } from "@/components/chart-editor/design-section";
import { SizingSection } from "@/components/sizing/sizing-section";
import { CommissionSummary } from "@/components/commission/commission-summary";
import { StudioJourney } from "@/components/journey/studio-journey";
import { ProductionSection } from "@/components/production/production-section";
import { StudioMoneySection } from "@/components/quotes/studio-money-section";
import { Card, PageTitle } from "@/components/ui/card";
import { minorToDecimalString } from "@/lib/core/pricing/format-money";
import { can } from "@/lib/server/authz";
import { requireStudioMember } from "@/lib/server/page-guards";
import { getCommissionFor } from "@/lib/server/queries/commissions";
import { PriceForm } from "./price-form";

export default async function StudioCommissionPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const { actor } = await requireStudioMember(`/studio/commissions/${id}`);
  const c = await getCommissionFor(actor, id).catch(() => null);
  if (!c || !can(actor, "studio.view", c.studioId)) notFound();
  const current = c.priceMinor === null ? "" : minorToDecimalString(c.priceMinor, c.currency);
  return (
    <>
      <PageTitle title={`${c.number}. ${c.title}`} lead={`For ${c.clientName}`} />
      <div className="grid gap-6 md:grid-cols-[2fr_1fr]">
        <Card>
          <h2 className="mb-3 text-xl">Brief</h2>
          <CommissionSummary c={c} />
        </Card>
        <Card>
          <h2 className="mb-3 text-xl">Price</h2>
          {can(actor, "commission.price", c.studioId) ? (
            <PriceForm commissionId={c.id} current={current} currency={c.currency} />
          ) : (
            <p className="text-bark">Only the studio owner can change the price.</p>
          )}
        </Card>
      </div>
      <SizingSection actor={actor} commissionId={c.id} />
      <DesignSection actor={actor} commissionId={c.id} studioId={c.studioId} />
      <StudioMoneySection actor={actor} commissionId={c.id} />
      <StudioJourney actor={actor} commissionId={c.id} />
      <ProductionSection actor={actor} commissionId={c.id} />
    </>
  );
}
