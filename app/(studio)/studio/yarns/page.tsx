import { YarnsView } from "@/components/production/yarns-view";
import { PageTitle } from "@/components/ui/card";
import { YARN_WEIGHTS } from "@/lib/core/yarn/yarn-weights";
import { can } from "@/lib/server/authz";
import { requireStudioMember } from "@/lib/server/page-guards";
import { listYarns } from "@/lib/server/yarns";

export const metadata = { title: "Yarns" };
export const dynamic = "force-dynamic";

export default async function YarnsPage() {
  const { actor, membership } = await requireStudioMember("/studio/yarns");
  const data = await listYarns(actor, membership.studioId);
  return (
    <>
      <PageTitle title="Yarns" lead="The yarns the studio knits with, stock per dye lot, and what accepted commissions have reserved." />
      <YarnsView initial={data} isOwner={can(actor, "commission.price", membership.studioId)} />
      <p className="mt-6 text-sm text-bark">Weight categories: {YARN_WEIGHTS.source}.</p>
    </>
  );
}
