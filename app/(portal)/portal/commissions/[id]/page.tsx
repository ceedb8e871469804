import { notFound } from "next/navigation";
import { CommissionSummary, Timeline } from "@/components/commission/commission-summary";
import { Card, PageTitle } from "@/components/ui/card";
import { asClient } from "@/lib/server/authz";
import { requirePageActor } from "@/lib/server/page-guards";
import { getCommissionFor, getCommissionTimeline } from "@/lib/server/queries/commissions";

export default async function PortalCommissionPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageActor(`/portal/commissions/${id}`);
  const client = asClient(actor);
  const c = await getCommissionFor(client, id).catch(() => null);
  if (!c) notFound();
  const events = await getCommissionTimeline(client, id);
  return (
    <>
      <PageTitle title={c.title} lead={`With ${c.studioName}`} />
      <Card>
        <CommissionSummary c={c} />
      </Card>
      <Card className="mt-6">
        <h2 className="mb-3 text-xl">Timeline</h2>
        <Timeline events={events.filter((e) => e.toState !== "quoting")} />
      </Card>
    </>
  );
}
