"use server";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { priceFormSchema } from "@/lib/schemas/money";
import { formAction } from "@/lib/server/action";
import { getCommissionFor, setCommissionPrice } from "@/lib/server/queries/commissions";
import { AppError, fieldErrorsOf } from "@/lib/server/errors";

export const setPriceAction = formAction(
  z.object({ commissionId: z.string().uuid(), price: z.string() }),
  async (input, actor) => {
    const commission = await getCommissionFor(actor, input.commissionId);
    const parsed = priceFormSchema(commission.currency).safeParse(input);
    if (!parsed.success) throw new AppError(422, "invalid_input", "Check the price.", fieldErrorsOf(parsed.error));
    const updated = await setCommissionPrice(actor, commission.id, parsed.data.price);
    revalidatePath(`/studio/commissions/${commission.id}`);
    return { priceMinor: updated.priceMinor };
  },
  { message: "Price saved." },
);
