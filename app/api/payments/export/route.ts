import { minorToDecimalString } from "@/lib/core/pricing/format-money";
import { paymentFiltersSchema } from "@/lib/schemas/payments";
import { forbidden } from "@/lib/server/errors";
import { listPaymentsFor } from "@/lib/server/payments";
import { route } from "@/lib/server/route";

// Quote a CSV cell, and keep a spreadsheet from reading a leading = + - @ as a formula.
const cell = (v: string) => {
  const safe = /^[=+\-@]/.test(v) ? `'${v}` : v;
  return /[",\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
};

/** Owner: the filtered payments as CSV (amounts in major units, as text, never floats). */
export const GET = route({ query: paymentFiltersSchema }, async ({ actor, query }) => {
  const studio = actor.memberships[0];
  if (!studio) throw forbidden();
  const rows = await listPaymentsFor(actor, studio.studioId, query);
  const head = ["created", "paid", "commission", "client", "kind", "status", "currency", "amount", "refunded"];
  const lines = rows.map((r) =>
    [
      r.createdAt.toISOString(),
      r.paidAt?.toISOString() ?? "",
      `${r.commissionNumber}. ${r.commissionTitle}`,
      r.clientName,
      r.kind,
      r.status,
      r.currency,
      minorToDecimalString(r.amountMinor, r.currency),
      minorToDecimalString(r.refundedMinor, r.currency),
    ]
      .map(cell)
      .join(","),
  );
  return new Response([head.join(","), ...lines].join("\r\n") + "\r\n", {
    headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="payments-${new Date().toISOString().slice(0, 10)}.csv"`, "cache-control": "private, no-store" },
  });
});
