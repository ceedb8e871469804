import Link from "next/link";
import { CommissionTable } from "@/components/commission/commission-table";
import { PageTitle } from "@/components/ui/card";
import { asClient } from "@/lib/server/authz";
import { requirePageActor } from "@/lib/server/page-guards";
import { listCommissionsFor } from "@/lib/server/queries/commissions";

export const metadata = { title: "My commissions" };

export default async function PortalHome() {
  const actor = await requirePageActor("/portal");
  // Only what this person asked for as a client (a member's studio work lives in /studio).
  const rows = await listCommissionsFor(asClient(actor));
  return (
    <>
      <PageTitle title="My commissions" lead={`Hello ${actor.name}. Here is everything you have asked your studios to knit.`} />
      <CommissionTable rows={rows} hrefFor={(id) => `/portal/commissions/${id}`} show="studio" caption="My commissions" />
      {rows.length === 0 ? (
        <p className="mt-4">
          Find a studio’s page to request a commission, for example <Link href="/studios/hollin-knitworks">Hollin Knitworks</Link>.
        </p>
      ) : null}
    </>
  );
}
