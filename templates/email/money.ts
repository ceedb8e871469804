import { renderEmail } from "./layout";

export function quoteSentMessage(p: { clientName: string; studioName: string; title: string; total: string; deposit: string; validUntil: string; url: string; message: string; accentHex?: string }) {
  return renderEmail({
    subject: `Your quote from ${p.studioName}: ${p.title}`,
    heading: "Your quote is ready",
    paragraphs: [
      `Hello ${p.clientName},`,
      `${p.studioName} has priced "${p.title}" at ${p.total}. A deposit of ${p.deposit} books it; the rest is due when the piece is ready.`,
      ...(p.message ? [p.message] : []),
      `The quote is attached as a PDF and holds until ${p.validUntil}. You can accept it, or ask for changes, in your portal.`,
    ],
    action: { label: "See the quote", url: p.url },
    accentHex: p.accentHex,
  });
}

export function documentMessage(p: { kind: "invoice" | "receipt"; number: string; clientName: string; studioName: string; title: string; amount: string; url: string; payUrl?: string | null; accentHex?: string }) {
  const isInvoice = p.kind === "invoice";
  return renderEmail({
    subject: `${isInvoice ? "Invoice" : "Receipt"} ${p.number} from ${p.studioName}`,
    heading: isInvoice ? `Invoice ${p.number}` : `Thank you: receipt ${p.number}`,
    paragraphs: [
      `Hello ${p.clientName},`,
      isInvoice
        ? `The balance for "${p.title}" is ${p.amount}. The invoice is attached as a PDF.`
        : `We have received ${p.amount} for "${p.title}". The receipt is attached as a PDF.`,
      "You can download it again from your portal at any time.",
    ],
    action: isInvoice && p.payUrl ? { label: "Pay the balance", url: p.payUrl } : { label: "Open my commission", url: p.url },
    accentHex: p.accentHex,
  });
}

export function creditNoteMessage(p: { number: string; clientName: string; studioName: string; title: string; amount: string; url: string; accentHex?: string }) {
  return renderEmail({
    subject: `Credit note ${p.number} from ${p.studioName}`,
    heading: `Credit note ${p.number}`,
    paragraphs: [
      `Hello ${p.clientName},`,
      `${p.studioName} has refunded ${p.amount} for "${p.title}". The credit note is attached as a PDF; it corrects the receipt or invoice it names, tax included.`,
      "The refund goes back to the card that paid. You can download the credit note again from your portal at any time.",
    ],
    action: { label: "Open my commission", url: p.url },
    accentHex: p.accentHex,
  });
}
