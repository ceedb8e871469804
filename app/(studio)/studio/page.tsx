import { CommissionTable } from "@/components/commission/commission-table";
import { PageTitle } from "@/components/ui/card";
import { ACTIVE_STATES } from "@/lib/core/workflow/states";
import { requireStudioMember } from "@/lib/server/page-guards";
import { listCommissionsFor } from "@/lib/server/queries/commissions";

export const metadata = { title: "Studio" };

export default async function StudioHome() {
  const { actor, membership } = await requireStudioMember("/studio");
  const rows = await listCommissionsFor(actor, { studioId: membership.studioId });
  const active = rows.filter((r) => (ACTIVE_STATES as readonly string[]).includes(r.state));
  const other = rows.filter((r) => !(ACTIVE_STATES as readonly string[]).includes(r.state));
  return (
    <>
      <PageTitle
        title="Commissions"
        lead={`${active.length} open, ${other.length} paused or finished. Soonest needed first.`}
      />
      <h2 className="mb-3 text-xl">Open</h2>
      <CommissionTable rows={active} hrefFor={(id) => `/studio/commissions/${id}`} show="client" caption="Open commissions" />
      <h2 className="mb-3 mt-10 text-xl">Paused and finished</h2>
      <CommissionTable rows={other} hrefFor={(id) => `/studio/commissions/${id}`} show="client" caption="Paused and finished commissions" />
    </>
  );
}
