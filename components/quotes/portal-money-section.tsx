// Portal: the current quote (with accept / ask for changes), the payments due and the documents.
import { Card } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";
import { formatMoney } from "@/lib/core/pricing/format-money";
import { labourLevelNote } from "@/lib/core/pricing/labour-level";
import { asClient, type Actor } from "@/lib/server/authz";
import { creditNoteLabel, listCreditNotesFor } from "@/lib/server/credit-notes";
import { documentLabel, listCommissionPayments, listDocumentsFor } from "@/lib/server/payments";
import { listQuotesFor, quoteOf, todayIso } from "@/lib/server/quotes";
import { ActionForm } from "./action-form";
import { AwaitPayment } from "./await-payment";
import { payAction } from "./money-actions";
import { QuoteAnswerForms } from "./quote-answer-forms";
import { QuoteLines } from "./quote-lines";

const PAID = new Set(["paid", "partially_refunded", "refunded"]);

export async function PortalMoneySection({ actor, commissionId, returned }: { actor: Actor; commissionId: string; returned?: string }) {
  const client = asClient(actor);
  const versions = await listQuotesFor(client, commissionId, { asClient: true });
  const payments = await listCommissionPayments(client, commissionId);
  const docs = await listDocumentsFor(client, commissionId);
  const credits = await listCreditNotesFor(client, commissionId);
  const current = versions[0];
  if (!current && !payments.length) return null;
  const q = current ? quoteOf(current) : null;
  const expired = current?.status === "sent" && !!current.validUntil && current.validUntil < todayIso();
  const latestOf = (kind: "deposit" | "balance") => [...payments].reverse().find((p) => p.kind === kind);
  const dues = (["deposit", "balance"] as const).map((k) => ({ kind: k, p: latestOf(k) })).filter((x) => x.p);
  return (
    <>
      {current && q ? (
        <Card className="mt-6">
          <h2 id="quote" className="mb-3 text-xl">
            Quote (version {current.number})
          </h2>
          {current.status === "sent" && !expired ? <p className="mb-3">Valid until {current.validUntil}.</p> : null}
          {expired ? <Notice tone="caution" title="This quote has expired">It was valid until {current.validUntil}. Ask the studio for a fresh one.</Notice> : null}
          {current.status === "accepted" ? (
            <Notice tone="success" title="You accepted this quote">
              Accepted by {current.acceptedName} on {current.acceptedAt?.toISOString().slice(0, 10)}.
            </Notice>
          ) : null}
          {current.status === "changes_requested" ? <Notice tone="info" title="You asked for changes">The studio will send a new version.</Notice> : null}
          {current.messageToClient ? <p className="my-3 whitespace-pre-line">{current.messageToClient}</p> : null}
          <QuoteLines quote={q} caption={`Quote for this commission, in ${q.currency}`} />
          {labourLevelNote(q) ? (
            <p className="mt-2 text-sm text-bark" data-testid="quote-labour-level">
              {labourLevelNote(q)}
            </p>
          ) : null}
          <p className="mt-3">
            <a href={`/api/quotes/${current.id}/pdf`} download>
              Download the quote (PDF)
            </a>
          </p>
          {current.status === "sent" && !expired ? <QuoteAnswerForms quoteId={current.id} deposit={formatMoney(q.depositMinor, q.currency)} /> : null}
        </Card>
      ) : null}
      {dues.length || docs.length ? (
        <Card className="mt-6">
          <h2 id="payments" className="mb-3 text-xl">
            Payments
          </h2>
          {returned ? (
            <Notice tone="info">
              {returned === "cancelled" ? "The payment was not made. You can try again whenever you like." : "Thank you. Your payment shows here as soon as the payment service confirms it."}
            </Notice>
          ) : null}
          <ul className="my-3 flex flex-col gap-3">
            {dues.map(({ kind, p }) => (
              <li key={kind} className="flex flex-wrap items-center gap-4">
                <span>
                  {kind === "deposit" ? "Deposit" : "Balance"}: {formatMoney(p!.amountMinor, p!.currency)} —{" "}
                  <strong>{PAID.has(p!.status) ? `paid${p!.refundedMinor ? `, ${formatMoney(p!.refundedMinor, p!.currency)} refunded` : ""}` : p!.status === "failed" ? "not paid (the card was declined)" : "due"}</strong>
                </span>
                {/* Back from paying this one: wait for the confirmation instead of offering to pay again. */}
                {!PAID.has(p!.status) && returned === `paid:${kind}` ? <AwaitPayment commissionId={commissionId} kind={kind} /> : null}
                {!PAID.has(p!.status) && returned !== `paid:${kind}` ? (
                  <ActionForm action={payAction} hidden={{ commissionId, kind }} label={kind === "deposit" ? "Pay the deposit" : "Pay the balance"} name={`Pay the ${kind}`} />
                ) : null}
              </li>
            ))}
          </ul>
          {docs.length ? (
            <>
              <h3 className="mt-4 text-lg">Invoices and receipts</h3>
              <ul className="mt-2 list-disc pl-6">
                {docs.map((d) => (
                  <li key={d.id}>
                    <a href={`/api/documents/${d.id}/pdf`} download>
                      {d.kind === "invoice" ? "Invoice" : "Receipt"} {documentLabel(d)} (PDF)
                    </a>{" "}
                    — {formatMoney(d.totalMinor, d.currency)}, {d.issuedAt.toISOString().slice(0, 10)}
                  </li>
                ))}
                {credits.map((n) => (
                  <li key={n.id}>
                    <a href={`/api/credit-notes/${n.id}/pdf`} download>
                      Credit note {creditNoteLabel(n.number)} (PDF)
                    </a>{" "}
                    — {formatMoney(n.totalMinor, n.currency)}, {n.issuedAt.toISOString().slice(0, 10)}
                  </li>
                ))}
              </ul>
            </>
          ) : null}
        </Card>
      ) : null}
    </>
  );
}
