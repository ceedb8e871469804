import { notFound } from "next/navigation";
import { ProofPage } from "@/components/journey/proof-page";
import { asClient } from "@/lib/server/authz";
import { requirePageActor } from "@/lib/server/page-guards";
import { getProofView } from "@/lib/server/proofs";

export const metadata = { title: "Proof" };

export default async function PortalProofPage({ params }: { params: Promise<{ id: string; proofId: string }> }) {
  const { id, proofId } = await params;
  const actor = await requirePageActor(`/portal/commissions/${id}/proofs/${proofId}`);
  const view = await getProofView(asClient(actor), id, proofId).catch(() => null);
  if (!view) notFound();
  return <ProofPage view={view} mode="client" base={`/portal/commissions/${id}`} />;
}
