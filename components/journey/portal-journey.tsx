// The commission journey in the client's portal: what they can do now, proofs, photos, messages, timeline.
import { LifecycleTimeline } from "@/components/commission/lifecycle-timeline";
import { MovePanel } from "@/components/commission/move-panel";
import { Providers } from "@/components/providers";
import { Card } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";
import { asClient, type Actor } from "@/lib/server/authz";
import { getAvailableMoves, getLifecycleTimeline } from "@/lib/server/queries/lifecycle";
import { listProofs } from "@/lib/server/proofs";
import { buttonClass } from "@/components/ui/button";
import Link from "next/link";
import { unreadCount } from "@/lib/server/messages";
import { listCommissionUploads } from "@/lib/server/queries/uploads";
import { MessageThread } from "./message-thread";
import { PhotoGrid } from "./photo-grid";
import { ProofList } from "./proof-list";

export async function PortalJourney({ actor, commissionId, requested = false }: { actor: Actor; commissionId: string; requested?: boolean }) {
  const client = asClient(actor);
  const [moves, timeline, proofs, unread, photos] = await Promise.all([
    getAvailableMoves(client, commissionId),
    getLifecycleTimeline(client, commissionId, true),
    listProofs(client, commissionId),
    unreadCount(client, commissionId),
    listCommissionUploads(client, commissionId),
  ]);
  const base = `/portal/commissions/${commissionId}`;
  const open = proofs.find((p) => p.status === "sent");
  return (
    <>
      {requested ? (
        <div className="mt-6">
          <Notice tone="success" title="Your request is sent">
            The studio has it and will reply with a quote. We have sent you a confirmation by e-mail; you can write to the studio below at any time.
          </Notice>
        </div>
      ) : null}
      <Card className="mt-6">
        <h2 className="mb-3 text-xl">Proofs</h2>
        {open ? (
          <p className="mb-3">
            <Link className={buttonClass()} href={`${base}/proofs/${open.id}`}>
              Check proof {open.number}
            </Link>
          </p>
        ) : null}
        <ProofList proofs={proofs} base={base} />
      </Card>
      <div className="mt-6 grid gap-6 md:grid-cols-[2fr_1fr]">
        <Card>
          <h2 id="messages" className="mb-3 scroll-mt-6 text-xl">
            Messages{unread ? ` (${unread} unread)` : ""}
          </h2>
          <Providers><MessageThread commissionId={commissionId} as="client" /></Providers>
        </Card>
        <Card>
          <h2 className="mb-3 text-xl">Photos</h2>
          <PhotoGrid photos={photos.filter((p) => p.kind === "reference")} label="Reference photos" />
        </Card>
      </div>
      <div className="mt-6 grid gap-6 md:grid-cols-[2fr_1fr]">
        <Card>
          <h2 className="mb-3 text-xl">Timeline</h2>
          <LifecycleTimeline entries={timeline} />
        </Card>
        <Card>
          <h2 className="mb-3 text-xl">What you can do</h2>
          <MovePanel commissionId={commissionId} moves={moves} as="client" />
        </Card>
      </div>
    </>
  );
}
