"use server";
// Server actions for quotes and payments on the commission pages (studio and portal).
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { checkoutFormSchema, commissionIdFormSchema, refundFormSchema } from "@/lib/schemas/payments";
import { acceptQuoteSchema, requestQuoteChangesSchema } from "@/lib/schemas/quotes";
import { formAction } from "@/lib/server/action";
import { asClient } from "@/lib/server/authz";
import { formatMoney } from "@/lib/core/pricing/format-money";
import { refundByPolicy, requestBalance, startCheckout } from "@/lib/server/payments";
import { acceptQuote, getQuoteFor, requestQuoteChanges } from "@/lib/server/quotes";

export const acceptQuoteAction = formAction(
  acceptQuoteSchema,
  async (input, actor) => {
    const r = await acceptQuote(actor, input);
    // Open the payment page now if the provider answers; if not, the pay button tries again.
    await startCheckout(asClient(actor), r.quote.commissionId, "deposit").catch(() => undefined);
    revalidatePath(`/portal/commissions/${r.quote.commissionId}`);
    return { quoteId: r.quote.id };
  },
  { message: "Quote accepted. Thank you! Pay the deposit to book your place." },
);

export const requestChangesAction = formAction(
  requestQuoteChangesSchema,
  async (input, actor) => {
    const v = await getQuoteFor(actor, input.quoteId);
    await requestQuoteChanges(actor, input);
    revalidatePath(`/portal/commissions/${v.commissionId}`);
    return { quoteId: v.id };
  },
  { message: "Your note has gone to the studio; they will send a new version." },
);

export const payAction = formAction(checkoutFormSchema, async (input, actor) => {
  const { url } = await startCheckout(asClient(actor), input.commissionId, input.kind);
  redirect(url);
});

export const requestBalanceAction = formAction(
  commissionIdFormSchema,
  async (input, actor) => {
    const r = await requestBalance(actor, input.commissionId);
    revalidatePath(`/studio/commissions/${input.commissionId}`);
    return r;
  },
  { message: "The invoice for the balance has been sent to the client." },
);

export const refundAction = formAction(refundFormSchema, async (input, actor) => {
  const r = await refundByPolicy(actor, input.commissionId, { cancel: input.cancel === "on", reason: input.reason || undefined });
  revalidatePath(`/studio/commissions/${input.commissionId}`);
  const sent = r.refunds.reduce((a, b) => a + b.amountMinor, 0);
  return { refundedMinor: sent, text: sent ? `Refunded ${formatMoney(sent, r.currency)} under the cancellation policy.` : "Nothing more is due back under the policy." };
});
