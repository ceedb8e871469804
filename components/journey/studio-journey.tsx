// The commission journey on the studio's commission page: life cycle, proofs, photos and messages.
import { LifecycleTimeline } from "@/components/commission/lifecycle-timeline";
import { MovePanel } from "@/components/commission/move-panel";
import { Card } from "@/components/ui/card";
import { can, type Actor } from "@/lib/server/authz";
import { getCommissionFor } from "@/lib/server/queries/commissions";
import { getAvailableMoves, getLifecycleTimeline } from "@/lib/server/queries/lifecycle";
import { getProofSource, listProofs } from "@/lib/server/proofs";
import { unreadCount } from "@/lib/server/messages";
import { listCommissionUploads } from "@/lib/server/queries/uploads";
import { MessageThread } from "./message-thread";
import { PhotoGrid } from "./photo-grid";
import { ProofList } from "./proof-list";
import { SendProofForm } from "./send-proof-form";

export async function StudioJourney({ actor, commissionId, timeZone }: { actor: Actor; commissionId: string; timeZone?: string }) {
  const [c, moves, timeline, proofs, unread, photos, source] = await Promise.all([
    getCommissionFor(actor, commissionId),
    getAvailableMoves(actor, commissionId),
    getLifecycleTimeline(actor, commissionId, false),
    listProofs(actor, commissionId),
    unreadCount(actor, commissionId),
    listCommissionUploads(actor, commissionId),
    getProofSource(actor, commissionId),
  ]);
  const base = `/studio/commissions/${commissionId}`;
  return (
    <>
      <Card className="mt-6">
        <h2 className="mb-3 text-xl">Proofs</h2>
        <ProofList proofs={proofs} base={base} />
        <div className="mt-4">
          {!source ? (
            <p className="text-bark">There is no saved design for this commission yet; a proof is sent from the design&rsquo;s newest version.</p>
          ) : c.state !== "designing" ? (
            <p className="text-bark">
              The next proof will be sent from {source.title}, version {source.versionNumber}, once the commission is at &ldquo;Designing&rdquo;.
            </p>
          ) : can(actor, "commission.price", c.studioId) ? (
            <>
              <p className="mb-2">
                Proof {proofs.length + 1} will freeze {source.title}, version {source.versionNumber} ({source.charts} chart{source.charts === 1 ? "" : "s"}).
              </p>
              <SendProofForm commissionId={commissionId} nextNumber={proofs.length + 1} />
            </>
          ) : (
            <p className="text-bark">Only the studio owner sends proofs; the design is ready at version {source.versionNumber}.</p>
          )}
        </div>
      </Card>
      <div className="mt-6 grid gap-6 md:grid-cols-[2fr_1fr]">
        <Card>
          <h2 id="messages" className="mb-3 scroll-mt-6 text-xl">
            Messages{unread ? ` (${unread} unread)` : ""}
          </h2>
          <MessageThread commissionId={commissionId} as="studio" />
        </Card>
        <Card>
          <h2 className="mb-3 text-xl">Photos</h2>
          <PhotoGrid photos={photos.filter((p) => p.kind !== "message")} label="Reference and progress photos" />
        </Card>
      </div>
      <div className="mt-6 grid gap-6 md:grid-cols-[2fr_1fr]">
        <Card>
          <h2 className="mb-3 text-xl">Timeline</h2>
          <LifecycleTimeline entries={timeline} timeZone={timeZone} />
        </Card>
        <Card>
          <h2 className="mb-3 text-xl">Next steps</h2>
          <MovePanel commissionId={commissionId} moves={moves} as="studio" />
        </Card>
      </div>
    </>
  );
}
