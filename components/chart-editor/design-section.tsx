// The commission page's Design card: open the commission's design, or start one.
import Link from "next/link";
import { Card } from "@/components/ui/card";
import { buttonClass } from "@/components/ui/button";
import { can, type Actor } from "@/lib/server/authz";
import { getCommissionDesign } from "@/lib/server/designs";

export async function DesignSection({ actor, commissionId, studioId }: { actor: Actor; commissionId: string; studioId: string }) {
  const design = await getCommissionDesign(actor, commissionId);
  return (
    <Card className="mt-6">
      <h2 className="mb-3 text-xl">Design</h2>
      {design ? (
        <p className="flex flex-wrap items-center gap-3">
          <span>
            {design.title}
            {design.headNumber ? ` · version ${design.headNumber}` : ""}
            {design.lockedVersionId ? " · approved (locked)" : ""}
          </span>
          <Link className={buttonClass("secondary")} href={`/studio/designs/${design.id}`}>
            Open the design
          </Link>
        </p>
      ) : can(actor, "commission.work", studioId) ? (
        <p className="flex flex-wrap items-center gap-3">
          <span>No design yet.</span>
          <Link className={buttonClass("secondary")} href={`/studio/designs/new?commission=${commissionId}`}>
            Start the design
          </Link>
        </p>
      ) : (
        <p>No design yet.</p>
      )}
    </Card>
  );
}
