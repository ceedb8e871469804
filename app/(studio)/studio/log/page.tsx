import { PageTitle } from "@/components/ui/card";
import { LogView } from "@/components/production/log-view";
import { notFound } from "next/navigation";
import { can } from "@/lib/server/authz";
import { requireStudioMember } from "@/lib/server/page-guards";
import { getLogView } from "@/lib/server/production";

export const metadata = { title: "Log hours" };
export const dynamic = "force-dynamic";

export default async function LogPage() {
  const { actor, membership } = await requireStudioMember("/studio/log");
  if (!can(actor, "commission.work", membership.studioId)) notFound();
  const data = await getLogView(actor, membership.studioId);
  return (
    <>
      <PageTitle title="Log hours" lead="One tap to start, pause or stop. The timer lives on the server, so another device sees it too." />
      <LogView initial={data} />
    </>
  );
}
