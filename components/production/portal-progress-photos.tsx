// The client's view of progress photos: only those the studio shared, grouped by piece and stage,
// each through the download gate (which refuses unshared photos with a 404).
import { PhotoGrid } from "@/components/journey/photo-grid";
import { Card } from "@/components/ui/card";
import { asClient, type Actor } from "@/lib/server/authz";
import { listProgressPhotos } from "@/lib/server/progress-photos";
import { WORK_STAGE_LABELS, WORK_STAGES } from "@/lib/schemas/production";

export async function PortalProgressPhotos({ actor, commissionId }: { actor: Actor; commissionId: string }) {
  const photos = await listProgressPhotos(asClient(actor), commissionId);
  if (!photos.length) return null;
  const pieceList = [...new Map(photos.map((p) => [p.pieceId, p.pieceName])).entries()];
  return (
    <Card className="mt-6">
      <h2 className="mb-3 text-xl">Progress photos from the studio</h2>
      {pieceList.map(([pieceId, name]) => (
        <section key={pieceId} className="mb-4">
          {pieceList.length > 1 ? <h3 className="mb-2 text-lg font-semibold">{name}</h3> : null}
          {WORK_STAGES.map((s) => {
            const here = photos.filter((p) => p.pieceId === pieceId && p.stage === s).map((p) => ({ ...p, kind: "progress" }));
            if (!here.length) return null;
            return (
              <div key={s} className="mb-3">
                <p className="mb-1 font-semibold">{WORK_STAGE_LABELS[s]}</p>
                <PhotoGrid photos={here} label={`${name}: ${WORK_STAGE_LABELS[s]} photos`} />
              </div>
            );
          })}
        </section>
      ))}
    </Card>
  );
}
