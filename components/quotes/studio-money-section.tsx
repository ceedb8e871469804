// Studio: the commission's quote versions, payments, documents, and the owner's money actions.
import Link from "next/link";
import { Card } from "@/components/ui/card";
import { buttonClass } from "@/components/ui/button";
import { formatMoney } from "@/lib/core/pricing/format-money";
import { can, type Actor } from "@/lib/server/authz";
import { creditNoteLabel, listCreditNotesFor } from "@/lib/server/credit-notes";
import { documentLabel, listCommissionPayments, listDocumentsFor, previewRefund } from "@/lib/server/payments";
import { getCommissionFor } from "@/lib/server/queries/commissions";
import { listQuotesFor } from "@/lib/server/quotes";
import { ActionForm } from "./action-form";
import { refundAction, requestBalanceAction } from "./money-actions";
import { QuoteVersionList } from "./quote-version-list";

const STATUS: Record<string, string> = { open: "awaiting payment", paid: "paid", failed: "declined", expired: "expired", refunded: "refunded", partially_refunded: "partly refunded" };

export async function StudioMoneySection({ actor, commissionId }: { actor: Actor; commissionId: string }) {
  const c = await getCommissionFor(actor, commissionId);
  const owner = can(actor, "payments.manage", c.studioId);
  const versions = await listQuotesFor(actor, c.id);
  const payments = await listCommissionPayments(actor, c.id);
  const docs = await listDocumentsFor(actor, c.id);
  const credits = await listCreditNotesFor(actor, c.id);
  const refund = owner && payments.some((p) => p.status === "paid" || p.status === "partially_refunded") ? await previewRefund(actor, c.id).catch(() => null) : null;
  const balanceAsked = payments.some((p) => p.kind === "balance" && p.status !== "expired");
  return (
    <Card className="mt-6">
      <h2 id="quote-and-payments" className="mb-3 text-xl">
        Quote and payments
      </h2>
      {versions.length ? <QuoteVersionList versions={versions} /> : <p className="text-bark">No quote yet.</p>}
      {can(actor, "commission.price", c.studioId) ? (
        <p className="mt-3">
          <Link href={`/studio/commissions/${c.id}/quote`} className={buttonClass("secondary")}>
            {versions.length ? "Open the quote builder" : "Build a quote"}
          </Link>
        </p>
      ) : (
        <p className="mt-3 text-bark">Only the studio owner can price quotes and take payments.</p>
      )}
      {payments.length ? (
        <table className="mt-4 w-full text-left text-sm">
          <caption className="text-left font-semibold">Payments on this commission</caption>
          <thead>
            <tr>
              <th scope="col">Kind</th>
              <th scope="col">Status</th>
              <th scope="col" className="text-right">
                Amount
              </th>
              <th scope="col" className="text-right">
                Refunded
              </th>
            </tr>
          </thead>
          <tbody>
            {payments.map((p) => (
              <tr key={p.id} className="border-t border-bark/10">
                <td>{p.kind}</td>
                <td>{STATUS[p.status]}</td>
                <td className="text-right tabular-nums">{formatMoney(p.amountMinor, p.currency)}</td>
                <td className="text-right tabular-nums">{formatMoney(p.refundedMinor, p.currency)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {docs.length ? (
        <ul className="mt-4 list-disc pl-6">
          {docs.map((d) => (
            <li key={d.id}>
              <a href={`/api/documents/${d.id}/pdf`} download>
                {d.kind === "invoice" ? "Invoice" : "Receipt"} {documentLabel(d)} (PDF)
              </a>
            </li>
          ))}
          {credits.map((n) => (
            <li key={n.id}>
              <a href={`/api/credit-notes/${n.id}/pdf`} download>
                Credit note {creditNoteLabel(n.number)} (PDF)
              </a>
            </li>
          ))}
        </ul>
      ) : null}
      {owner && c.state === "ready" && !balanceAsked ? (
        <div className="mt-4">
          <ActionForm action={requestBalanceAction} hidden={{ commissionId: c.id }} label="Send the balance invoice" name="Send the balance invoice" />
        </div>
      ) : null}
      {refund ? (
        <div className="mt-4 rounded-md border border-bark/20 p-3">
          <h3 className="text-lg">Cancellation and refund</h3>
          <p className="text-sm">
            Work has reached <strong>{refund.stage}</strong>. Under the studio&apos;s policy {formatMoney(refund.toRefund, refund.currency)} of the{" "}
            {formatMoney(refund.paidMinor, refund.currency)} held would go back to the client.
          </p>
          <ActionForm
            action={refundAction}
            hidden={{ commissionId: c.id }}
            label="Refund by the policy"
            variant="secondary"
            name="Refund by the policy"
            confirm={`Send ${formatMoney(refund.toRefund, refund.currency)} back to the client now? A refund cannot be taken back.`}
          >
            <label className="flex items-center gap-2">
              <input type="checkbox" name="cancel" /> Also cancel the commission
            </label>
          </ActionForm>
        </div>
      ) : null}
    </Card>
  );
}
