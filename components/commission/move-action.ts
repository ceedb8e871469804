"use server";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { MOVES } from "@/lib/core/workflow";
import { safeText } from "@/lib/schemas/common";
import { formAction } from "@/lib/server/action";
import { asClient } from "@/lib/server/authz";
import { moveCommission } from "@/lib/server/workflow";

const schema = z.object({
  commissionId: z.string().uuid(),
  move: z.enum(MOVES),
  as: z.enum(["studio", "client"]),
  reason: safeText(500, "Keep the reason to 500 characters.").optional(),
});

/** One button of the life-cycle panel: the machine and moveCommission decide; a refusal comes back as a message. */
export const moveCommissionAction = formAction(schema, async (input, actor) => {
  const mover = input.as === "client" ? asClient(actor) : actor;
  const r = await moveCommission(mover, input.commissionId, input.move, { reason: input.reason || undefined });
  revalidatePath(`/studio/commissions/${input.commissionId}`);
  revalidatePath(`/portal/commissions/${input.commissionId}`);
  return { to: r.to };
});
