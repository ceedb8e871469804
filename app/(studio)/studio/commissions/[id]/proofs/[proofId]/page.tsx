import { notFound } from "next/navigation";
import { ProofPage } from "@/components/journey/proof-page";
import { requireStudioMember } from "@/lib/server/page-guards";
import { getProofView } from "@/lib/server/proofs";

export const metadata = { title: "Proof" };

export default async function StudioProofPage({ params }: { params: Promise<{ id: string; proofId: string }> }) {
  const { id, proofId } = await params;
  const { actor } = await requireStudioMember(`/studio/commissions/${id}/proofs/${proofId}`);
  const view = await getProofView({ ...actor, clientOf: [] }, id, proofId).catch(() => null);
  if (!view) notFound();
  return <ProofPage view={view} mode="studio" base={`/studio/commissions/${id}`} />;
}
