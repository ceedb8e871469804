"use server";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { formAction } from "@/lib/server/action";
import { decideProposal, proposeRates } from "@/lib/server/insights";

export const proposeRatesAction = formAction(
  z.object({ studioId: z.string().uuid() }),
  async (input, actor) => {
    const p = await proposeRates(actor, input.studioId);
    revalidatePath("/studio/insights");
    return { id: p.id };
  },
  { message: "Proposal saved: accept it to use these rates in new estimates, or reject it." },
);

export const decideProposalAction = formAction(
  z.object({ studioId: z.string().uuid(), proposalId: z.string().uuid(), decision: z.enum(["accepted", "rejected"]) }),
  async (input, actor) => {
    const p = await decideProposal(actor, input.studioId, input.proposalId, input.decision);
    revalidatePath("/studio/insights");
    return { status: p.status as string };
  },
);
