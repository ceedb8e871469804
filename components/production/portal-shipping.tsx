// The client's view of shipping: carrier and tracking once sent, and the care card.
import { Card } from "@/components/ui/card";
import type { Actor } from "@/lib/server/authz";
import { getCommissionFor } from "@/lib/server/queries/commissions";
import { getShipments } from "@/lib/server/shipping";

const SHOWN = new Set(["ready", "balance_paid", "shipped", "delivered", "closed"]);

export async function PortalShipping({ actor, commissionId }: { actor: Actor; commissionId: string }) {
  const c = await getCommissionFor(actor, commissionId);
  if (!SHOWN.has(c.state)) return null;
  const shipped = await getShipments(actor, c.id);
  return (
    <Card className="mt-6">
      <h2 className="mb-3 text-xl">Delivery and care</h2>
      {shipped.length === 0 ? <p className="text-bark">Your piece is finished; the studio will tell you when it is sent.</p> : null}
      {shipped.map((s) => (
        <p key={s.id}>
          Sent with {s.carrier} on {s.shippedAt.toLocaleDateString("en-GB")}; tracking number {s.tracking}.
        </p>
      ))}
      <p className="mt-2">
        <a href={`/api/commissions/${c.id}/care-card`}>Download the care card (PDF)</a>: washing, drying and re-blocking your piece.
      </p>
    </Card>
  );
}
