"use server";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { shipSchema } from "@/lib/schemas/production";
import { formAction } from "@/lib/server/action";
import { closeCommission } from "@/lib/server/production";
import { shipCommission } from "@/lib/server/shipping";

export const shipAction = formAction(
  shipSchema,
  async (input, actor) => {
    await shipCommission(actor, input);
    revalidatePath(`/studio/commissions/${input.commissionId}`);
    return { ok: true };
  },
  { message: "Marked shipped; the client has been told by e-mail." },
);

export const closeAction = formAction(
  z.object({ commissionId: z.string().uuid() }),
  async (input, actor) => {
    const r = await closeCommission(actor, input.commissionId);
    revalidatePath(`/studio/commissions/${input.commissionId}`);
    return { historyRows: r.historyRows };
  },
  { message: "Closed; its logged hours now feed the rate calibration." },
);
