import "server-only";
// Documents attached to queued mail, rendered by the outbox worker when it sends (after the
// transaction that queued the mail has committed). A failure here is a failed attempt, retried.
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { creditNotes, invoices, quoteVersions } from "@/db/schema";
import { renderDocumentPdf } from "./payments";
import { renderQuotePdf } from "./quotes";

export async function renderMailAttachment(key: string): Promise<Buffer> {
  const at = key.indexOf(":");
  const kind = key.slice(0, at);
  const id = key.slice(at + 1);
  if (kind === "quote") {
    const [v] = await db.select().from(quoteVersions).where(eq(quoteVersions.id, id));
    if (!v) throw new Error(`the quote version ${id} for this mail no longer exists`);
    return renderQuotePdf(v);
  }
  if (kind === "document") {
    const [doc] = await db.select().from(invoices).where(eq(invoices.id, id));
    if (!doc) throw new Error(`the document ${id} for this mail no longer exists`);
    return renderDocumentPdf(doc);
  }
  if (kind === "credit-note") {
    const { renderCreditNotePdf } = await import("./credit-notes");
    const [cn] = await db.select().from(creditNotes).where(eq(creditNotes.id, id));
    if (!cn) throw new Error(`the credit note ${id} for this mail no longer exists`);
    return renderCreditNotePdf(cn);
  }
  throw new Error(`unknown attachment to render: ${kind}`);
}
