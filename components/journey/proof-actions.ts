"use server";
import { revalidatePath } from "next/cache";
import { headers } from "next/headers";
import { approveProofSchema, requestChangesSchema, sendProofSchema } from "@/lib/schemas/proofs";
import { formAction } from "@/lib/server/action";
import { asClient } from "@/lib/server/authz";
import { approveProof, requestProofChanges, sendProof } from "@/lib/server/proofs";

function refresh(commissionId: string) {
  revalidatePath(`/studio/commissions/${commissionId}`, "layout");
  revalidatePath(`/portal/commissions/${commissionId}`, "layout");
}

export const sendProofAction = formAction(
  sendProofSchema,
  async (input, actor) => {
    const p = await sendProof(actor, input.commissionId, input.note);
    refresh(input.commissionId);
    return { id: p.id, number: p.number };
  },
  { message: "Proof sent; the client has been e-mailed." },
);

export const approveProofAction = formAction(
  approveProofSchema,
  async (input, actor) => {
    const p = await approveProof(asClient(actor), input.proofId, input.contentHash, await headers());
    refresh(p.commissionId);
    return { id: p.id };
  },
  { message: "Thank you: the proof is approved and the studio has been told." },
);

export const requestChangesAction = formAction(
  requestChangesSchema,
  async (input, actor) => {
    const r = await requestProofChanges(asClient(actor), input.proofId, input, await headers());
    revalidatePath("/portal", "layout");
    revalidatePath("/studio", "layout");
    return r;
  },
  { message: "Your changes are sent; the studio will answer with a new proof." },
);
