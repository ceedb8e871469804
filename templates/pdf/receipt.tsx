// A receipt is the invoice document with what was received (see invoice.tsx).
import { InvoiceDocument, type InvoiceDocProps } from "./invoice";

export function ReceiptDocument(p: Omit<InvoiceDocProps, "kind">) {
  return <InvoiceDocument {...p} kind="receipt" />;
}
