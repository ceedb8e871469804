// The production part of the studio's commission page: pieces with estimate vs logged, shipping,
// closing (which records labour history) and the care card.
import Link from "next/link";
import { Card } from "@/components/ui/card";
import { formatMinutes } from "@/lib/core/production";
import { PIECE_STAGE_LABELS } from "@/lib/core/workflow/pieces";
import { WORK_STAGES } from "@/lib/schemas/production";
import { can, type Actor } from "@/lib/server/authz";
import { getCommissionPieces } from "@/lib/server/production";
import { getShipments } from "@/lib/server/shipping";
import { getCommissionFor } from "@/lib/server/queries/commissions";
import { CloseForm, ShipForm } from "./production-forms";

const SHOWN = new Set(["proof_approved", "in_production", "ready", "balance_paid", "shipped", "delivered", "closed", "paused"]);

export async function ProductionSection({ actor, commissionId }: { actor: Actor; commissionId: string }) {
  const c = await getCommissionFor(actor, commissionId);
  if (!SHOWN.has(c.state)) return null;
  const [list, shipped] = await Promise.all([getCommissionPieces(actor, c.id), getShipments(actor, c.id)]);
  const owner = can(actor, "commission.ship", c.studioId);
  return (
    <Card className="mt-6">
      <h2 className="mb-3 text-xl">Production</h2>
      {list.length === 0 ? (
        <p className="text-bark">
          No pieces yet. <Link href="/studio/board">Set them up on the board</Link> when production starts.
        </p>
      ) : (
        <ul className="mb-4 flex flex-col gap-2">
          {list.map((p) => {
            const p50 = WORK_STAGES.reduce((s, st) => s + (p.estimate[st]?.p50 ?? 0), 0);
            const p80 = WORK_STAGES.reduce((s, st) => s + (p.estimate[st]?.p80 ?? 0), 0);
            const logged = Object.values(p.logged).reduce((s, m) => s + m, 0);
            return (
              <li key={p.id}>
                <Link href={`/studio/pieces/${p.id}`} className="font-semibold">
                  {p.name}
                </Link>{" "}
                · {PIECE_STAGE_LABELS[p.stage]} · logged {formatMinutes(logged)} of {formatMinutes(p50)} (P80 {formatMinutes(p80)})
                {logged > p80 ? <span className="ml-1 font-semibold text-madder-dark">▲ over P80</span> : null}
              </li>
            );
          })}
        </ul>
      )}
      {shipped.map((s) => (
        <p key={s.id} className="mb-2">
          Shipped with {s.carrier}, tracking {s.tracking}, on {s.shippedAt.toLocaleDateString("en-GB")}.
        </p>
      ))}
      {c.state === "balance_paid" ? (
        owner ? (
          <ShipForm commissionId={c.id} />
        ) : (
          <p className="text-bark">Only the studio owner can mark a commission shipped.</p>
        )
      ) : null}
      {c.state === "delivered" && owner ? <CloseForm commissionId={c.id} /> : null}
      <p className="mt-3">
        <a href={`/api/commissions/${c.id}/care-card`}>Download the care card (PDF)</a>
      </p>
    </Card>
  );
}
