import { paymentFiltersSchema } from "@/lib/schemas/payments";
import { forbidden } from "@/lib/server/errors";
import { listPaymentsFor } from "@/lib/server/payments";
import { route } from "@/lib/server/route";

/** Owner: the studio's payments, filtered by status and date (the table's react-query source). */
export const GET = route({ query: paymentFiltersSchema }, async ({ actor, query }) => {
  const studio = actor.memberships[0];
  if (!studio) throw forbidden();
  return { payments: await listPaymentsFor(actor, studio.studioId, query) };
});
