import Link from "next/link";
import { notFound } from "next/navigation";
import { PieceFeaturesForm } from "@/components/production/piece-features-form";
import { PieceLive } from "@/components/production/piece-live";
import { PiecePhotos } from "@/components/production/piece-photos";
import { PageTitle } from "@/components/ui/card";
import { localDate } from "@/lib/core/production";
import { PIECE_STAGE_LABELS } from "@/lib/core/workflow/pieces";
import { TERMINAL_STATES } from "@/lib/core/workflow/states";
import { can, memberRole } from "@/lib/server/authz";
import { requireStudioMember } from "@/lib/server/page-guards";
import { getPieceDetail } from "@/lib/server/production";
import { listPiecePhotos } from "@/lib/server/progress-photos";

export const metadata = { title: "Piece" };
export const dynamic = "force-dynamic";

export default async function PiecePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const { actor, membership } = await requireStudioMember(`/studio/pieces/${id}`);
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const detail = await getPieceDetail(actor, id).catch(() => null);
  if (!detail) notFound();
  const photos = await listPiecePhotos(actor, id);
  return (
    <>
      <p className="mb-2 text-sm">
        <Link href="/studio/board">Back to the board</Link>
      </p>
      <PageTitle title={detail.piece.name} lead={`Stage: ${PIECE_STAGE_LABELS[detail.piece.stage as keyof typeof PIECE_STAGE_LABELS]}`} />
      <PieceLive
        initial={detail}
        me={actor.userId}
        isOwner={memberRole(actor, membership.studioId) === "owner"}
        today={localDate(new Date(), "Europe/London")}
      />
      <PieceFeaturesForm
        pieceId={detail.piece.id}
        initial={detail.piece.features}
        canEdit={can(actor, "commission.work", membership.studioId) && !(TERMINAL_STATES as readonly string[]).includes(detail.piece.commissionState)}
      />
      <PiecePhotos pieceId={detail.piece.id} initial={photos} />
    </>
  );
}
